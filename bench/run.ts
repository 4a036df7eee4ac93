/**
 * `npm run bench`: what the full request chain costs. autocannon sends the same JSON body (one peaking
 * filter) to (A) a bare node:http echo, (B) a bare Express 5 echo, (E) bare Express 5 doing the same
 * calculation as POST /v1/biquads (its JSON parser, the same pure function, res.json), (F) E on the
 * service's HTTP server (api/http/server.ts) and (C) POST /v1/biquads through the whole service, each
 * server in its own process. They take turns, round after round, so that a change in what else runs on
 * the machine hits all alike. The chain's target is against E (C and E do the same calculation, so C/E
 * is what the chain costs); C/B is printed beside it, and C/F, what the chain alone costs once both run
 * on the service's server. Each ratio is the median of the rounds' ratios.
 * Prints req/s, p50 and p99; then (D) the p99 of /v1/biquads on C while eight heavy requests run; then
 * runs the measurement-analysis benchmark when present, and writes bench/results/latest.json.
 *
 * BENCH_ROUNDS (default 5) and BENCH_ROUND_S (seconds per target per round, default 4) set the length.
 * The targets run built (tsc, as `npm start` runs the service); BENCH_FROM_SOURCE=1 runs them through tsx.
 */
import { fork, type ChildProcess } from 'node:child_process';
import { runCaptureBench } from './capture.bench';
import { prepareTargets, type TargetLauncher } from './targets-build';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { SweepSpec } from '../shared/capture/sweep';
import { heaviestFitBody, heavyPlanBody, longImpulseResponse, roomRecording, wav24 } from './fixtures';
import type {
  CpuMessage,
  LoopDelayMessage,
  ReadyMessage,
  StoppedMessage,
  TargetMessage,
} from './targets/protocol';

// autocannon ships no types; these are the parts of its result used here.
interface AutocannonResult {
  requests: { average: number; total: number };
  errors: number;
  timeouts: number;
  non2xx: number;
}
interface AutocannonInstance extends Promise<AutocannonResult> {
  on(event: 'response', listener: (client: unknown, status: number, bytes: number, ms: number) => void): void;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (options: object) => AutocannonInstance;

const CONNECTIONS = 32;
const WARMUP_S = 3;
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 5);
const ROUND_S = Number(process.env.BENCH_ROUND_S ?? 4);
/**
 * Issue targets: the full chain at ≥ 0.6 × the req/s of bare Express doing the same calculation (E) and a
 * p99 ≤ 1.5 × its p99, same run.
 */
const TARGETS = { ratio: 0.6, p99Ratio: 1.5 };

const BODY = JSON.stringify({
  sampleRateHz: 48000,
  filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
});

interface Scenario {
  key: 'A' | 'B' | 'E' | 'F' | 'C';
  name: string;
  script: string;
  path: string;
  /** Environment for the target's process. */
  env?: Record<string, string>;
}

const SCENARIOS: Scenario[] = [
  { key: 'A', name: 'node:http JSON echo', script: 'node-echo.ts', path: '/echo' },
  { key: 'B', name: 'Express 5 JSON echo', script: 'express-echo.ts', path: '/echo' },
  {
    key: 'E',
    name: 'Express 5 doing the same calculation (designFilterSet), no chain',
    script: 'express-calc.ts',
    path: '/v1/biquads',
  },
  {
    // How much of C's lead over E is the service's server (requests and answers of one shape) rather
    // than the chain: E on that same server.
    key: 'F',
    name: "Express 5 doing the same calculation, no chain, on the service's HTTP server (api/http/server.ts)",
    script: 'express-calc.ts',
    path: '/v1/biquads',
    env: { BENCH_SERVICE_SERVER: '1' },
  },
  {
    key: 'C',
    name: 'POST /v1/biquads, full chain (key, rate limit, metering, validation)',
    script: 'full-chain.ts',
    path: '/v1/biquads',
  },
];

export interface ScenarioResult {
  key: string;
  name: string;
  /** Median over the rounds of autocannon's average req/s. */
  requestsPerSecond: number;
  requestsPerSecondByRound: number[];
  /** Percentiles of every measured response's latency (all rounds), in milliseconds. */
  p50Ms: number;
  p99Ms: number;
  completed: number;
  /**
   * CPU time the server process spent per completed request. On a shared machine this is steadier than
   * req/s, which also depends on what else runs.
   */
  serverCpuUsPerRequest: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  /** Full chain only: calls the usage meter wrote, against every response autocannon completed. */
  meteredCalls?: number;
  completedIncludingWarmup?: number;
}

interface Target {
  scenario: Scenario;
  child: ChildProcess;
  ready: ReadyMessage;
  latencies: number[];
  rounds: AutocannonResult[];
  cpuMs: number;
  warmupCompleted: number;
}

function nextMessage<T extends TargetMessage>(child: ChildProcess, type: T['type']): Promise<T> {
  return new Promise((resolve, reject) => {
    const onExit = (code: number | null) => reject(new Error(`target exited with ${code} before "${type}"`));
    const onMessage = (message: TargetMessage) => {
      if (message.type !== type) return;
      child.off('message', onMessage);
      child.off('exit', onExit);
      resolve(message as T);
    };
    child.on('message', onMessage);
    child.once('exit', onExit);
  });
}

const median = (values: number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
};

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function load(target: Target, seconds: number, latencies: number[] | null): Promise<AutocannonResult> {
  const instance = autocannon({
    url: `http://127.0.0.1:${target.ready.port}${target.scenario.path}`,
    method: 'POST',
    headers: { 'content-type': 'application/json', ...target.ready.headers },
    body: BODY,
    connections: CONNECTIONS,
    duration: seconds,
  });
  if (latencies) instance.on('response', (_client, _status, _bytes, ms) => latencies.push(ms));
  return instance;
}

async function start(scenario: Scenario, launcher: TargetLauncher): Promise<Target> {
  // BENCH_CPU_PROF_DIR: V8 CPU profiles of the full chain's threads (event loop and workers), written there on exit.
  const profileDir = process.env.BENCH_CPU_PROF_DIR;
  const child = fork(launcher.file(scenario.script), [], {
    execArgv: [
      ...launcher.execArgv,
      ...(profileDir && scenario.key === 'C' ? ['--cpu-prof', '--cpu-prof-dir', profileDir] : []),
    ],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
    env: { ...process.env, ...scenario.env },
  });
  const ready = await nextMessage<ReadyMessage>(child, 'ready');
  return { scenario, child, ready, latencies: [], rounds: [], cpuMs: 0, warmupCompleted: 0 };
}

async function measureRound(target: Target): Promise<void> {
  target.child.send('mark');
  const result = await load(target, ROUND_S, target.latencies);
  const cpu = nextMessage<CpuMessage>(target.child, 'cpu');
  target.child.send('report');
  target.cpuMs += (await cpu).cpuMs;
  target.rounds.push(result);
}

async function finish(target: Target): Promise<ScenarioResult> {
  const stopped = nextMessage<StoppedMessage>(target.child, 'stopped');
  target.child.send('stop');
  const { meteredCalls } = await stopped;
  const latencies = target.latencies.sort((a, b) => a - b);
  const sum = (pick: (r: AutocannonResult) => number) =>
    target.rounds.reduce((total, r) => total + pick(r), 0);
  const completed = sum((r) => r.requests.total);
  const perRound = target.rounds.map((r) => r.requests.average);
  return {
    key: target.scenario.key,
    name: target.scenario.name,
    requestsPerSecond: median(perRound),
    requestsPerSecondByRound: perRound,
    p50Ms: percentile(latencies, 50),
    p99Ms: percentile(latencies, 99),
    completed,
    serverCpuUsPerRequest: (target.cpuMs * 1000) / completed,
    errors: sum((r) => r.errors),
    timeouts: sum((r) => r.timeouts),
    non2xx: sum((r) => r.non2xx),
    ...(meteredCalls !== undefined && {
      meteredCalls,
      completedIncludingWarmup: completed + target.warmupCompleted,
    }),
  };
}

/**
 * (D) Cheap requests beside heavy ones: autocannon sends /v1/biquads at a steady rate well below what the
 * chain can serve (so the p99 measures waiting behind heavy work rather than a saturated server), first
 * with nothing else running, then while eight clients each keep one heavy request of a kind in flight
 * (posting the next as soon as the last is answered): the costliest EQ fit, a plan with five such fits,
 * the analysis of the longest impulse response (30 s at 192 kHz) and of the longest sweep recording
 * (a 28 s sweep at 192 kHz, 29.5 s). The server reports its event loop's delay for each window.
 */
const HEAVY_CLIENTS = 8;
const HEAVY_S = Number(process.env.BENCH_HEAVY_S ?? 10);
const HEAVY_PROBE = { connections: 8, overallRate: 400 };
const HEAVY_TARGET_P99_MS = 50;

interface HeavyRequest {
  key: string;
  name: string;
  path: string;
  /** A fresh body per request (a FormData is consumed by sending it). */
  body: () => string | FormData;
}

/** The heavy requests, built once (the WAV files take a few seconds to make). */
function heavyRequests(): HeavyRequest[] {
  const json = (value: object) => {
    const text = JSON.stringify(value);
    return () => text;
  };
  const upload = (bytes: Uint8Array, name: string, fields: Record<string, number>) => {
    const blob = new Blob([bytes], { type: 'audio/wav' });
    return () => {
      const form = new FormData();
      for (const [field, value] of Object.entries(fields)) form.append(field, String(value));
      form.append('file', blob, name);
      return form;
    };
  };
  const sweep192: SweepSpec = {
    sampleRateHz: 192000,
    startHz: 20,
    endHz: 40000,
    durationS: 28,
    fadeInS: 0.05,
    fadeOutS: 0.01,
    levelDbfs: -12,
    silenceAfterS: 0,
  };
  return [
    {
      key: 'eqFit',
      name: 'POST /v1/eq/fit, 16 bands, 1024 points, boosts to 24 dB, cuts to 48 dB',
      path: '/v1/eq/fit',
      body: json(heaviestFitBody()),
    },
    {
      key: 'plan',
      name: 'POST /v1/plans, 5.1 with that fit on each of the five mains',
      path: '/v1/plans',
      body: json(heavyPlanBody()),
    },
    {
      key: 'impulseResponse',
      name: 'POST /v1/analysis/impulse-response, 30 s at 192 kHz, 24-bit (17.3 MB)',
      path: '/v1/analysis/impulse-response',
      body: upload(wav24(longImpulseResponse(), 192000), 'ir.wav', {}),
    },
    {
      key: 'sweep',
      name: 'POST /v1/analysis/sweep, 28 s sweep at 192 kHz, 29.5 s recording, 24-bit (17 MB)',
      path: '/v1/analysis/sweep',
      body: upload(wav24(roomRecording(sweep192, 1.5), 192000), 'sweep.wav', {
        durationS: sweep192.durationS,
        startHz: sweep192.startHz,
        endHz: sweep192.endHz,
      }),
    },
  ];
}

export interface LoadWindowResult {
  /** `idle`, or the heavy request's key. */
  key: string;
  heavyRequest: string | null;
  heavyCompleted: number;
  heavyStatuses: Record<string, number>;
  probe: string;
  probeCompleted: number;
  probeP50Ms: number;
  probeP99Ms: number;
  probeMaxMs: number;
  probeNon2xx: number;
  /** The server's event loop over the window (delay percentiles in ms, utilisation 0–1). */
  eventLoop: Omit<LoopDelayMessage, 'type'>;
}

async function loadWindow(target: Target, heavy: HeavyRequest | null): Promise<LoadWindowResult> {
  const base = `http://127.0.0.1:${target.ready.port}`;
  const statuses: Record<string, number> = {};
  let completed = 0;
  let started = 0;
  // Ends the window: requests still in flight are abandoned, which drops their tasks on the server.
  const stop = new AbortController();
  const client = async () => {
    while (heavy && !stop.signal.aborted) {
      started += 1;
      let status: string;
      try {
        const body = heavy.body();
        const res = await fetch(`${base}${heavy.path}`, {
          signal: stop.signal,
          method: 'POST',
          headers: {
            ...(typeof body === 'string' && { 'content-type': 'application/json' }),
            ...target.ready.headers,
          },
          body,
        });
        await res.arrayBuffer();
        status = String(res.status);
      } catch (err) {
        if (stop.signal.aborted) break;
        // A connection the server closed meanwhile (a keep-alive timeout firing late on a blocked loop).
        status = (err as { cause?: { code?: string } }).cause?.code ?? 'error';
      }
      statuses[status] = (statuses[status] ?? 0) + 1;
      completed += 1;
    }
  };
  const clients = heavy ? Array.from({ length: HEAVY_CLIENTS }, client) : [];
  // Let all eight reach the server before measuring.
  while (heavy && started < HEAVY_CLIENTS) await new Promise((resolve) => setTimeout(resolve, 10));
  await new Promise((resolve) => setTimeout(resolve, 500));
  target.child.send('loop-mark');
  const latencies: number[] = [];
  const instance = autocannon({
    url: `${base}/v1/biquads`,
    method: 'POST',
    headers: { 'content-type': 'application/json', ...target.ready.headers },
    body: BODY,
    connections: HEAVY_PROBE.connections,
    overallRate: HEAVY_PROBE.overallRate,
    duration: HEAVY_S,
  });
  instance.on('response', (_client, _status, _bytes, ms) => latencies.push(ms));
  const probe = await instance;
  const loop = nextMessage<LoopDelayMessage>(target.child, 'loop');
  target.child.send('loop-report');
  const { type: _type, ...eventLoop } = await loop;
  stop.abort();
  await Promise.all(clients);
  // Let the server see the closed connections and free its threads before the next window.
  await new Promise((resolve) => setTimeout(resolve, 1000));
  latencies.sort((a, b) => a - b);
  // No answer within the window (the event loop held by heavy work) counts as the whole window.
  const orWindow = (value: number) => (latencies.length ? value : HEAVY_S * 1000);
  return {
    key: heavy?.key ?? 'idle',
    heavyRequest: heavy?.name ?? null,
    heavyCompleted: completed,
    heavyStatuses: statuses,
    probe: `POST /v1/biquads, ${HEAVY_PROBE.connections} connections at ${HEAVY_PROBE.overallRate} req/s for ${HEAVY_S} s`,
    probeCompleted: probe.requests.total,
    probeP50Ms: orWindow(percentile(latencies, 50)),
    probeP99Ms: orWindow(percentile(latencies, 99)),
    probeMaxMs: orWindow(latencies[latencies.length - 1]),
    probeNon2xx: probe.non2xx,
    eventLoop,
  };
}

/** The idle window, then one window per kind of heavy request, on the full chain. */
async function heavyLoad(target: Target): Promise<LoadWindowResult[]> {
  const requests = heavyRequests();
  const only = process.env.BENCH_HEAVY_ONLY?.split(',');
  const windows: LoadWindowResult[] = [];
  for (const heavy of [null, ...requests.filter((r) => !only || only.includes(r.key))]) {
    process.stdout.write(
      heavy
        ? `  heavy load: ${HEAVY_CLIENTS} × ${heavy.key} in flight for ${HEAVY_S} s\n`
        : `  idle: /v1/biquads alone for ${HEAVY_S} s\n`,
    );
    windows.push(await loadWindow(target, heavy));
  }
  return windows;
}

/** The measurements helper's benchmark, when its file is there (it exports `runAnalysisBench`). */
async function runAnalysis(): Promise<unknown[] | null> {
  const file = path.join(__dirname, 'analysis.bench.ts');
  if (!existsSync(file)) return null;
  const module = (await import(file)) as {
    runAnalysisBench?: () => Promise<unknown[]>;
    default?: () => Promise<unknown[]>;
  };
  const run = module.runAnalysisBench ?? module.default;
  return run ? run() : null;
}

const ms = (value: number) => `${value.toFixed(2)} ms`;
/** What the target servers ran from (the build or the sources), for the report. */
let targetsFrom = '';

async function main(): Promise<void> {
  console.log(
    `Isochron benchmark: ${CONNECTIONS} connections; ${WARMUP_S} s warm-up, then ${ROUNDS} rounds of ${ROUND_S} s ` +
      `per target in turn; Node ${process.version}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}, ` +
      `load average ${os.loadavg()[0].toFixed(2)}\n`,
  );
  const targets: Target[] = [];
  try {
    const launcher = prepareTargets();
    targetsFrom = launcher.from;
    console.log(`Targets run from ${launcher.from}.\n`);
    for (const scenario of SCENARIOS) targets.push(await start(scenario, launcher));
    for (const target of targets)
      target.warmupCompleted = (await load(target, WARMUP_S, null)).requests.total;
    const ratios: number[] = [];
    const echoRatios: number[] = [];
    const serverRatios: number[] = [];
    const byKey = (key: Scenario['key']) => targets.find((t) => t.scenario.key === key) as Target;
    const [echo, calculation, onServer, chain] = [byKey('B'), byKey('E'), byKey('F'), byKey('C')];
    const rps = (target: Target, round: number) => target.rounds[round].requests.average;
    for (let round = 0; round < ROUNDS; round += 1) {
      // Each round's own p99 too (its latencies are the last ones recorded), to show how much it varies.
      const p99s = new Map<Target, number>();
      for (const target of targets) {
        const from = target.latencies.length;
        await measureRound(target);
        p99s.set(
          target,
          percentile(
            target.latencies.slice(from).sort((a, b) => a - b),
            99,
          ),
        );
      }
      ratios.push(rps(chain, round) / rps(calculation, round));
      echoRatios.push(rps(chain, round) / rps(echo, round));
      serverRatios.push(rps(chain, round) / rps(onServer, round));
      const p99Ratio = (p99s.get(chain) as number) / (p99s.get(calculation) as number);
      process.stdout.write(
        `  round ${round + 1}/${ROUNDS}: C/E ${ratios[round].toFixed(2)}, C/B ${echoRatios[round].toFixed(2)}, ` +
          `C p99 ${p99Ratio.toFixed(2)} × E's\n`,
      );
    }
    const heavy = await heavyLoad(chain);
    const results: ScenarioResult[] = [];
    for (const target of targets) results.push(await finish(target));
    await report(
      results,
      {
        ratio: median(ratios),
        ratios,
        echoRatio: median(echoRatios),
        echoRatios,
        serverRatio: median(serverRatios),
        serverRatios,
      },
      heavy,
    );
  } finally {
    for (const { child } of targets) if (child.exitCode === null && child.connected) child.kill();
  }
}

interface Ratios {
  /** C/E: the full chain against bare Express doing the same calculation (the target's ratio). */
  ratio: number;
  ratios: number[];
  /** C/B: the full chain against bare Express echoing the body (no calculation). */
  echoRatio: number;
  echoRatios: number[];
  /** C/F: the full chain against bare Express on the service's HTTP server (what the chain alone costs). */
  serverRatio: number;
  serverRatios: number[];
}

async function report(results: ScenarioResult[], ratioSet: Ratios, heavy: LoadWindowResult[]): Promise<void> {
  const { ratio, ratios, echoRatio, echoRatios, serverRatio, serverRatios } = ratioSet;
  console.log('');
  for (const result of results) {
    console.log(
      `(${result.key}) ${result.name}\n    ${result.requestsPerSecond.toFixed(0)} req/s (median of rounds), ` +
        `p50 ${ms(result.p50Ms)}, p99 ${ms(result.p99Ms)}, server CPU ${result.serverCpuUsPerRequest.toFixed(0)} ` +
        `µs/request, errors ${result.errors}, timeouts ${result.timeouts}, non-2xx ${result.non2xx}`,
    );
    if (result.meteredCalls !== undefined) {
      console.log(
        `    usage meter wrote ${result.meteredCalls} calls; autocannon completed ${result.completedIncludingWarmup} ` +
          `(it drops up to ${CONNECTIONS} in flight at each stop)`,
      );
    }
  }
  const pick = (key: Scenario['key']) => results.find((r) => r.key === key) as ScenarioResult;
  const [echo, express, onServer, chain] = [pick('B'), pick('E'), pick('F'), pick('C')];
  const cpuRatio = express.serverCpuUsPerRequest / chain.serverCpuUsPerRequest;
  const failures = chain.errors + chain.timeouts + chain.non2xx;
  const p99Ratio = chain.p99Ms / express.p99Ms;
  const checks = {
    ratioAtLeast: { target: TARGETS.ratio, value: ratio, passed: ratio >= TARGETS.ratio },
    p99RatioAtMost: { target: TARGETS.p99Ratio, value: p99Ratio, passed: p99Ratio <= TARGETS.p99Ratio },
    zeroErrors: { target: 0, value: failures, passed: failures === 0 },
    ...Object.fromEntries(
      heavy
        .filter((w) => w.key !== 'idle')
        .map((w) => [
          `p99WithHeavy_${w.key}_AtMostMs`,
          {
            target: HEAVY_TARGET_P99_MS,
            value: w.probeP99Ms,
            passed: w.probeCompleted > 0 && w.probeP99Ms <= HEAVY_TARGET_P99_MS && w.probeNon2xx === 0,
          },
        ]),
    ),
  };
  console.log(
    `\n(D) ${heavy[0].probe}, alone and while ${HEAVY_CLIENTS} clients keep a heavy request each in flight:`,
  );
  for (const w of heavy) {
    console.log(
      `  ${w.key.padEnd(16)} p50 ${ms(w.probeP50Ms)}, p99 ${ms(w.probeP99Ms)}, max ${ms(w.probeMaxMs)}, ` +
        `${w.probeCompleted} answered${w.probeCompleted === 0 ? ` (none within ${HEAVY_S} s: figures are the window)` : ''}, ` +
        `non-2xx ${w.probeNon2xx}; event loop delay p99 ${ms(w.eventLoop.p99Ms)}, max ${ms(w.eventLoop.maxMs)}, ` +
        `utilisation ${(w.eventLoop.utilization * 100).toFixed(0)} %` +
        (w.heavyRequest
          ? `\n  ${''.padEnd(16)} heavy: ${w.heavyRequest}: ${JSON.stringify(w.heavyStatuses)}`
          : ''),
    );
  }
  console.log(
    `\nC/E = ${ratio.toFixed(2)} (median of rounds; target ≥ ${TARGETS.ratio}); C p99 ${ms(chain.p99Ms)} = ` +
      `${p99Ratio.toFixed(2)} × E's (target ≤ ${TARGETS.p99Ratio}); by server CPU per request E/C = ${cpuRatio.toFixed(2)}; ` +
      `(D) p99 with heavy work ${heavy
        .filter((w) => w.key !== 'idle')
        .map((w) => `${w.key} ${ms(w.probeP99Ms)}`)
        .join(', ')} (target ≤ ${HEAVY_TARGET_P99_MS} ms)\n` +
      `Against the echo (no calculation): C/B = ${echoRatio.toFixed(2)}, C p99 = ${(chain.p99Ms / echo.p99Ms).toFixed(2)} × B's\n` +
      `Against E on the service's server (F; the chain's own cost): C/F = ${serverRatio.toFixed(2)}, ` +
      `C p99 = ${(chain.p99Ms / onServer.p99Ms).toFixed(2)} × F's, by server CPU F/C = ` +
      `${(onServer.serverCpuUsPerRequest / chain.serverCpuUsPerRequest).toFixed(2)}`,
  );
  for (const [name, check] of Object.entries(checks)) {
    console.log(`  ${check.passed ? 'ok  ' : 'MISS'} ${name}`);
  }

  console.log('\nMeasurement analysis:');
  const analysis = await runAnalysis();
  if (analysis === null) console.log('  (bench/analysis.bench.ts not present)');
  else for (const entry of analysis) console.log(`  ${JSON.stringify(entry)}`);

  console.log('\nCapture (sweep analysis, test signals):');
  const capture = await runCaptureBench();
  for (const entry of capture) console.log(`  ${JSON.stringify(entry)}`);

  const document = {
    measuredAt: new Date().toISOString(),
    node: process.version,
    cpus: os.cpus().length,
    cpuModel: os.cpus()[0]?.model ?? null,
    loadAverageAtEnd: os.loadavg(),
    connections: CONNECTIONS,
    warmupSeconds: WARMUP_S,
    rounds: ROUNDS,
    secondsPerRound: ROUND_S,
    requestBody: JSON.parse(BODY),
    targetsFrom,
    results,
    ratioChainToExpress: ratio,
    ratioChainToExpressByRound: ratios,
    cpuRatioExpressToChain: cpuRatio,
    p99RatioChainToExpress: p99Ratio,
    ratioChainToExpressEcho: echoRatio,
    ratioChainToExpressEchoByRound: echoRatios,
    p99RatioChainToExpressEcho: chain.p99Ms / echo.p99Ms,
    ratioChainToExpressOnServiceServer: serverRatio,
    ratioChainToExpressOnServiceServerByRound: serverRatios,
    p99RatioChainToExpressOnServiceServer: chain.p99Ms / onServer.p99Ms,
    heavyLoad: heavy,
    checks,
    analysis,
    capture,
  };
  const dir = path.join(__dirname, 'results');
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, 'latest.json'), JSON.stringify(document, null, 2) + '\n');
  console.log('\nWritten to bench/results/latest.json');
  if (!Object.values(checks).every((c) => c.passed)) process.exitCode = 1;
}

main().catch((err: unknown) => {
  console.error(err);
  process.exitCode = 1;
});
