/** One field-level complaint from an RFC 9457 problem document. */
export interface FieldProblem {
  pointer: string;
  message: string;
}

/** What the console shows for a failed request. */
export interface ReadableProblem {
  status: number;
  title: string;
  detail?: string;
  fieldErrors: FieldProblem[];
  requestId?: string;
}

const FALLBACK_TITLES: Record<number, string> = {
  0: 'The server could not be reached',
  400: 'The request was not accepted',
  401: 'You are not signed in',
  403: 'You do not have permission for this',
  404: 'Not found',
  409: 'This conflicts with the current state',
  413: 'The request is too large',
  422: 'A value cannot be used',
  429: 'Too many requests — wait a moment and try again',
  500: 'The server failed to handle the request',
  502: 'The server is not answering',
  503: 'The service is not available right now',
};

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function parseBody(body: unknown): unknown {
  if (typeof body !== 'string') return body;
  try {
    return JSON.parse(body);
  } catch {
    return undefined;
  }
}

function fieldErrorsOf(errors: unknown): FieldProblem[] {
  if (!Array.isArray(errors)) return [];
  return errors.filter(isRecord).map((entry) => ({
    pointer: typeof entry['pointer'] === 'string' ? entry['pointer'] : '',
    message: typeof entry['message'] === 'string' ? entry['message'] : 'is invalid',
  }));
}

/**
 * Turns an HTTP failure into something a person can read: the problem document's title and detail
 * when the server sent one, a plain-language title for the status otherwise. Never shows raw HTML.
 */
export function readProblem(status: number, body: unknown): ReadableProblem {
  const parsed = parseBody(body);
  const fallbackTitle =
    FALLBACK_TITLES[status] ?? (status >= 500 ? FALLBACK_TITLES[500] : `The request failed (HTTP ${status})`);
  if (!isRecord(parsed)) return { status, title: fallbackTitle, fieldErrors: [] };
  const title =
    typeof parsed['title'] === 'string' && parsed['title'].trim() ? parsed['title'] : fallbackTitle;
  const detail =
    typeof parsed['detail'] === 'string' && parsed['detail'] !== title ? parsed['detail'] : undefined;
  const requestId = typeof parsed['requestId'] === 'string' ? parsed['requestId'] : undefined;
  return { status, title, detail, fieldErrors: fieldErrorsOf(parsed['errors']), requestId };
}

/** One line for a snack bar or an alert: "Title — detail (field: message; ...)". */
export function problemSummary(problem: ReadableProblem): string {
  const parts = [problem.title];
  if (problem.detail) parts.push(problem.detail);
  let text = parts.join(' — ');
  // A field error that only repeats the detail (one refused value) is not said twice.
  const extra = problem.fieldErrors.filter((field) => !problem.detail?.includes(field.message));
  if (extra.length > 0) {
    const fields = extra
      .map((field) => (field.pointer ? `${field.pointer}: ${field.message}` : field.message))
      .join('; ');
    text += ` (${fields})`;
  }
  return text;
}
