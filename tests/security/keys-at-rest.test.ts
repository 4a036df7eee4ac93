import { Writable } from 'node:stream';
import pino from 'pino';
import request from 'supertest';
import { createApp } from '../../api/app';
import { hashKeySecret } from '../../api/auth/key-secret';
import { storedBytes } from '../support/stored-bytes';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });

beforeAll(async () => {
  ctx = await createTestContext();
});

afterAll(async () => {
  await ctx.close();
});

describe('keys at rest', () => {
  it('no clear key is anywhere in what the service stores; only its HMAC is', async () => {
    const created: Array<{ secret: string; id: string }> = [];
    for (const role of ['calculate', 'tuning', 'admin']) {
      const res = await request(ctx.app)
        .post('/v1/keys')
        .set(bearer(ctx.keys.admin))
        .send({ name: `At rest ${role}`, role, ownerId: ctx.users.admin });
      expect(res.status).toBe(201);
      created.push(res.body);
      await request(ctx.app).get('/v1/layouts').set(bearer(res.body.secret)).expect(200);
    }
    await ctx.services.usage.flush();
    const secrets = [...created.map((c) => c.secret), ...Object.values(ctx.keys)];
    const bytes = await storedBytes(ctx);

    // The files were read with their content: the keys' names and hashes are there.
    expect(bytes.includes('At rest admin')).toBe(true);
    for (const secret of secrets) {
      expect(bytes.includes(hashKeySecret(secret, ctx.services.config.keyHashSecret))).toBe(true);
    }
    for (const secret of secrets) {
      const random = secret.replace(/^iso_(live|test)_/, '');
      expect(bytes.includes(secret)).toBe(false);
      expect(bytes.includes(random)).toBe(false);
      // Nor as UTF-16, in case any layer stored wide text.
      expect(bytes.includes(Buffer.from(random, 'utf16le'))).toBe(false);
      // Nor a long piece of it: the stored prefix and last four leave 35 characters never written.
      expect(bytes.includes(random.slice(4, 39))).toBe(false);
    }
    expect(bytes.includes(ctx.services.config.keyHashSecret)).toBe(false);
  });
});

describe('logs', () => {
  it('carry no key, no hash secret and no session secret, whatever happens', async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _encoding, done) {
        lines.push(String(chunk));
        done();
      },
    });
    // The most talkative logger there is, with no redaction: nothing secret may reach it at all.
    ctx.services.logger = pino({ level: 'trace' }, sink);
    const app = createApp(ctx.services);

    const created = await request(app)
      .post('/v1/keys')
      .set(bearer(ctx.keys.admin))
      .send({ name: 'Logged key', role: 'calculate' });
    expect(created.status).toBe(201);
    const { secret, id } = created.body;
    await request(app).get('/v1/layouts').set(bearer(secret)).expect(200);
    await request(app).get(`/v1/layouts?access_token=${secret}`).expect(400);
    await request(app).post('/v1/biquads').send({ access_token: secret }).expect(400);
    await request(app).get('/v1/layouts').set('Authorization', `Bearer ${secret}x`).expect(401);
    await request(app).get('/v1/layouts').set('Authorization', `Basic ${secret}`).expect(401);
    await request(app)
      .post('/v1/biquads')
      .set(bearer(secret))
      .set('Content-Type', 'application/json')
      .send(`{"broken": "${secret}`)
      .expect(400);
    await request(app).delete(`/v1/keys/${id}`).set(bearer(ctx.keys.admin)).expect(200);
    await request(app).get('/v1/layouts').set(bearer(secret)).expect(401);

    const log = lines.join('');
    // The log did record the key's life, by id.
    expect(log).toContain(id);
    expect(log).toContain('API key created');
    expect(log).toContain('API key revoked');
    for (const value of [
      secret,
      secret.slice(9),
      ...Object.values(ctx.keys),
      ctx.services.config.keyHashSecret,
      ctx.services.config.sessionSecret,
      hashKeySecret(secret, ctx.services.config.keyHashSecret),
    ]) {
      expect(log).not.toContain(value);
    }
  });
});
