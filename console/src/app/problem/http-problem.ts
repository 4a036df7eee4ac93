import { HttpErrorResponse } from '@angular/common/http';
import { ReadableProblem, problemSummary, readProblem } from './problem-message';

/** Reads any error thrown by HttpClient (or anything else) as a problem the console can show. */
export function toProblem(error: unknown): ReadableProblem {
  if (error instanceof HttpErrorResponse) return readProblem(error.status, error.error);
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return { status: 0, title: 'Something went wrong', detail: message, fieldErrors: [] };
}

/** One readable line for an error, for alerts and snack bars. */
export function errorMessage(error: unknown): string {
  return problemSummary(toProblem(error));
}
