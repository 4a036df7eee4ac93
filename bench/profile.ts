/**
 * `npm run bench:profile`: where the full chain's CPU time goes. Starts the full-chain target (the whole
 * service, as `npm run bench` does) under `node --cpu-prof`, loads POST /v1/biquads with autocannon,
 * and splits the CPU time of the measured window into the stages of a request by the code that ran:
 * each profile sample is given to the innermost frame whose file names a stage (so JSON.stringify, a
 * builtin, counts for the Express response code that called it). Prints CPU-µs per request per stage.
 *
 * BENCH_PROFILE_S (default 10) sets the measured window; BENCH_PROFILE_TARGET another target script;
 * BENCH_PROFILE_KEEP a file to keep the raw .cpuprofile in (for Chrome DevTools). The target runs built, as
 * in `npm run bench` (BENCH_FROM_SOURCE=1: through tsx).
 */
import { fork } from 'node:child_process';
import { copyFileSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { prepareTargets } from './targets-build';
import type { CpuMessage, ReadyMessage, TargetMessage } from './targets/protocol';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (options: object) => Promise<{ requests: { total: number } }>;

const SECONDS = Number(process.env.BENCH_PROFILE_S ?? 10);
const TARGET = process.env.BENCH_PROFILE_TARGET ?? 'full-chain.ts';
const BODY = JSON.stringify({
  sampleRateHz: 48000,
  filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
});

const SERIALISATION = 'serialisation (res.json)';
/** Stages by the file a frame comes from; the first match wins, so narrower patterns come first. */
const STAGES: Array<[string, RegExp]> = [
  ['HMAC of the key', /api\/auth\/key-secret|node:internal\/crypto/],
  ['auth / key lookup', /api\/auth\/|passport/],
  ['rate limit', /express-rate-limit|api\/rate-limit\//],
  ['validation', /api\/http\/validate|api\/openapi\/|\/ajv\/|ajv-formats/],
  ['metering', /api\/usage\//],
  ['handler (calculation)', /\/shared\/|api\/calculations\//],
  [SERIALISATION, /express\/lib\/response|\/send\/|\/etag\/|content-type|\/fresh\/|api\/http\/present/],
  ['JSON body parsing', /body-parser|raw-body|iconv-lite|type-is|media-typer|content-type/],
  [
    'express routing',
    /\/router\/|express\/lib\/|path-to-regexp|finalhandler|\/depd\/|api\/http\/(chain|segment-dispatch|direct-mount)/,
  ],
  ['security headers (helmet)', /\/helmet\/|api\/http\/security-headers/],
  ['request id, NUL guard, problems', /api\/http\//],
];
const NODE_HTTP = /node:_http|node:net|node:internal\/(streams|http|stream_base)|node:stream|node:events/;

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string };
  children?: number[];
}
interface CpuProfile {
  nodes: ProfileNode[];
  startTime: number;
  samples: number[];
  timeDeltas: number[];
}

function stageOf(node: ProfileNode, parents: Map<number, ProfileNode>): string {
  const name = node.callFrame.functionName;
  if (name === '(garbage collector)') return 'garbage collection';
  if (name === '(program)') return 'V8 and native (unattributed)';
  // Node's own code (node:…) works for whoever called it: the innermost frame of the project or of a
  // package decides; only work with no such caller (parsing a request, writing a socket) is Node's.
  let innermostNode: string | null = null;
  for (let at: ProfileNode | undefined = node; at; at = parents.get(at.id)) {
    const { url } = at.callFrame;
    if (!url) continue;
    if (url.startsWith('node:')) {
      innermostNode ??= url;
      continue;
    }
    for (const [stage, pattern] of STAGES) {
      if (!pattern.test(url)) continue;
      // res.end's write to the socket is Node's work, as in any server; what res.json adds is its own.
      if (stage === SERIALISATION && innermostNode !== null) return 'response write (node http)';
      return stage;
    }
    return `other (${url.replace(/^.*node_modules\//, '').split('/')[0]})`;
  }
  return innermostNode && NODE_HTTP.test(innermostNode) ? 'node http and streams' : 'node (other)';
}

async function main(): Promise<void> {
  const dir = mkdtempSync(path.join(tmpdir(), 'isochron-profile-'));
  const launcher = prepareTargets();
  const child = fork(launcher.file(TARGET), [], {
    execArgv: [...launcher.execArgv, '--cpu-prof', '--cpu-prof-dir', dir],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const next = <T extends TargetMessage>(type: T['type']) =>
    new Promise<T>((resolve) => {
      const on = (m: TargetMessage) => {
        if (m.type !== type) return;
        child.off('message', on);
        resolve(m as T);
      };
      child.on('message', on);
    });
  const ready = await next<ReadyMessage>('ready');
  const load = (seconds: number) =>
    autocannon({
      url: `http://127.0.0.1:${ready.port}${TARGET.endsWith('echo.ts') ? '/echo' : '/v1/biquads'}`,
      method: 'POST',
      headers: { 'content-type': 'application/json', ...ready.headers },
      body: BODY,
      connections: 32,
      duration: seconds,
    });
  await load(3);
  child.send('mark');
  const result = await load(SECONDS);
  const cpu = next<CpuMessage>('cpu');
  child.send('report');
  const { cpuMs, fromUs, toUs } = await cpu;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  child.send('stop');
  await exited;

  const file = readdirSync(dir).find((name) => name.endsWith('.cpuprofile'));
  if (!file) throw new Error('the target wrote no CPU profile');
  const profile = JSON.parse(readFileSync(path.join(dir, file), 'utf8')) as CpuProfile;
  if (process.env.BENCH_PROFILE_KEEP) copyFileSync(path.join(dir, file), process.env.BENCH_PROFILE_KEEP);
  rmSync(dir, { recursive: true, force: true });

  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parents = new Map<number, ProfileNode>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parents.set(c, n);
  const counts = new Map<string, number>();
  let busy = 0;
  let t = profile.startTime;
  profile.samples.forEach((id, i) => {
    t += profile.timeDeltas[i];
    if (t < fromUs || t > toUs) return;
    const node = byId.get(id);
    if (!node || node.callFrame.functionName === '(idle)') return;
    const stage = stageOf(node, parents);
    counts.set(stage, (counts.get(stage) ?? 0) + 1);
    busy += 1;
  });
  const requests = result.requests.total;
  const cpuUsPerRequest = (cpuMs * 1000) / requests;
  console.log(
    `${TARGET}: ${requests} requests in ${SECONDS} s (${(requests / SECONDS).toFixed(0)} req/s), ` +
      `${cpuUsPerRequest.toFixed(0)} CPU-µs per request, ${busy} busy samples in the window\n`,
  );
  const rows = [...counts].sort((a, b) => b[1] - a[1]);
  for (const [stage, n] of rows) {
    const share = n / busy;
    console.log(
      `  ${stage.padEnd(34)} ${(share * cpuUsPerRequest).toFixed(1).padStart(7)} µs  ${(share * 100).toFixed(1).padStart(5)} %`,
    );
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exitCode = 1;
});
