import http from 'node:http';
import { Client } from 'pg';
import { createClient } from 'redis';
import { QueryTypes } from 'sequelize';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { CONSOLE_HEADERS, sessionCookie } from '../support/console-session';
import { burst, type BurstOutcome } from '../support/http-burst';
import { testPostgresUrl, testRedisUrl } from '../support/engines';
import { STARTS_THE_SERVICE_MS } from '../support/service-process';
import { RIG_PASSWORD, startScaledRig, type ScaledRig } from './support/scaled-rig';

/**
 * Three instances behind HAProxy on one PostgreSQL database and one Redis: they must behave as one
 * service. Started once for the file; the SIGTERM case runs last, since it stops an instance.
 */
let rig: ScaledRig;
let adminId: string;
let adminKey: string;

beforeAll(async () => {
  rig = await startScaledRig(3);
  adminId = await rig.addUser('admin', 'admin@scaled.example', RIG_PASSWORD);
  adminKey = (await rig.addKey('admin', adminId)).secret;
}, STARTS_THE_SERVICE_MS * 2);

afterAll(async () => {
  await rig?.close();
}, STARTS_THE_SERVICE_MS);

interface Answer {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: string;
}

/** One request to one port (an instance's own, or the proxy's). */
function call(
  port: number,
  method: string,
  path: string,
  headers: Record<string, string> = {},
  body?: unknown,
): Promise<Answer> {
  const payload = body === undefined ? undefined : JSON.stringify(body);
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        method,
        path,
        headers: {
          ...headers,
          ...(payload !== undefined && {
            'Content-Type': 'application/json',
            'Content-Length': Buffer.byteLength(payload),
          }),
        },
      },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (chunk: string) => (text += chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text }));
      },
    );
    req.on('error', reject);
    req.end(payload);
  });
}

const bearer = (key: string) => ({ Authorization: `Bearer ${key}` });
const statuses = (outcomes: BurstOutcome[]) =>
  outcomes.reduce<Record<string, number>>((tally, o) => {
    const name = 'status' in o ? String(o.status) : o.error;
    tally[name] = (tally[name] ?? 0) + 1;
    return tally;
  }, {});

describe('three instances behind the proxy', () => {
  it('readiness names PostgreSQL and Redis on every instance', async () => {
    for (const instance of rig.instances) {
      const ready = await call(instance.port, 'GET', '/readyz');
      expect([ready.status, JSON.parse(ready.body)]).toEqual([
        200,
        {
          status: 'ready',
          dependencies: [
            { name: 'database', engine: 'postgresql', status: 'up' },
            { name: 'redis', engine: 'redis', status: 'up' },
          ],
        },
      ]);
    }
  });

  it(
    'a key at 100 requests per minute gets exactly 100 through the instances under 64 connections',
    async () => {
      const ownerId = await rig.addUser('developer', 'limited@scaled.example');
      const { secret } = await rig.addKey('calculate', ownerId, 100);
      const outcomes = await burst(
        rig.proxyPort,
        Array.from({ length: 300 }, () => ({
          method: 'GET' as const,
          path: '/v1/layouts/5.1',
          headers: bearer(secret),
        })),
        { sockets: 64 },
      );
      expect(statuses(outcomes)).toEqual({ '200': 100, '429': 200 });
      // Without the shared count each instance would have let its own 100 through.
    },
    STARTS_THE_SERVICE_MS,
  );

  it('a session made through one instance works through the others', async () => {
    const email = 'console@scaled.example';
    const userId = await rig.addUser('developer', email, RIG_PASSWORD);
    const [first, ...others] = rig.instances;
    const signIn = await call(
      first.port,
      'POST',
      '/auth/session',
      { ...CONSOLE_HEADERS, Origin: rig.publicUrl },
      { email, password: RIG_PASSWORD },
    );
    expect(signIn.status).toBe(200);
    const cookie = `isochron.sid=${sessionCookie(signIn)!}`;
    for (const instance of others) {
      const session = await call(instance.port, 'GET', '/auth/session', { Cookie: cookie });
      expect([session.status, JSON.parse(session.body).user?.id]).toEqual([200, userId]);
      const me = await call(instance.port, 'GET', '/v1/users/me', { Cookie: cookie });
      expect([me.status, JSON.parse(me.body).id]).toEqual([200, userId]);
    }
    // Signing out through the last instance ends the session on the first one too.
    const out = await call(others[1].port, 'DELETE', '/auth/session', {
      ...CONSOLE_HEADERS,
      Origin: rig.publicUrl,
      Cookie: cookie,
    });
    expect(out.status).toBe(204);
    expect((await call(first.port, 'GET', '/auth/session', { Cookie: cookie })).status).toBe(401);
  });

  it('a revoked key is refused by every instance within one second, caches warm', async () => {
    const ownerId = await rig.addUser('developer', 'revoked@scaled.example');
    const { id, secret } = await rig.addKey('calculate', ownerId);
    // Each instance has the key in its one-second cache.
    for (const instance of rig.instances) {
      expect((await call(instance.port, 'GET', '/v1/layouts/5.1', bearer(secret))).status).toBe(200);
    }
    const revoked = await call(rig.instances[0].port, 'DELETE', `/v1/keys/${id}`, bearer(adminKey));
    expect(revoked.status).toBe(200);
    const at = Date.now();
    const refusals = await Promise.all(
      rig.instances.map(async (instance) => {
        for (;;) {
          const res = await call(instance.port, 'GET', '/v1/layouts/5.1', bearer(secret));
          if (res.status === 401) return Date.now() - at;
          if (Date.now() - at > 5000) return Infinity;
        }
      }),
    );
    console.log(`revoked key refused by the 3 instances after ${refusals.join(', ')} ms`);
    for (const ms of refusals) expect(ms).toBeLessThan(1000);
  });

  it('a demoted owner’s key is refused by every instance within one second, caches warm', async () => {
    const ownerId = await rig.addUser('developer', 'demoted@scaled.example');
    const { secret } = await rig.addKey('tuning', ownerId);
    for (const instance of rig.instances) {
      expect((await call(instance.port, 'GET', '/v1/rooms', bearer(secret))).status).toBe(200);
    }
    const demoted = await call(rig.instances[1].port, 'PATCH', `/v1/users/${ownerId}`, bearer(adminKey), {
      role: 'viewer',
    });
    expect(demoted.status).toBe(200);
    const at = Date.now();
    const refusals = await Promise.all(
      rig.instances.map(async (instance) => {
        for (;;) {
          const res = await call(instance.port, 'GET', '/v1/rooms', bearer(secret));
          if (res.status === 403 && JSON.parse(res.body).type.endsWith('/key-owner-role'))
            return Date.now() - at;
          if (Date.now() - at > 5000) return Infinity;
        }
      }),
    );
    console.log(`demoted owner's key refused by the 3 instances after ${refusals.join(', ')} ms`);
    for (const ms of refusals) expect(ms).toBeLessThan(1000);
  });

  it(
    '500 concurrent edits of one tuning through the instances get distinct consecutive versions, no 5xx',
    async () => {
      const ownerId = await rig.addUser('developer', 'editor@scaled.example');
      const { secret } = await rig.addKey('tuning', ownerId);
      const room = await call(rig.proxyPort, 'POST', '/v1/rooms', bearer(secret), STAGE3_ROOM);
      expect(room.status).toBe(201);
      const tuning = await call(
        rig.proxyPort,
        'POST',
        `/v1/rooms/${JSON.parse(room.body).id}/tunings`,
        bearer(secret),
        {
          name: 'Concurrent edits',
          sampleRateHz: 48000,
          channels: [{ id: 'M+030', delayMs: 1, trimDb: -1 }],
        },
      );
      expect(tuning.status).toBe(201);
      const tuningId = JSON.parse(tuning.body).id as string;
      const outcomes = await burst(
        rig.proxyPort,
        Array.from({ length: 500 }, (_, i) => ({
          method: 'PATCH' as const,
          path: `/v1/tunings/${tuningId}`,
          headers: bearer(secret),
          body: { notes: `edit ${i}` },
        })),
        { sockets: 64 },
      );
      expect(statuses(outcomes)).toEqual({ '200': 500 });
      const versions = outcomes.map((o) =>
        'body' in o && o.body ? (JSON.parse(o.body).version as number) : 0,
      );
      expect([...versions].sort((a, b) => a - b)).toEqual(Array.from({ length: 500 }, (_, i) => i + 2));
      const stored = await rig.db.sequelize.query<{ version: number }>(
        'SELECT version FROM tuning_versions WHERE "tuningId" = :tuningId ORDER BY version',
        { replacements: { tuningId }, type: QueryTypes.SELECT },
      );
      expect(stored.map((r) => r.version)).toEqual(Array.from({ length: 501 }, (_, i) => i + 1));
    },
    STARTS_THE_SERVICE_MS,
  );

  it('readiness names Redis when it stops answering, and the service recovers', async () => {
    const client = createClient({ url: testRedisUrl! });
    await client.connect();
    try {
      // Redis holds every client's commands for 3 s: longer than the service waits for an answer.
      await client.sendCommand(['CLIENT', 'PAUSE', '3000', 'ALL']);
      const ready = await call(rig.instances[0].port, 'GET', '/readyz');
      const body = JSON.parse(ready.body);
      expect([ready.status, body.type, body.dependencies]).toEqual([
        503,
        'https://isochron.dev/problems/shared-state-unavailable',
        [
          { name: 'database', engine: 'postgresql', status: 'up' },
          { name: 'redis', engine: 'redis', status: 'down' },
        ],
      ]);
      expect(Number(ready.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await client.sendCommand(['CLIENT', 'UNPAUSE']);
      await client.close();
    }
    expect((await call(rig.instances[0].port, 'GET', '/readyz')).status).toBe(200);
    expect((await call(rig.instances[0].port, 'GET', '/v1/layouts/5.1', bearer(adminKey))).status).toBe(200);
  });

  it('a PostgreSQL database turned read-only answers writes 503 storage-read-only on every instance, and recovers', async () => {
    const name = new URL(rig.databaseUrl).pathname.slice(1);
    const admin = new Client({ connectionString: testPostgresUrl! });
    await admin.connect();
    // New connections start read-only; the instances' open ones are ended, so they reconnect.
    const reconnectAll = () =>
      admin.query(
        'SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = $1 AND pid <> pg_backend_pid()',
        [name],
      );
    const roomBody = { ...STAGE3_ROOM, notes: 'read-only test' };
    const createRoom = (port: number) => call(port, 'POST', '/v1/rooms', bearer(adminKey), roomBody);
    // A connection ended under a request is answered 503 storage-unavailable first (true: it
    // was gone); the instance then reconnects and meets the read-only database.
    const until = async (port: number, status: number, type?: string) => {
      for (let i = 0; i < 50; i += 1) {
        const res = await createRoom(port);
        if (res.status === status && (type === undefined || JSON.parse(res.body).type === type)) return res;
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
      return createRoom(port);
    };
    try {
      await admin.query(`ALTER DATABASE "${name}" SET default_transaction_read_only = on`);
      await reconnectAll();
      for (const instance of rig.instances) {
        const refused = await until(instance.port, 503, 'https://isochron.dev/problems/storage-read-only');
        expect([refused.status, JSON.parse(refused.body).type]).toEqual([
          503,
          'https://isochron.dev/problems/storage-read-only',
        ]);
        expect((await call(instance.port, 'GET', '/v1/rooms', bearer(adminKey))).status).toBe(200);
      }
      const ready = await call(rig.instances[0].port, 'GET', '/readyz');
      expect([ready.status, JSON.parse(ready.body).dependencies[0]]).toEqual([
        503,
        { name: 'database', engine: 'postgresql', status: 'down' },
      ]);
    } finally {
      await admin.query(`ALTER DATABASE "${name}" RESET default_transaction_read_only`);
      await reconnectAll();
      await admin.end();
    }
    for (const instance of rig.instances) expect((await until(instance.port, 201)).status).toBe(201);
    // Readiness probes at most every two seconds while writes work.
    await new Promise((resolve) => setTimeout(resolve, 2100));
    expect((await call(rig.instances[0].port, 'GET', '/readyz')).status).toBe(200);
  });

  // Last: it stops an instance.
  it(
    'usage counted by all instances adds up exactly to the answered requests, across a SIGTERM of one',
    async () => {
      const ownerId = await rig.addUser('developer', 'metered@scaled.example');
      const { id, secret } = await rig.addKey('calculate', ownerId);
      const stopping = rig.instances[2];
      let stopped: Promise<number | null> | null = null;
      const outcomes = await burst(
        rig.proxyPort,
        Array.from({ length: 900 }, () => ({
          method: 'GET' as const,
          path: '/v1/layouts/5.1',
          headers: bearer(secret),
        })),
        {
          sockets: 32,
          onResponse: (completed) => {
            if (completed === 300) stopped = stopping.stop();
          },
        },
      );
      expect(await stopped).toBe(0);
      // Answers the service gave carry its Request-Id; anything else came from the proxy.
      const answered = outcomes.filter((o) => 'status' in o && o.headers?.['request-id']);
      expect(answered.every((o) => 'status' in o && o.status === 200)).toBe(true);
      expect(answered.length).toBeGreaterThan(850);
      // The instances still running flush every 300 ms; stop them too so every count is written.
      await Promise.all(rig.instances.map((i) => i.stop()));
      const [{ total }] = await rig.db.sequelize.query<{ total: string | null }>(
        'SELECT SUM(count) AS total FROM usage_buckets WHERE "keyId" = :id',
        { replacements: { id }, type: QueryTypes.SELECT },
      );
      expect(Number(total)).toBe(answered.length);
    },
    STARTS_THE_SERVICE_MS,
  );
});
