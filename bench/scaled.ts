/**
 * `npm run bench:scaled` (also the last part of `npm run bench` when PostgreSQL, Redis and HAProxy are
 * installed): what scaling out costs and buys on this machine. The real service (`api/main.ts`, one
 * process per instance, production settings) is measured with autocannon in four set-ups:
 *
 *   1. SQLite, one instance, clients straight to it (the embedded default)
 *   2. PostgreSQL + Redis, one instance, straight to it
 *   3. PostgreSQL + Redis, one instance behind HAProxy
 *   4. PostgreSQL + Redis, two instances behind HAProxy
 *
 * and two workloads: POST /v1/biquads (a calculation: key, rate limit, metering, validation, no
 * database) and PATCH /v1/tunings/{id} (a write: a new version of one tuning, row-locked). Besides req/s
 * and latency it reports the CPU time every server-side process spent per request (the instances,
 * PostgreSQL with its backends, Redis, HAProxy), read from /proc, which on a shared machine is steadier
 * than req/s. Writes bench/results/scaled.json.
 *
 * Needs ISOCHRON_TEST_POSTGRES_URL and ISOCHRON_TEST_REDIS_URL (scripts/with-engines.sh sets both) and
 * haproxy. BENCH_SCALED_S (seconds per measurement, default 8) sets the length.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { generateKeySecret, hashKeySecret } from '../api/auth/key-secret';
import { openDatabase } from '../api/db/database';
import { newId } from '../api/db/ids';
import { STAGE3_ROOM } from '../seeds/demo-stage3-room';
import { createPostgresDatabase, testPostgresUrl, testRedisUrl, uniqueName } from '../tests/support/engines';
import {
  freePort,
  PROCESS_KEY_HASH_SECRET,
  startService,
  type ServiceProcess,
} from '../tests/support/service-process';

interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number };
  errors: number;
  timeouts: number;
  non2xx: number;
  '2xx': number;
  statusCodeStats?: Record<string, { count: number }>;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (options: object) => Promise<AutocannonResult>;

const SECONDS = Number(process.env.BENCH_SCALED_S ?? 8);
const WARMUP_S = 2;
const CONNECTIONS = 32;
const CLOCK_TICKS = 100; // USER_HZ on Linux, what /proc/<pid>/stat counts in

const BIQUAD_BODY = JSON.stringify({
  sampleRateHz: 48000,
  filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
});

/** CPU seconds of a process and every descendant still running (plus the children it has reaped). */
function cpuSecondsOfTree(rootPids: number[]): number {
  const stats = new Map<number, { ppid: number; ticks: number; reaped: number }>();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const text = readFileSync(`/proc/${name}/stat`, 'utf8');
      const fields = text.slice(text.lastIndexOf(')') + 2).split(' ');
      // After the command: state ppid ... utime(12) stime(13) cutime(14) cstime(15), 0-based from state.
      stats.set(Number(name), {
        ppid: Number(fields[1]),
        ticks: Number(fields[11]) + Number(fields[12]),
        reaped: Number(fields[13]) + Number(fields[14]),
      });
    } catch {
      // The process ended meanwhile.
    }
  }
  const inTree = new Set(rootPids.filter((pid) => stats.has(pid)));
  let grew = true;
  while (grew) {
    grew = false;
    for (const [pid, stat] of stats) {
      if (!inTree.has(pid) && inTree.has(stat.ppid)) {
        inTree.add(pid);
        grew = true;
      }
    }
  }
  let ticks = 0;
  for (const pid of inTree) {
    const stat = stats.get(pid)!;
    ticks += stat.ticks + (rootPids.includes(pid) ? stat.reaped : 0);
  }
  return ticks / CLOCK_TICKS;
}

function readPid(file: string): number | null {
  return existsSync(file) ? Number(readFileSync(file, 'utf8').split('\n')[0]) : null;
}

/** The postmaster and Redis of the engines scripts/with-engines.sh started (their pid files). */
function enginePids(): number[] {
  const pids: number[] = [];
  const work = process.env.ISOCHRON_ENGINES_DIR;
  if (work) {
    const postmaster = readPid(path.join(work, 'pg', 'postmaster.pid'));
    const redis = readPid(path.join(work, 'redis.pid'));
    if (postmaster) pids.push(postmaster);
    if (redis) pids.push(redis);
  }
  return pids;
}

interface SetUp {
  name: string;
  engines: 'sqlite' | 'postgresql+redis';
  instances: number;
  proxy: boolean;
}

const SET_UPS: SetUp[] = [
  { name: 'SQLite, 1 instance, direct', engines: 'sqlite', instances: 1, proxy: false },
  { name: 'PostgreSQL+Redis, 1 instance, direct', engines: 'postgresql+redis', instances: 1, proxy: false },
  {
    name: 'PostgreSQL+Redis, 1 instance behind HAProxy',
    engines: 'postgresql+redis',
    instances: 1,
    proxy: true,
  },
  {
    name: 'PostgreSQL+Redis, 2 instances behind HAProxy',
    engines: 'postgresql+redis',
    instances: 2,
    proxy: true,
  },
];

interface Running {
  port: number;
  pids: number[];
  key: string;
  tuningId: string;
  stop(): Promise<void>;
}

function haproxyConfig(port: number, backends: number[]): string {
  return [
    'global',
    '  maxconn 4096',
    'defaults',
    '  mode http',
    '  timeout connect 2s',
    '  timeout client 60s',
    '  timeout server 60s',
    '  option http-keep-alive',
    'frontend isochron',
    `  bind 127.0.0.1:${port}`,
    '  default_backend instances',
    'backend instances',
    '  balance roundrobin',
    ...backends.map((p, i) => `  server instance${i + 1} 127.0.0.1:${p}`),
    '',
  ].join('\n');
}

function request(
  port: number,
  method: string,
  urlPath: string,
  key: string,
  body: unknown,
): Promise<{ status: number; body: string }> {
  const payload = JSON.stringify(body);
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        method,
        path: urlPath,
        headers: {
          Authorization: `Bearer ${key}`,
          'Content-Type': 'application/json',
          'Content-Length': Buffer.byteLength(payload),
        },
      },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (chunk: string) => (text += chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text }));
      },
    );
    req.on('error', reject);
    req.end(payload);
  });
}

async function start(setUp: SetUp, dir: string): Promise<Running> {
  let databaseUrl: string;
  let dropDatabase: () => Promise<void> = async () => undefined;
  if (setUp.engines === 'sqlite') {
    databaseUrl = `sqlite:${path.join(dir, `${uniqueName('bench')}.sqlite`)}`;
  } else {
    const database = await createPostgresDatabase(testPostgresUrl!);
    databaseUrl = database.url;
    dropDatabase = database.drop;
  }
  const db = await openDatabase(databaseUrl);
  const { secret, prefix, lastFour } = generateKeySecret('test');
  const ownerId = newId('usr');
  await db.write(async (transaction) => {
    await db.models.User.create(
      {
        id: ownerId,
        email: 'bench@bench.example',
        name: null,
        role: 'developer',
        passwordHash: null,
        lastSignInAt: null,
      },
      { transaction },
    );
    await db.models.ApiKey.create(
      {
        id: newId('key'),
        name: 'Bench',
        role: 'tuning',
        kind: 'test',
        prefix,
        lastFour,
        secretHash: hashKeySecret(secret, PROCESS_KEY_HASH_SECRET),
        ownerId,
        createdById: null,
        rateLimitPerMinute: 100_000_000,
        expiresAt: null,
        revokedAt: null,
        lastUsedAt: null,
      },
      { transaction },
    );
  });
  await db.close();
  const env: Record<string, string> = {
    NODE_ENV: 'production',
    LOG_LEVEL: 'warn',
    USER_RATE_LIMIT_PER_MINUTE: '10000000',
    TRUST_PROXY_HOPS: setUp.proxy ? '1' : '0',
  };
  if (setUp.engines !== 'sqlite') {
    env.REDIS_URL = testRedisUrl!;
    env.REDIS_KEY_PREFIX = `${uniqueName('bench')}:`;
  }
  const instances: ServiceProcess[] = await Promise.all(
    Array.from({ length: setUp.instances }, () => startService(databaseUrl, dir, env)),
  );
  let port = instances[0].port;
  let proxy: ChildProcess | null = null;
  if (setUp.proxy) {
    port = await freePort();
    const config = path.join(dir, `haproxy-${port}.cfg`);
    writeFileSync(
      config,
      haproxyConfig(
        port,
        instances.map((i) => i.port),
      ),
    );
    proxy = spawn('haproxy', ['-f', config, '-db'], { stdio: 'ignore' });
    for (let i = 0; i < 100; i += 1) {
      const up = await new Promise<boolean>((resolve) =>
        http
          .get({ host: '127.0.0.1', port, path: '/healthz' }, (res) => resolve(res.statusCode === 200))
          .on('error', () => resolve(false)),
      );
      if (up) break;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }
  const room = await request(port, 'POST', '/v1/rooms', secret, STAGE3_ROOM);
  const tuning = await request(port, 'POST', `/v1/rooms/${JSON.parse(room.body).id}/tunings`, secret, {
    name: 'Bench',
    sampleRateHz: 48000,
    channels: [{ id: 'M+030', delayMs: 1, trimDb: -1 }],
  });
  if (tuning.status !== 201)
    throw new Error(`could not create the bench tuning: ${tuning.status} ${tuning.body}`);
  const pids = [
    ...instances.map((i) => i.child.pid!),
    ...(proxy ? [proxy.pid!] : []),
    ...(setUp.engines === 'sqlite' ? [] : enginePids()),
  ];
  return {
    port,
    pids,
    key: secret,
    tuningId: JSON.parse(tuning.body).id,
    async stop() {
      proxy?.kill('SIGTERM');
      await Promise.all(instances.map((i) => i.stop()));
      await dropDatabase();
    },
  };
}

interface Measurement {
  setUp: string;
  workload: string;
  requestsPerSecond: number;
  p50Ms: number;
  p99Ms: number;
  completed: number;
  non2xx: number;
  errors: number;
  /** CPU time of every server-side process (instances, proxy, PostgreSQL, Redis) per completed request. */
  serverCpuUsPerRequest: number;
}

async function measure(
  setUp: SetUp,
  running: Running,
  workload: 'biquads' | 'tuning edit',
): Promise<Measurement> {
  const options =
    workload === 'biquads'
      ? { method: 'POST', path: '/v1/biquads', body: BIQUAD_BODY }
      : {
          method: 'PATCH',
          path: `/v1/tunings/${running.tuningId}`,
          body: JSON.stringify({ notes: 'bench edit' }),
        };
  const base = {
    // autocannon takes the path as part of the URL.
    url: `http://127.0.0.1:${running.port}${options.path}`,
    connections: CONNECTIONS,
    method: options.method,
    body: options.body,
    headers: { Authorization: `Bearer ${running.key}`, 'Content-Type': 'application/json' },
  };
  await autocannon({ ...base, duration: WARMUP_S });
  const before = cpuSecondsOfTree(running.pids);
  const result = await autocannon({ ...base, duration: SECONDS });
  const cpu = cpuSecondsOfTree(running.pids) - before;
  if (result.non2xx > 0) console.log(`  status codes: ${JSON.stringify(result.statusCodeStats)}`);
  const completed = result['2xx'];
  return {
    setUp: setUp.name,
    workload: `${options.method} ${workload === 'biquads' ? '/v1/biquads' : '/v1/tunings/{id}'}`,
    requestsPerSecond: Math.round(completed / SECONDS),
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    completed,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
    serverCpuUsPerRequest: Math.round((cpu * 1e6) / Math.max(1, completed)),
  };
}

async function main(): Promise<void> {
  if (!testPostgresUrl || !testRedisUrl) {
    throw new Error(
      'bench/scaled.ts needs ISOCHRON_TEST_POSTGRES_URL and ISOCHRON_TEST_REDIS_URL: run npm run bench:scaled',
    );
  }
  const dir = mkdtempSync(path.join(os.tmpdir(), 'isochron-bench-scaled-'));
  const results: Measurement[] = [];
  try {
    for (const setUp of SET_UPS) {
      const running = await start(setUp, dir);
      try {
        for (const workload of ['biquads', 'tuning edit'] as const) {
          const m = await measure(setUp, running, workload);
          results.push(m);
          console.log(
            `${m.setUp.padEnd(46)} ${m.workload.padEnd(24)} ${String(m.requestsPerSecond).padStart(6)} req/s  ` +
              `p50 ${m.p50Ms} ms  p99 ${m.p99Ms} ms  ${m.serverCpuUsPerRequest} µs CPU/request` +
              (m.non2xx || m.errors ? `  (${m.non2xx} non-2xx, ${m.errors} errors)` : ''),
          );
        }
      } finally {
        await running.stop();
      }
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}, load average ${os.loadavg()[0].toFixed(1)} at the end`;
  console.log(
    `\n${machine}. autocannon, ${CONNECTIONS} connections, ${SECONDS} s per measurement after ${WARMUP_S} s warm-up, ` +
      'on the same machine as every server process. With 2 cores, two instances cannot run in parallel ' +
      'with the load generator, PostgreSQL, Redis and HAProxy: this shows what each part costs per request, ' +
      'not how far more machines would scale.',
  );
  const out = path.join(__dirname, 'results');
  mkdirSync(out, { recursive: true });
  writeFileSync(
    path.join(out, 'scaled.json'),
    JSON.stringify({ machine, seconds: SECONDS, connections: CONNECTIONS, results }, null, 2),
  );
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
