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

export interface StoppedMessage {
  type: 'stopped';
  /** Calls the usage meter wrote to the database (full chain only). */
  meteredCalls?: number;
}

export type TargetMessage = ReadyMessage | CpuMessage | StoppedMessage;

/**
 * Tells the parent where to send load; on `mark` starts counting CPU time, on `report` answers it, and
 * on `stop` shuts down cleanly.
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
  process.on('message', (message) => {
    if (message === 'mark') {
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
