import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { KEY_PATTERN } from '../auth/key-secret';
import { KeyStore } from '../auth/key-store';
import { loadConfig, projectRoot } from '../config';
import { openDatabase } from '../db/database';
import { createServices } from '../services';
import { runCli } from './run-cli';

let dir: string;
let env: Record<string, string>;

beforeEach(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'isochron-cli-'));
  env = {
    NODE_ENV: 'test',
    DATABASE_URL: `sqlite:${path.join(dir, 'cli.sqlite')}`,
    ISOCHRON_KEY_HASH_SECRET: 'cli-test-key-hash-secret-0123456789abcdef',
    ISOCHRON_SESSION_SECRET: 'cli-test-session-secret-0123456789abcdef',
    LOG_LEVEL: 'silent',
  };
});

afterEach(() => {
  rmSync(dir, { recursive: true, force: true });
});

async function cli(...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  const out: string[] = [];
  const err: string[] = [];
  const code = await runCli(argv, { out: (l) => out.push(l), err: (l) => err.push(l) }, () =>
    createServices(loadConfig(env)),
  );
  return { code, out: out.join('\n'), err: err.join('\n') };
}

async function withDatabase<T>(
  work: (db: Awaited<ReturnType<typeof openDatabase>>) => Promise<T>,
): Promise<T> {
  const db = await openDatabase(env.DATABASE_URL);
  try {
    return await work(db);
  } finally {
    await db.close();
  }
}

describe('users create', () => {
  it('creates an invited user and prints a one-time link whose token is stored only as its SHA-256', async () => {
    const before = Date.now();
    const res = await cli('users', 'create', '--email', 'Ops@Kestrel.example', '--role', 'admin');
    expect(res.code).toBe(0);
    const url = /(http\S+accept-invitation\?token=\S+)/.exec(res.out)![1];
    expect(url.startsWith('http://localhost:8080/accept-invitation?token=')).toBe(true);
    const token = new URL(url).searchParams.get('token')!;
    await withDatabase(async (db) => {
      const user = await db.models.User.findOne({ where: { email: 'ops@kestrel.example' } });
      expect(user).toMatchObject({ role: 'admin', status: 'invited', passwordHash: null });
      const invitation = await db.models.Invitation.findOne({ where: { userId: user!.id } });
      // SHA-256 computed here with node:crypto, independently of the code under test.
      expect(invitation!.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
      const lifetimeDays = (invitation!.expiresAt.getTime() - before) / 86_400_000;
      expect(lifetimeDays).toBeGreaterThan(6.99);
      expect(lifetimeDays).toBeLessThan(7.01);
    });
  });

  it('refuses a taken address with exit code 1, and bad arguments with 2', async () => {
    await cli('users', 'create', '--email', 'ops@kestrel.example', '--role', 'admin');
    const taken = await cli('users', 'create', '--email', 'ops@kestrel.example', '--role', 'viewer');
    expect(taken.code).toBe(1);
    expect(taken.err).toContain('already exists');
    expect((await cli('users', 'create', '--email', 'ops@kestrel.example', '--role', 'owner')).code).toBe(2);
    expect((await cli('users', 'create', '--role', 'viewer')).err).toContain('--email is required');
  });
});

describe('keys', () => {
  it('create prints the key once; only its hash is stored, and list never shows it', async () => {
    await cli('users', 'create', '--email', 'ops@kestrel.example', '--role', 'admin');
    const created = await cli('keys', 'create', '--name', 'Render farm checks', '--role', 'calculate');
    expect(created.code).toBe(0);
    const secret = /(iso_live_\S+)/.exec(created.out)![1];
    expect(secret).toMatch(KEY_PATTERN);
    expect(created.out.split(secret)).toHaveLength(2);

    const listed = await cli('keys', 'list');
    expect(listed.code).toBe(0);
    expect(listed.out).toContain('Render farm checks');
    expect(listed.out).toContain(`${secret.slice(0, 13)}…${secret.slice(-4)}`);
    expect(listed.out).not.toContain(secret);

    await withDatabase(async (db) => {
      const store = new KeyStore(db.models, env.ISOCHRON_KEY_HASH_SECRET);
      const found = await store.findActive(secret);
      expect(found).toMatchObject({ role: 'calculate' });
      const row = await db.models.ApiKey.findByPk(found!.id);
      expect(JSON.stringify(row!.toJSON())).not.toContain(secret);
      const audit = await db.models.AuditEvent.findOne({
        where: { action: 'key.created', targetId: found!.id },
      });
      expect(JSON.parse(audit!.details!)).toMatchObject({ via: 'operator command line' });
    });
  });

  it('revoke stops the key; an unknown id exits 1, a malformed one 2', async () => {
    await cli('users', 'create', '--email', 'ops@kestrel.example', '--role', 'admin');
    const created = JSON.parse(
      (await cli('keys', 'create', '--name', 'Old', '--role', 'admin', '--json')).out,
    );
    const revoked = await cli('keys', 'revoke', created.id);
    expect(revoked.code).toBe(0);
    await withDatabase(async (db) => {
      expect(
        await new KeyStore(db.models, env.ISOCHRON_KEY_HASH_SECRET).findActive(created.secret),
      ).toBeNull();
    });
    const unknown = await cli('keys', 'revoke', 'key_0000000000000000000zz');
    expect(unknown.code).toBe(1);
    expect(unknown.err).toContain('No key key_0000000000000000000zz');
    expect((await cli('keys', 'revoke', 'not-a-key')).code).toBe(2);
    expect((await cli('keys', 'revoke')).code).toBe(2);
  });

  it('names each bad argument and exits 2', async () => {
    const cases: Array<[string[], string]> = [
      [['keys', 'create', '--role', 'calculate'], '--name is required'],
      [['keys', 'create', '--name', 'x', '--role', 'root'], '--role must be'],
      [['keys', 'create', '--name', 'x', '--role', 'admin', '--rate-limit', '2.5'], '--rate-limit must be'],
      [['keys', 'create', '--name', 'x', '--role', 'admin', '--expires', 'soon'], '--expires must be'],
      [['keys', 'create', '--name', 'x', '--role', 'admin', '--colour', 'red'], "Unknown option '--colour'"],
      [['keys', 'rotate'], 'Unknown keys command'],
      [['rooms'], 'Unknown command'],
    ];
    for (const [argv, message] of cases) {
      const res = await cli(...argv);
      expect(res.code).toBe(2);
      expect(res.err).toContain(message);
    }
  });

  it('refuses a key for an unknown owner, or with no admin to own it, with exit code 1', async () => {
    const noAdmin = await cli('keys', 'create', '--name', 'x', '--role', 'calculate');
    expect(noAdmin.code).toBe(1);
    expect(noAdmin.err).toContain('No admin user exists yet');
    const unknown = await cli(
      'keys',
      'create',
      '--name',
      'x',
      '--role',
      'calculate',
      '--owner',
      'nobody@x.example',
    );
    expect(unknown.code).toBe(1);
  });
});

describe('the npm run isochron entry point', () => {
  it('exits non-zero with the message on bad arguments', () => {
    const result = spawnSync(
      process.execPath,
      ['--import', 'tsx', 'api/cli/main.ts', 'keys', 'create', '--role', 'x'],
      {
        cwd: projectRoot,
        env: { ...process.env, ...env },
        encoding: 'utf8',
      },
    );
    expect(result.status).toBe(2);
    expect(result.stderr).toContain('--name is required');
    expect(result.stdout).toBe('');
  });
});
