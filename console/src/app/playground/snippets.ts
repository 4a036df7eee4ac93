import type { RequestDraft } from './request-draft';

/** How a snippet authenticates: a key read from the environment, never the secret itself. */
export interface SnippetOptions {
  /** Absolute origin of the API, e.g. `https://isochron.example`. */
  origin: string;
  /** Name of the environment variable that holds the key; null for a request without a key. */
  keyVariable: string | null;
}

/** The variable the README's examples export the key in, so snippets and README read alike. */
export const DEFAULT_KEY_VARIABLE = 'ISOCHRON_KEY';

/** POSIX shell single-quoting: the only character needing care inside '...' is ' itself. */
export function shellQuote(text: string): string {
  return `'${text.replace(/'/g, `'\\''`)}'`;
}

function pythonString(text: string): string {
  return JSON.stringify(text);
}

function pythonLiteral(value: unknown, indent: number): string {
  const pad = '    '.repeat(indent + 1);
  const close = '    '.repeat(indent);
  if (value === null) return 'None';
  if (value === true) return 'True';
  if (value === false) return 'False';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : 'None';
  if (typeof value === 'string') return pythonString(value);
  if (Array.isArray(value)) {
    if (value.length === 0) return '[]';
    return `[\n${value.map((item) => `${pad}${pythonLiteral(item, indent + 1)},`).join('\n')}\n${close}]`;
  }
  const entries = Object.entries(value as Record<string, unknown>);
  if (entries.length === 0) return '{}';
  return `{\n${entries.map(([key, item]) => `${pad}${pythonString(key)}: ${pythonLiteral(item, indent + 1)},`).join('\n')}\n${close}}`;
}

/** A curl command for a POSIX shell; the key comes from `$ISOCHRON_KEY`. */
export function curlSnippet(draft: RequestDraft, options: SnippetOptions): string {
  const lines = [`curl -sS -X ${draft.method} ${shellQuote(options.origin + draft.url)}`];
  if (options.keyVariable) lines.push(`-H "Authorization: Bearer $${options.keyVariable}"`);
  for (const [name, value] of draft.headers) lines.push(`-H ${shellQuote(`${name}: ${value}`)}`);
  if (draft.body !== undefined) lines.push(`--data-binary ${shellQuote(draft.body)}`);
  return lines.join(' \\\n  ');
}

/** JavaScript for Node 18+ or a browser module; the key comes from `process.env`. */
export function fetchSnippet(draft: RequestDraft, options: SnippetOptions): string {
  const headers: string[] = [];
  if (options.keyVariable)
    headers.push(`    Authorization: \`Bearer \${process.env.${options.keyVariable}}\`,`);
  for (const [name, value] of draft.headers)
    headers.push(`    ${JSON.stringify(name)}: ${JSON.stringify(value)},`);
  const init = [`  method: ${JSON.stringify(draft.method)},`];
  if (headers.length) init.push(`  headers: {\n${headers.join('\n')}\n  },`);
  if (draft.body !== undefined) {
    const body = JSON.stringify(JSON.parse(draft.body), null, 2).replace(/\n/g, '\n  ');
    init.push(`  body: JSON.stringify(${body}),`);
  }
  return [
    `const response = await fetch(${JSON.stringify(options.origin + draft.url)}, {`,
    ...init,
    '});',
    "const body = response.headers.get('content-type')?.includes('json') ? await response.json() : await response.text();",
    'console.log(response.status, body);',
  ].join('\n');
}

/** Python 3 with the `requests` package; the key comes from `os.environ`. */
export function pythonSnippet(draft: RequestDraft, options: SnippetOptions): string {
  const headerLines: string[] = [];
  if (options.keyVariable)
    headerLines.push(`    "Authorization": "Bearer " + os.environ[${pythonString(options.keyVariable)}],`);
  for (const [name, value] of draft.headers) {
    if (draft.body !== undefined && name.toLowerCase() === 'content-type') continue;
    headerLines.push(`    ${pythonString(name)}: ${pythonString(value)},`);
  }
  const lines = ['import os', '', 'import requests', ''];
  lines.push(headerLines.length ? `headers = {\n${headerLines.join('\n')}\n}` : 'headers = {}');
  const args = [`${pythonString(draft.method)}`, pythonString(options.origin + draft.url), 'headers=headers'];
  if (draft.body !== undefined) {
    lines.push(`payload = ${pythonLiteral(JSON.parse(draft.body), 0)}`);
    args.push('json=payload');
  }
  args.push('timeout=30');
  lines.push(
    `response = requests.request(${args.join(', ')})`,
    'print(response.status_code)',
    'print(response.json() if "json" in response.headers.get("content-type", "") else response.text)',
  );
  return lines.join('\n');
}
