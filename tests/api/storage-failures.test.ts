import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { projectRoot } from '../../api/config';
import { STARTS_THE_SERVICE_MS } from '../support/service-process';
import { openDatabase } from '../../api/db/database';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { CONSOLE_HEADERS, givePasswords, TEST_EMAILS, TEST_PASSWORD } from '../support/console-session';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

// These failures are the SQLite file's own (a read-only file, a full disk as SQLite's page limit, a
// file that cannot be opened), so this file runs on SQLite in every run; PostgreSQL's read-only and
// unreachable server are checked by tests/scaled/.
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ engine: 'sqlite' });
  await givePasswords(ctx);
});
afterAll(async () => {
  await ctx.close();
});

const as = (req: request.Test) => req.set('Authorization', `Bearer ${ctx.keys.tuning}`);
const createRoom = (notes = 'storage test') =>
  as(request(ctx.app).post('/v1/rooms')).send({ ...structuredClone(STAGE3_ROOM), notes });

function expectStorageProblem(res: request.Response, type: string): void {
  expect([res.status, res.body.type]).toEqual([503, `https://isochron.dev/problems/${type}`]);
  expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  expect(res.body.detail).toMatch(/nothing was stored/);
}

/** Runs `during` with a statement added to every new database connection (every write transaction). */
async function withPragma(pragma: string, during: () => Promise<void>): Promise<void> {
  ctx.db.connectionPragmas.push(pragma);
  try {
    await during();
  } finally {
    ctx.db.connectionPragmas.pop();
  }
}

describe('a database that has become read-only', () => {
  it('answers every write with 503 storage-read-only, readiness says so, and both recover', async () => {
    await withPragma('PRAGMA query_only = ON', async () => {
      expectStorageProblem(await createRoom(), 'storage-read-only');
      const key = await request(ctx.app)
        .post('/v1/keys')
        .set('Authorization', `Bearer ${ctx.keys.admin}`)
        .send({ name: 'During the outage', role: 'calculate' });
      expectStorageProblem(key, 'storage-read-only');
      // Signing in writes a session: the same clear answer, not a 500.
      const signIn = await request(ctx.app)
        .post('/auth/session')
        .set(CONSOLE_HEADERS)
        .send({ email: TEST_EMAILS.developer, password: TEST_PASSWORD });
      expectStorageProblem(signIn, 'storage-read-only');
      // Reads still work.
      expect((await as(request(ctx.app).get('/v1/rooms'))).status).toBe(200);

      const ready = await request(ctx.app).get('/readyz');
      expectStorageProblem(ready, 'storage-read-only');
      expectToMatchContract('getReadiness', 503, ready.body);
    });
    const ready = await request(ctx.app).get('/readyz');
    expect([ready.status, ready.body.status]).toEqual([200, 'ready']);
    expect((await createRoom()).status).toBe(201);
  });
});

describe('a full disk', () => {
  it('answers writes that need space with 503 storage-full, readiness says so, and both recover', async () => {
    const { page_count: pages } = (await ctx.db.sequelize.query('PRAGMA page_count', { plain: true })) as {
      page_count: number;
    };
    // SQLite's page limit stands in for the disk: the file cannot grow past its present size.
    await withPragma(`PRAGMA max_page_count = ${pages}`, async () => {
      const statuses: number[] = [];
      let refused: request.Response | undefined;
      for (let i = 0; i < 40 && !refused; i += 1) {
        const res = await createRoom('x'.repeat(2000));
        statuses.push(res.status);
        if (res.status !== 201) refused = res;
      }
      expect(statuses.slice(0, -1).every((s) => s === 201)).toBe(true);
      expectStorageProblem(refused!, 'storage-full');
      expectStorageProblem(await request(ctx.app).get('/readyz'), 'storage-full');
    });
    expect((await request(ctx.app).get('/readyz')).status).toBe(200);
  });
});

describe('start-up on a read-only database file', () => {
  it(
    'prints one readable message naming the file and what to do, without a stack trace, and exits 1',
    async () => {
      const dir = mkdtempSync(path.join(tmpdir(), 'isochron-readonly-'));
      const file = path.join(dir, 'ro.sqlite');
      try {
        const db = await openDatabase(`sqlite:${file}`);
        await db.close();
        chmodSync(file, 0o444);
        chmodSync(dir, 0o555);
        // Root writes read-only files anyway: run the service as an unprivileged user then.
        const asUser = process.getuid?.() === 0 ? { uid: 65534, gid: 65534 } : {};
        const result = spawnSync(process.execPath, ['--import', 'tsx', 'api/main.ts'], {
          cwd: projectRoot,
          ...asUser,
          env: {
            PATH: process.env.PATH,
            NODE_ENV: 'test',
            PORT: '0',
            DATABASE_URL: `sqlite:${file}`,
            ISOCHRON_KEY_HASH_SECRET: 'readonly-test-key-hash-secret-0123456789',
            ISOCHRON_SESSION_SECRET: 'readonly-test-session-secret-0123456789',
            SEED_DEMO_DATA: 'false',
            TSX_TSCONFIG_PATH: path.join(projectRoot, 'tsconfig.json'),
          },
          encoding: 'utf8',
          timeout: 60_000,
        });
        expect(result.status).toBe(1);
        expect(result.stderr).toContain(`Isochron cannot start. Cannot write ${file}`);
        expect(result.stderr).toMatch(/SQLITE_READONLY|SQLITE_CANTOPEN/);
        expect(result.stderr).not.toMatch(/^\s+at /m);
      } finally {
        chmodSync(dir, 0o755);
        rmSync(dir, { recursive: true, force: true });
      }
    },
    STARTS_THE_SERVICE_MS,
  );
});
