import os from 'node:os';
import { isMainThread, workerData } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { SignalProblemError, type SignalProblemCode } from '../../shared/analysis/signal-problem';
import { CalculationInputError } from '../../shared/errors';
import { tasks, type TaskName } from './tasks';

/**
 * On Linux a thread's nice value is its own (setpriority(PRIO_PROCESS, 0, …) names the calling thread,
 * see the NOTES of Linux's setpriority(2)), so this lowers the priority of this worker thread alone,
 * by `nice` steps below the process's: when the event loop's thread and a heavy task both want a core,
 * the scheduler gives it to the event loop first, and a cheap request does not wait behind a time slice
 * of heavy work. The pool passes 0 on other systems, where the call would renice the whole process.
 */
const nice = isMainThread ? 0 : ((workerData as { nice?: number } | null)?.nice ?? 0);
if (nice > 0) os.setPriority(0, Math.min(19, os.getPriority(0) + nice));

export interface TaskRequest {
  task: TaskName;
  input: unknown;
}

/** An input the core refused, as plain data: an Error's own fields and class do not survive the clone. */
export interface RefusedInput {
  message: string;
  field: string;
  /** Set when the core refused a signal (SignalProblemError). */
  signalProblem?: SignalProblemCode;
}

export type TaskReply = { ok: true; value: unknown } | { ok: false; refused: RefusedInput };

/**
 * The worker thread's entry (piscina calls it by name). A refused input comes back as a reply, so the
 * main thread can raise the same CalculationInputError the core threw; anything else is a fault and
 * rejects the task.
 */
export function runTask({ task, input }: TaskRequest): TaskReply {
  const run = tasks[task] as ((input: unknown) => unknown) | undefined;
  if (typeof run !== 'function') throw new Error(`No heavy task named ${String(task)}`);
  try {
    return { ok: true, value: run(input) };
  } catch (error) {
    if (!(error instanceof CalculationInputError)) throw error;
    return {
      ok: false,
      refused: {
        message: error.message,
        field: error.field,
        ...(error instanceof SignalProblemError && { signalProblem: error.code }),
      },
    };
  }
}

/**
 * The memory behind those arrays that is theirs alone: a Buffer cut from Node's shared pool
 * (Buffer.poolSize bytes, for small Buffers) is copied instead, as moving it would take its neighbours
 * too. Larger memory is taken to be the caller's to give (an upload's, see `upload-storage.ts`).
 */
export function transferable(arrays: readonly Uint8Array[]): ArrayBuffer[] {
  return arrays.flatMap(({ buffer, byteOffset, byteLength }) =>
    buffer instanceof ArrayBuffer &&
    byteLength > 0 &&
    ((byteOffset === 0 && byteLength === buffer.byteLength) || buffer.byteLength > Buffer.poolSize)
      ? [buffer]
      : [],
  );
}

/** Arrays of a task's answer whose memory goes back to the event loop's thread without a copy. */
const movingOut = new WeakMap<object, ArrayBuffer[]>();

/**
 * Marks `arrays` of a task's answer `value` to be moved, not copied, to the thread that asked: for large
 * answers (a generated WAV file), whose copy would otherwise be made on the event loop when it arrives.
 * Arrays cut from Node's shared pool (small Buffers) are copied instead.
 */
export function movingBack<T extends object>(value: T, arrays: readonly Uint8Array[]): T {
  movingOut.set(value, transferable(arrays));
  return value;
}

/** The pool's entry: {@link runTask}, with the arrays an answer marked with {@link movingBack} moved. */
export function runPooledTask(request: TaskRequest): TaskReply {
  const reply = runTask(request);
  const moving =
    reply.ok && typeof reply.value === 'object' && reply.value !== null && movingOut.get(reply.value);
  if (!moving) return reply;
  // piscina's Transferable: the reply is sent with `moving` in its transfer list.
  const movable = { [Piscina.transferableSymbol]: moving, [Piscina.valueSymbol]: reply };
  return Piscina.move(movable as unknown as Parameters<typeof Piscina.move>[0]) as unknown as TaskReply;
}

/** The error the core threw in the worker, as the same class on this side. */
export function reviveRefusal(refused: RefusedInput): CalculationInputError {
  return refused.signalProblem
    ? new SignalProblemError(refused.message, refused.signalProblem, refused.field)
    : new CalculationInputError(refused.message, refused.field);
}
