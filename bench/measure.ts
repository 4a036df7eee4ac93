/**
 * One way to time a calculation for the benchmarks of `bench/` (`analysis.bench.ts`, `capture.bench.ts`):
 * a first run (cold: code not yet compiled, caches empty), warm-up runs, then `runs` timed runs, wall
 * clock and the process's CPU time (user + system, steadier than wall time on a shared machine).
 */
export interface BenchResult {
  name: string;
  targetMs: number | null;
  runs: number;
  /** Wall-clock times of the timed runs. */
  medianMs: number;
  p95Ms: number;
  minMs: number;
  /** Median CPU time of the process per run. */
  medianCpuMs: number;
  /** The first run, before any warm-up. */
  firstMs: number;
  /** True when the median is under the target (null target: informational). */
  passed: boolean | null;
}

export function measure(
  name: string,
  targetMs: number | null,
  runs: number,
  fn: () => unknown,
  warmupRuns = 2,
): BenchResult {
  const first = performance.now();
  fn();
  const firstMs = performance.now() - first;
  for (let i = 0; i < warmupRuns; i++) fn();
  const times: number[] = [];
  const cpuTimes: number[] = [];
  for (let i = 0; i < runs; i++) {
    const cpu = process.cpuUsage();
    const start = performance.now();
    fn();
    times.push(performance.now() - start);
    const used = process.cpuUsage(cpu);
    cpuTimes.push((used.user + used.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpuTimes.sort((a, b) => a - b);
  const medianMs = times[Math.floor(runs / 2)];
  return {
    name,
    targetMs,
    runs,
    medianMs,
    p95Ms: times[Math.min(runs - 1, Math.ceil(runs * 0.95) - 1)],
    minMs: times[0],
    medianCpuMs: cpuTimes[Math.floor(runs / 2)],
    firstMs,
    passed: targetMs === null ? null : medianMs < targetMs,
  };
}

/** One line per result, as the benchmarks print them when run alone. */
export function printResults(results: readonly BenchResult[]): void {
  for (const r of results) {
    const verdict = r.passed === null ? 'info' : r.passed ? 'ok' : 'SLOW';
    const target = r.targetMs === null ? '' : ` (target < ${r.targetMs} ms)`;
    console.log(
      `${verdict.padEnd(4)} ${r.name}: median ${r.medianMs.toFixed(1)} ms (CPU ${r.medianCpuMs.toFixed(1)} ms), ` +
        `p95 ${r.p95Ms.toFixed(1)} ms, min ${r.minMs.toFixed(1)} ms, first ${r.firstMs.toFixed(1)} ms over ${r.runs} runs${target}`,
    );
  }
}
