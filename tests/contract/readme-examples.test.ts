import type { ValidateFunction } from 'ajv';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../../api/config';
import type { OpenAPIV3_1 } from 'openapi-types';
import {
  listOperations,
  resolveParameter,
  resolveRef,
  type OpenApiOperation,
  type OpenApiParameter,
} from '../../api/openapi/document';
import { toFieldErrors } from '../../api/openapi/validators';
import { getContract } from '../../api/http/validate';

/**
 * Keeps README.md's curl examples tied to the OpenAPI contract: every example names an operation of the
 * document, every operation has an example, and every JSON body, query string and path parameter an
 * example sends passes that operation's request validation (the same compiled validators the service
 * uses). Examples marked "invalid on purpose" must fail it, with the pointers their documented answer shows.
 */

const README = readFileSync(path.join(projectRoot, 'README.md'), 'utf8');
const { document, validators } = getContract();
const BASE_URL_VARIABLE = /^(?:\$ISOCHRON_URL|\$\{ISOCHRON_URL\})/;
const INVALID_MARK = 'invalid on purpose';

interface CodeBlock {
  language: string;
  text: string;
  /** The next fenced block after this one, if any: the documented answer of a command. */
  next?: CodeBlock;
}

interface CurlExample {
  command: string;
  method: string;
  url: string;
  headers: string[];
  data?: string;
  formFields: string[];
  cookieJar: boolean;
  invalidOnPurpose: boolean;
  answer?: CodeBlock;
}

function codeBlocks(markdown: string): CodeBlock[] {
  const blocks: CodeBlock[] = [];
  const fence = /^```([\w-]*)\n([\s\S]*?)^```$/gm;
  for (let match = fence.exec(markdown); match; match = fence.exec(markdown)) {
    blocks.push({ language: match[1], text: match[2] });
  }
  blocks.forEach((block, i) => (block.next = blocks[i + 1]));
  return blocks;
}

/**
 * Splits shell text into commands of words, the way a POSIX shell would for the plain syntax the README
 * uses: quotes, backslash-newline continuations, comments, and `|`, `;`, `&`, `>`, `(`, `)` and `$(` as
 * ends of commands. Variables stay as written (`$ROOM_ID`).
 */
function shellCommands(text: string): string[][] {
  const commands: string[][] = [];
  let words: string[] = [];
  let word: string | null = null;
  const endWord = () => {
    if (word !== null) words.push(word);
    word = null;
  };
  const endCommand = () => {
    endWord();
    if (words.length > 0) commands.push(words);
    words = [];
  };
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '\\' && text[i + 1] === '\n') {
      i++;
    } else if (c === '\\') {
      word = (word ?? '') + (text[i + 1] ?? '');
      i++;
    } else if (c === "'") {
      const end = text.indexOf("'", i + 1);
      if (end < 0) throw new Error(`Unclosed single quote in: ${text.slice(i, i + 60)}`);
      word = (word ?? '') + text.slice(i + 1, end);
      i = end;
    } else if (c === '"') {
      let value = '';
      for (i++; i < text.length && text[i] !== '"'; i++) {
        if (text[i] === '\\' && '"\\$`'.includes(text[i + 1])) i++;
        value += text[i];
      }
      if (i >= text.length) throw new Error('Unclosed double quote in a README example');
      word = (word ?? '') + value;
    } else if (c === '#' && word === null) {
      while (i < text.length && text[i] !== '\n') i++;
      endCommand();
    } else if (c === '$' && text[i + 1] === '(') {
      endCommand();
      i++;
    } else if ('\n|;&>()'.includes(c)) {
      endCommand();
    } else if (c === ' ' || c === '\t') {
      endWord();
    } else {
      word = (word ?? '') + c;
    }
  }
  endCommand();
  return commands;
}

const VALUE_OPTIONS = new Set([
  '-X',
  '--request',
  '-H',
  '--header',
  '-d',
  '--data',
  '--data-raw',
  '--data-binary',
  '-F',
  '--form',
  '-b',
  '--cookie',
  '-c',
  '--cookie-jar',
  '-o',
  '--output',
  '-w',
  '--write-out',
]);

function parseCurl(words: string[], block: CodeBlock): CurlExample {
  const example: CurlExample = {
    command: words.join(' '),
    method: '',
    url: '',
    headers: [],
    formFields: [],
    cookieJar: false,
    invalidOnPurpose: block.text.includes(INVALID_MARK),
    answer: block.next,
  };
  let explicitMethod: string | undefined;
  for (let i = 1; i < words.length; i++) {
    const word = words[i];
    if (VALUE_OPTIONS.has(word)) {
      const value = words[++i];
      if (value === undefined) throw new Error(`${word} without a value in: ${example.command}`);
      if (word === '-X' || word === '--request') explicitMethod = value.toUpperCase();
      else if (word === '-H' || word === '--header') example.headers.push(value);
      else if (word.startsWith('-d') || word.startsWith('--data')) example.data = value;
      else if (word === '-F' || word === '--form') example.formFields.push(value);
      else if (word === '-b' || word === '--cookie') example.cookieJar = true;
    } else if (!word.startsWith('-')) {
      if (example.url) throw new Error(`Two URLs in: ${example.command}`);
      example.url = word;
    }
  }
  const sendsBody = example.data !== undefined || example.formFields.length > 0;
  example.method = explicitMethod ?? (sendsBody ? 'POST' : 'GET');
  return example;
}

const examples: CurlExample[] = codeBlocks(README)
  .filter((block) => block.language === 'sh' || block.language === 'bash')
  .flatMap((block) =>
    shellCommands(block.text)
      .filter((words) => words[0] === 'curl')
      .map((words) => parseCurl(words, block)),
  );

interface Route {
  method: string;
  template: string;
  segments: string[];
  operation: OpenApiOperation;
  operationId: string;
}

const routes: Route[] = listOperations(document).map(({ method, route, operation }) => ({
  method: method.toUpperCase(),
  template: route,
  segments: route.split('/'),
  operation,
  operationId: operation.operationId,
}));

function splitUrl(url: string): { path: string; query: URLSearchParams } {
  if (!BASE_URL_VARIABLE.test(url)) throw new Error(`URL does not start with $ISOCHRON_URL: ${url}`);
  const rest = url.replace(BASE_URL_VARIABLE, '');
  const [pathPart, queryPart = ''] = rest.split('?');
  return { path: pathPart, query: new URLSearchParams(queryPart) };
}

/** The operation an example calls; a literal segment beats a template parameter (`/tunings/compare`). */
function operationOf(example: CurlExample): { route: Route; params: Record<string, string> } | null {
  const segments = splitUrl(example.url).path.split('/');
  let best: { route: Route; params: Record<string, string>; literals: number } | null = null;
  for (const route of routes) {
    if (route.method !== example.method || route.segments.length !== segments.length) continue;
    const params: Record<string, string> = {};
    let literals = 0;
    const matches = route.segments.every((segment, i) => {
      const name = /^\{(\w+)\}$/.exec(segment)?.[1];
      if (name) {
        params[name] = decodeURIComponent(segments[i]);
        return segments[i].length > 0;
      }
      literals++;
      return segment === segments[i];
    });
    if (matches && (!best || literals > best.literals)) best = { route, params, literals };
  }
  return best && { route: best.route, params: best.params };
}

function resolvedParameters(operation: OpenApiOperation, template: string): OpenApiParameter[] {
  const pathItem = document.paths[template];
  return [...(pathItem?.parameters ?? []), ...(operation.parameters ?? [])].map((p) =>
    resolveParameter(document, p),
  );
}

const isShellVariable = (value: string) => value.includes('$');
const hasHeader = (example: CurlExample, name: string, value?: RegExp) =>
  example.headers.some((h) => {
    const [key, ...rest] = h.split(':');
    return key.trim().toLowerCase() === name.toLowerCase() && (!value || value.test(rest.join(':').trim()));
  });

/**
 * The fields a parameter validator refuses. A shell variable stands for an id fetched earlier in the
 * walkthrough, so its value is left out and only its presence counts.
 */
function refusedFields(
  validator: ValidateFunction,
  values: Record<string, string>,
  prefix: string,
): string[] {
  const variables = Object.keys(values).filter((name) => isShellVariable(values[name]));
  const concrete = Object.fromEntries(Object.entries(values).filter(([name]) => !variables.includes(name)));
  if (validator(concrete)) return [];
  return toFieldErrors(validator.errors, prefix)
    .filter((e) => !variables.some((name) => e.pointer === `${prefix}/${name}`))
    .map((e) => `${e.pointer} ${e.message}`);
}

function describeExample(example: CurlExample): string {
  return `${example.method} ${splitUrl(example.url).path}`;
}

const cases = examples.map((example, i): [string, CurlExample] => [
  `example ${i + 1}: ${describeExample(example)}`,
  example,
]);

describe('README.md curl examples follow the OpenAPI contract', () => {
  it('has examples to check (a README without curl examples would pass everything below)', () => {
    expect(examples.length).toBeGreaterThanOrEqual(routes.length);
  });

  it('shows every operation of the document at least once', () => {
    const shown = new Set(examples.map((e) => operationOf(e)?.route.operation.operationId));
    const missing = routes
      .filter((r) => !shown.has(r.operation.operationId))
      .map((r) => `${r.method} ${r.template} (${r.operation.operationId})`);
    expect(missing).toEqual([]);
  });

  describe.each(cases)('%s', (_name, example) => {
    const found = operationOf(example);

    it('is an operation of the document', () => {
      if (!found) throw new Error(`No operation ${describeExample(example)} for: ${example.command}`);
    });

    it('sends the credentials and headers the operation needs', () => {
      if (!found) return;
      const { route } = found;
      const open = Array.isArray(route.operation.security) && route.operation.security.length === 0;
      const bearer = hasHeader(example, 'Authorization', /^Bearer \$ISOCHRON_KEY$/);
      if (route.template.startsWith('/v1/')) expect(bearer || example.cookieJar).toBe(true);
      if (open) expect(bearer).toBe(false);
      const requiredHeaders = resolvedParameters(route.operation, route.template).filter(
        (p) => p.in === 'header' && p.required,
      );
      for (const header of requiredHeaders) {
        const value = (header.schema as { const?: string } | undefined)?.const;
        expect([
          header.name,
          hasHeader(example, header.name, value ? new RegExp(`^${value}$`) : undefined),
        ]).toEqual([header.name, true]);
      }
      const cookieWrite = example.cookieJar && !bearer && example.method !== 'GET';
      if (cookieWrite) expect(hasHeader(example, 'X-Requested-With', /^isochron-console$/)).toBe(true);
    });

    it('sends query and path parameters the operation accepts', () => {
      if (!found) return;
      const operationValidators = validators.get(found.route.operationId)!;
      const query = Object.fromEntries(splitUrl(example.url).query);
      const declared = resolvedParameters(found.route.operation, found.route.template)
        .filter((p) => p.in === 'query')
        .map((p) => p.name);
      expect(Object.keys(query).filter((name) => !declared.includes(name))).toEqual([]);
      expect(refusedFields(operationValidators.query, query, '/query')).toEqual([]);
      expect(refusedFields(operationValidators.params, found.params, '/params')).toEqual([]);
    });

    it('sends a body the operation accepts', () => {
      if (!found) return;
      const operationValidators = validators.get(found.route.operationId)!;
      const media = operationValidators.bodyMediaTypes;
      if (example.formFields.length > 0) {
        expect(media).toContain('multipart/form-data');
        const requestBody = found.route.operation.requestBody as OpenAPIV3_1.RequestBodyObject;
        const schema = requestBody.content['multipart/form-data'].schema as OpenAPIV3_1.ReferenceObject;
        const upload = resolveRef<OpenAPIV3_1.SchemaObject & { properties: object }>(document, schema.$ref);
        const names = example.formFields.map((field) => field.split('=')[0]);
        expect(names.filter((name) => !(name in upload.properties))).toEqual([]);
        expect((upload.required ?? []).filter((name) => !names.includes(name))).toEqual([]);
        return;
      }
      if (example.data === undefined) {
        expect(operationValidators.bodyRequired).toBe(false);
        return;
      }
      expect(media).toContain('application/json');
      // Without it curl sends application/x-www-form-urlencoded, which the service refuses with 415.
      expect(hasHeader(example, 'Content-Type', /^application\/json$/)).toBe(true);
      const body: unknown = JSON.parse(example.data);
      const valid = operationValidators.json!.all(body);
      // As in paths, a shell variable in a body ("$PROFILE_ID") stands for an id fetched earlier.
      const fromVariable = (pointer: string) =>
        isShellVariable(
          String(
            pointer
              .split('/')
              .slice(2)
              .reduce<unknown>((at, key) => (at as Record<string, unknown>)?.[key], body),
          ),
        );
      const pointers = toFieldErrors(operationValidators.json!.all.errors, '/body')
        .map((e) => e.pointer)
        .filter((pointer) => !fromVariable(pointer));
      if (!example.invalidOnPurpose) {
        if (!valid && pointers.length === 0) return;
        if (!valid) throw new Error(`The body is refused at ${pointers.join(', ')}`);
        return;
      }
      expect(valid).toBe(false);
      const answer = example.answer;
      if (answer?.language !== 'json')
        throw new Error('An example invalid on purpose needs its answer below');
      const documented = (JSON.parse(answer.text) as { errors: Array<{ pointer: string }> }).errors;
      expect(documented.map((e) => e.pointer).sort()).toEqual([...pointers].sort());
    });
  });
});
