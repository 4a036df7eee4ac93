import type { PlaygroundOperation } from './openapi-operations';

/** A request exactly as the playground will send it and the snippets will write it. */
export interface RequestDraft {
  method: string;
  /** Path and query, e.g. `/v1/usage?groupBy=day`. */
  url: string;
  headers: Array<[string, string]>;
  /** The JSON text to send, as typed (re-indented), or undefined for no body. */
  body?: string;
}

export interface DraftProblem {
  field: string;
  message: string;
}

/**
 * Fills the path template and query string from the parameter fields. Path values are percent-encoded
 * so an id can never change the route; empty optional parameters are left out.
 */
export function buildDraft(
  operation: PlaygroundOperation,
  values: Readonly<Record<string, string>>,
  bodyValue: unknown,
): { draft: RequestDraft; problems: DraftProblem[] } {
  const problems: DraftProblem[] = [];
  let path = operation.path;
  const query = new URLSearchParams();
  const headers: Array<[string, string]> = [];
  for (const parameter of operation.parameters) {
    const value = (values[`${parameter.in}:${parameter.name}`] ?? '').trim();
    if (!value) {
      if (parameter.required)
        problems.push({ field: parameter.name, message: `${parameter.name} is required` });
      continue;
    }
    if (parameter.in === 'path') path = path.replace(`{${parameter.name}}`, encodeURIComponent(value));
    else if (parameter.in === 'query') query.append(parameter.name, value);
    else headers.push([parameter.name, value]);
  }
  const search = query.toString();
  let body: string | undefined;
  if (bodyValue !== undefined) {
    body = JSON.stringify(bodyValue, null, 2);
    headers.unshift(['Content-Type', 'application/json']);
  } else if (operation.bodyRequired) {
    problems.push({ field: 'body', message: 'this operation needs a request body' });
  }
  return {
    draft: { method: operation.method, url: search ? `${path}?${search}` : path, headers, body },
    problems,
  };
}
