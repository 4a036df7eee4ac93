import { execFile } from 'node:child_process';
import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { promisify } from 'node:util';
import type { RequestDraft } from './request-draft';
import { curlSnippet, fetchSnippet, pythonSnippet, shellQuote } from './snippets';

// The snippets are checked by running them: curl in bash, the fetch code in Node, the Python code with
// the requests package, each against a local HTTP server that records what it received.
const run = promisify(execFile);
const KEY = 'iso_test_0123456789abcdefghijklmnopqrstuvwxyz';

interface Received {
  method: string;
  url: string;
  headers: IncomingHttpHeaders;
  body: string;
}

let server: Server;
let origin: string;
const received: Received[] = [];

beforeAll(async () => {
  server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      received.push({
        method: req.method ?? '',
        url: req.url ?? '',
        headers: req.headers,
        body: Buffer.concat(chunks).toString('utf8'),
      });
      res.setHeader('Content-Type', 'application/json');
      res.end('{"ok":true}');
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

const tricky = {
  name: 'Stage 3 — it\'s "loud" $HOME `date` \\ back\nslash',
  sampleRateHz: 48000,
  filters: [{ type: 'peaking', frequencyHz: 63.5, gainDb: -4.5, q: 4.32, enabled: true, note: null }],
  empty: {},
  list: [],
};

const post: RequestDraft = {
  method: 'POST',
  url: '/v1/biquads?explain=true&label=a%20b',
  headers: [['Content-Type', 'application/json']],
  body: JSON.stringify(tricky, null, 2),
};

async function lastRequest(runSnippet: () => Promise<unknown>): Promise<Received> {
  const before = received.length;
  await runSnippet();
  expect(received.length).toBe(before + 1);
  return received[received.length - 1];
}

const env = { ...process.env, ISOCHRON_KEY: KEY };

describe.each([
  ['curl in bash', (code: string) => run('bash', ['-c', code], { env })],
  ['fetch in Node', (code: string) => run(process.execPath, ['--input-type=module', '-e', code], { env })],
  ['requests in Python 3', (code: string) => run('python3', ['-c', code], { env })],
])('%s', (_name, execute) => {
  const make = {
    'curl in bash': curlSnippet,
    'fetch in Node': fetchSnippet,
    'requests in Python 3': pythonSnippet,
  }[_name]!;

  it('sends the method, path, query, key and JSON body exactly as drafted', async () => {
    const request = await lastRequest(() => execute(make(post, { origin, keyVariable: 'ISOCHRON_KEY' })));
    expect(request.method).toBe('POST');
    expect(request.url).toBe('/v1/biquads?explain=true&label=a%20b');
    expect(request.headers.authorization).toBe(`Bearer ${KEY}`);
    expect(request.headers['content-type']).toMatch(/^application\/json/);
    expect(JSON.parse(request.body)).toEqual(tricky);
  });

  it('sends a GET without body or key when the operation needs none', async () => {
    const request = await lastRequest(() =>
      execute(make({ method: 'GET', url: '/healthz', headers: [] }, { origin, keyVariable: null })),
    );
    expect(request.method).toBe('GET');
    expect(request.url).toBe('/healthz');
    expect(request.headers.authorization).toBeUndefined();
    expect(request.body).toBe('');
  });
});

describe('snippet text', () => {
  it('never contains the key itself, only the variable that holds it', () => {
    for (const make of [curlSnippet, fetchSnippet, pythonSnippet]) {
      const text = make(post, { origin: 'https://isochron.example', keyVariable: 'ISOCHRON_KEY' });
      expect(text).toContain('ISOCHRON_KEY');
      expect(text).not.toContain('iso_live_');
    }
  });

  it('quotes for the shell so that nothing inside is expanded', () => {
    expect(shellQuote("it's $HOME")).toBe(`'it'\\''s $HOME'`);
  });
});
