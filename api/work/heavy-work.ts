import path from 'node:path';
import type { Response } from 'express';
import { Piscina } from 'piscina';
import { ProblemError } from '../http/problem';
import { WORKER_HEAP_LIMIT_MB } from './heap-limit';
import type { TaskInput, TaskName, TaskOutput } from './tasks';
import { reviveRefusal, runTask, transferable, type TaskReply, type TaskRequest } from './worker';

export interface HeavyWorkOptions {
  /** Worker threads running heavy tasks side by side. */
  threads: number;
  /** Heavy tasks that may wait for a thread; one more is refused with 503 and Retry-After. */
  queueLimit: number;
  /**
   * Nice value (0–19) each worker thread gives itself, so the event loop's thread wins the CPU when
   * both want it (`worker.ts`). Linux only: there a thread's nice value is its own; elsewhere it would
   * renice the whole process, so it is not applied. 0 leaves the threads as they start.
   */
  nice?: number;
  /**
   * Most JavaScript heap (old generation, MiB) one worker thread may hold; default
   * {@link WORKER_HEAP_LIMIT_MB}. A task that needs more ends its thread; the pool starts another.
   */
  heapLimitMb?: number;
  /** Told of a worker thread's failure that no task was waiting on (the pool replaces the thread). */
  onFault?: (error: Error) => void;
}

/**
 * The worker file. Built (`dist/`), it is plain JavaScript beside this module. From source (`tsx`,
 * jest) a small CommonJS entry registers tsx's require hook in the thread first: a worker thread does
 * not inherit the hooks of the process that started it.
 */
const workerFile = path.join(__dirname, __filename.endsWith('.ts') ? 'worker-from-source.cjs' : 'worker.js');

/**
 * Runs the calculations of `tasks.ts` in a pool of worker threads (piscina), so a heavy request never
 * holds the event loop. The pool starts on the first task and stops on `close()` (the services close it
 * on SIGTERM, after the requests in flight have ended). Admission is counted here, not by piscina, so
 * the limit is exact: `threads` tasks running plus `queueLimit` waiting; one more is a 503 problem.
 */
export class HeavyWork {
  private pool: Piscina | null = null;
  private pending = 0;
  private closed = false;
  /** Running mean of a task's duration (ms), for Retry-After; starts at one second. */
  private meanTaskMs = 1000;

  constructor(readonly options: HeavyWorkOptions) {}

  /** Tasks running or waiting now. */
  get inFlight(): number {
    return this.pending;
  }

  /** Most tasks running or waiting at once. */
  get capacity(): number {
    return this.options.threads + this.options.queueLimit;
  }

  /**
   * Runs `task` on a worker thread. A refused input rejects with the core's CalculationInputError (the
   * error path makes it a 422 naming the field); a full queue or a closed pool with a 503 problem.
   * `signal` drops the task (queued) or stops its thread (running), for a client that went away.
   * `transfer`: byte arrays of the input (an uploaded file) whose memory moves to the worker instead of
   * being copied on the event loop; the caller must not read them afterwards (they are left empty).
   */
  async run<T extends TaskName>(
    task: T,
    input: TaskInput<T>,
    signal?: AbortSignal,
    transfer: readonly Uint8Array[] = [],
  ): Promise<TaskOutput<T>> {
    if (this.closed) throw unavailable('The service is shutting down.', 1);
    if (this.pending >= this.capacity) {
      throw unavailable(
        `${this.pending} heavy calculations are running or waiting, the most this service takes at once. Retry after the time given in Retry-After (seconds).`,
        this.retryAfterS(),
      );
    }
    this.pending += 1;
    const started = performance.now();
    try {
      const request: TaskRequest = { task, input };
      let reply: TaskReply;
      try {
        reply = (await this.start().run(request, {
          name: 'runPooledTask',
          signal,
          transferList: transferable(transfer),
        })) as TaskReply;
      } catch (error) {
        // Nobody reads this answer; a problem (not a fault) keeps it out of the error log.
        if (signal?.aborted) throw unavailable('The client closed the connection.', 1);
        if ((error as { code?: unknown } | null)?.code === 'ERR_WORKER_OUT_OF_MEMORY')
          throw this.tooLarge(task);
        throw error;
      }
      if (!reply.ok) throw reviveRefusal(reply.refused);
      return reply.value as TaskOutput<T>;
    } finally {
      this.pending -= 1;
      this.meanTaskMs += (performance.now() - started - this.meanTaskMs) / 8;
    }
  }

  /** Stops the threads; tasks still running are cancelled. */
  async close(): Promise<void> {
    this.closed = true;
    const pool = this.pool;
    this.pool = null;
    await pool?.destroy();
  }

  /** The heap limit each worker thread runs with, MiB. */
  get heapLimitMb(): number {
    return this.options.heapLimitMb ?? WORKER_HEAP_LIMIT_MB;
  }

  private start(): Piscina {
    if (this.pool) return this.pool;
    this.pool = new Piscina({
      filename: workerFile,
      minThreads: this.options.threads,
      maxThreads: this.options.threads,
      // The admission check above already bounds the queue.
      maxQueue: this.capacity,
      resourceLimits: { maxOldGenerationSizeMb: this.heapLimitMb },
      workerData: { nice: process.platform === 'linux' ? (this.options.nice ?? 0) : 0 },
    });
    // piscina emits 'error' for a thread that fails with no task on it; unheard, that would end the process.
    this.pool.on('error', (error: Error) => this.options.onFault?.(error));
    return this.pool;
  }

  /**
   * The answer for a task whose thread ran out of heap: the same input would fail again, so it is a 422
   * naming what to make smaller, not a 503 to retry. The thread is gone; piscina has started another.
   */
  private tooLarge(task: TaskName): ProblemError {
    return new ProblemError({
      status: 422,
      title: 'Calculation too large',
      detail: `${TOO_LARGE[task]} The calculation needed more than ${this.heapLimitMb} MiB of working memory, the most one calculation may use.`,
      type: 'calculation-too-large',
      extensions: { heapLimitMb: this.heapLimitMb },
    });
  }

  /** Seconds until a place is likely free: the work ahead of a new task spread over the threads. */
  private retryAfterS(): number {
    return Math.max(1, Math.ceil((this.pending * this.meanTaskMs) / this.options.threads / 1000));
  }
}

/** What to make smaller, by task, when one runs out of memory. */
const TOO_LARGE: Record<TaskName, string> = {
  analyseWav:
    'The impulse-response file with the decay plots asked for is too large to analyse: send a shorter file or ask for fewer slices and bins.',
  analyseSweepWav: 'The sweep recording is too large to analyse: send a shorter or lower-rate recording.',
  readCalibratorWav: 'The calibrator recording is too large to read: send a shorter recording.',
  fitEq: 'The measured response is too large to fit: send fewer points.',
  planRoom: 'The plan is too large to compute: send fewer channels or shorter measured responses.',
  planStoredRoom:
    "The room's stored measurements are too many or too long to plan at once: include fewer of them (measurements.include / exclude).",
  testSignal: 'The test signal asked for is too large to make: ask for a shorter one or a lower sample rate.',
};

const unavailable = (detail: string, retryAfterS: number): ProblemError =>
  new ProblemError({
    status: 503,
    title: 'Busy with heavy calculations',
    detail,
    type: 'heavy-work-busy',
    headers: { 'Retry-After': String(retryAfterS) },
  });

/**
 * A signal that aborts when the client closes the connection before its answer was sent, so a heavy
 * task nobody waits for any more gives its thread back.
 */
export function whenClientGone(res: Response): AbortSignal {
  const controller = new AbortController();
  res.once('close', () => {
    if (!res.writableFinished) controller.abort();
  });
  return controller.signal;
}

/**
 * The same tasks on the calling thread, for start-up work no request waits behind (loading the demo
 * data before the service listens): starting a worker thread for it would only add its start-up time.
 */
export const onThisThread: Pick<HeavyWork, 'run'> = {
  async run<T extends TaskName>(task: T, input: TaskInput<T>): Promise<TaskOutput<T>> {
    const reply = runTask({ task, input });
    if (!reply.ok) throw reviveRefusal(reply.refused);
    return reply.value as TaskOutput<T>;
  },
};
