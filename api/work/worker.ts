import os from 'node:os';
import { isMainThread, workerData } from 'node:worker_threads';
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

/** The error the core threw in the worker, as the same class on this side. */
export function reviveRefusal(refused: RefusedInput): CalculationInputError {
  return refused.signalProblem
    ? new SignalProblemError(refused.message, refused.signalProblem, refused.field)
    : new CalculationInputError(refused.message, refused.field);
}
