import { monitorEventLoopDelay, performance } from 'node:perf_hooks';

/** Messages between `bench/run.ts` and a target server running in its own process. */
export interface ReadyMessage {
  type: 'ready';
  port: number;
  /** Headers every request must carry (the full chain's API key). */
  headers: Record<string, string>;
}

/** Answer to `report`: CPU time (user + system) the server used since the last `mark`, in milliseconds. */
export interface CpuMessage {
  type: 'cpu';
  cpuMs: number;
  /** Monotonic clock (the one V8's CPU profiles use), microseconds, at `mark` and at `report`. */
  fromUs: number;
  toUs: number;
}

/** Answer to `loop-report`: the event loop's delay since the last `loop-mark`, in milliseconds. */
export interface LoopDelayMessage {
  type: 'loop';
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
  /** Share of the window the event loop's thread spent running (not waiting for I/O), 0–1. */
  utilization: number;
}

export interface StoppedMessage {
  type: 'stopped';
  /** Calls the usage meter wrote to the database (full chain only). */
  meteredCalls?: number;
}

export type TargetMessage = ReadyMessage | CpuMessage | LoopDelayMessage | StoppedMessage;

/**
 * Tells the parent where to send load; on `mark` starts counting CPU time, on `report` answers it; on
 * `loop-mark` starts recording the event loop's delay (perf_hooks.monitorEventLoopDelay, 1 ms
 * resolution) and utilisation, on `loop-report` answers them; on `stop` shuts down cleanly.
 */
export function serveUntilStopped(
  port: number,
  headers: Record<string, string>,
  stop: () => Promise<Omit<StoppedMessage, 'type'>>,
): void {
  const send = (message: TargetMessage) => process.send?.(message);
  const monotonicUs = () => Number(process.hrtime.bigint() / 1000n);
  let mark = process.cpuUsage();
  let markedUs = monotonicUs();
  const loopDelay = monitorEventLoopDelay({ resolution: 1 });
  let loopMark = performance.eventLoopUtilization();
  process.on('message', (message) => {
    if (message === 'loop-mark') {
      loopDelay.reset();
      loopDelay.enable();
      loopMark = performance.eventLoopUtilization();
    } else if (message === 'loop-report') {
      loopDelay.disable();
      const ms = (ns: number) => ns / 1e6;
      send({
        type: 'loop',
        p50Ms: ms(loopDelay.percentile(50)),
        p99Ms: ms(loopDelay.percentile(99)),
        maxMs: ms(loopDelay.max),
        utilization: performance.eventLoopUtilization(loopMark).utilization,
      });
    } else if (message === 'mark') {
      mark = process.cpuUsage();
      markedUs = monotonicUs();
    } else if (message === 'report') {
      const used = process.cpuUsage(mark);
      send({ type: 'cpu', cpuMs: (used.user + used.system) / 1000, fromUs: markedUs, toUs: monotonicUs() });
    } else if (message === 'stop') {
      stop().then(
        (report) => {
          send({ type: 'stopped', ...report });
          process.disconnect?.();
        },
        (err: unknown) => {
          console.error(err);
          process.exit(1);
        },
      );
    }
  });
  send({ type: 'ready', port, headers });
}
