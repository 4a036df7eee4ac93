import request from 'supertest';
import { CONSOLE_HEADERS, givePasswords, TEST_EMAILS, TEST_PASSWORD } from '../support/console-session';
import { createTestContext, type TestContext } from '../support/test-context';

// Online guessing: NIST SP 800-63B §5.2.2 (rate limiting) and the OWASP Authentication Cheat Sheet
// ("authentication responses" — one generic answer whatever was wrong). The limits are the service's
// documented ones: 10 failures per account and 30 per client address in 15 minutes.

const PER_ACCOUNT = 10;
const PER_ADDRESS = 30;

const attempt = (ctx: TestContext, email: string, password: string) =>
  request(ctx.app).post('/auth/session').set(CONSOLE_HEADERS).send({ email, password });

/** The parts of a refusal a guesser can see, minus what differs on every request. */
function visible(res: request.Response) {
  const { requestId: _requestId, ...body } = res.body;
  return { status: res.status, type: res.headers['content-type'], body, cookie: res.headers['set-cookie'] };
}

describe('one answer for every failed sign-in', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
    await givePasswords(ctx);
    await ctx.db.write(async (t) => {
      await ctx.db.models.User.update(
        { status: 'disabled' },
        { where: { id: ctx.users.other }, transaction: t },
      );
      await ctx.db.models.User.update(
        { status: 'invited', passwordHash: null },
        { where: { id: ctx.users.viewer }, transaction: t },
      );
    });
  });
  afterAll(() => ctx.close());

  it('answers an unknown address, a wrong password, a not-yet-activated and a disabled account alike', async () => {
    const unknown = visible(await attempt(ctx, 'nobody@test.example', TEST_PASSWORD));
    const wrongPassword = visible(await attempt(ctx, TEST_EMAILS.admin, 'wrong-password-123'));
    const notActivated = visible(await attempt(ctx, TEST_EMAILS.viewer, TEST_PASSWORD));
    const disabled = visible(await attempt(ctx, TEST_EMAILS.other, TEST_PASSWORD));
    expect(unknown.status).toBe(401);
    expect(unknown.body).toMatchObject({
      title: 'Sign-in failed',
      detail: 'The e-mail address or the password is wrong.',
    });
    expect(wrongPassword).toEqual(unknown);
    expect(notActivated).toEqual(unknown);
    expect(disabled).toEqual(unknown);
  });

  it('audits each failure with its real reason, without the password, and without an unknown address', async () => {
    const events = await ctx.db.models.AuditEvent.findAll({ where: { action: 'session.signInFailed' } });
    const reasons = events.map((e) => JSON.parse(e.details!).reason).sort();
    expect(reasons).toEqual(['disabled', 'notActivated', 'unknownEmail', 'wrongPassword']);
    const all = JSON.stringify(events.map((e) => e.toJSON()));
    expect(all).not.toContain('wrong-password-123');
    expect(all).not.toContain(TEST_PASSWORD);
    expect(all).not.toContain('nobody@test.example');
    const wrong = events.find((e) => JSON.parse(e.details!).reason === 'wrongPassword')!;
    expect(wrong.targetId).toBe(ctx.users.admin);
    expect(wrong.ipAddress).toMatch(/127\.0\.0\.1/);
  });

  it('tries SQL in the e-mail field and gets the ordinary refusal', async () => {
    for (const email of ["' OR '1'='1' --", "admin@test.example' --", '"; DROP TABLE users; --']) {
      const res = await attempt(ctx, email, "' OR '1'='1");
      expect(res.status).toBe(401);
    }
    expect(await ctx.db.models.User.count()).toBe(4);
  });
});

describe('throttling per account', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
    await givePasswords(ctx);
  });
  afterAll(() => ctx.close());

  it(`answers 429 with Retry-After after ${PER_ACCOUNT} failures for one address, even for the right password`, async () => {
    for (let i = 0; i < PER_ACCOUNT; i++) {
      expect((await attempt(ctx, TEST_EMAILS.developer, `guess-number-${i}`)).status).toBe(401);
    }
    const blocked = await attempt(ctx, TEST_EMAILS.developer, 'guess-number-x');
    expect(blocked.status).toBe(429);
    expect(blocked.headers['content-type']).toMatch(/application\/problem\+json/);
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
    // Case and spaces do not make a new account to guess at.
    expect((await attempt(ctx, ' DEV@test.example', TEST_PASSWORD)).status).toBe(429);
    // Other accounts from the same address are not locked out by it.
    expect((await attempt(ctx, TEST_EMAILS.viewer, TEST_PASSWORD)).status).toBe(200);
  });

  it('does not count successful sign-ins', async () => {
    for (let i = 0; i < PER_ACCOUNT + 2; i++) {
      expect((await attempt(ctx, TEST_EMAILS.admin, TEST_PASSWORD)).status).toBe(200);
    }
  });
});

describe('throttling per client address', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
    await givePasswords(ctx);
  });
  afterAll(() => ctx.close());

  it(`answers 429 after ${PER_ADDRESS} failures from one address spread over many accounts`, async () => {
    for (let i = 0; i < PER_ADDRESS; i++) {
      expect((await attempt(ctx, `sprayed-${i}@test.example`, 'Winter2026!')).status).toBe(401);
    }
    const blocked = await attempt(ctx, 'sprayed-last@test.example', 'Winter2026!');
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect((await attempt(ctx, TEST_EMAILS.admin, TEST_PASSWORD)).status).toBe(429);
    // Refused attempts are not even checked, so they leave no audit rows: a flood cannot fill the table.
    expect(await ctx.db.models.AuditEvent.count({ where: { action: 'session.signInFailed' } })).toBe(
      PER_ADDRESS,
    );
  });

  it('throttles invitation tokens guessed from one address', async () => {
    let last = 0;
    for (let i = 0; i <= PER_ADDRESS; i++) {
      const res = await request(ctx.app)
        .post('/auth/invitations/accept')
        .set(CONSOLE_HEADERS)
        .send({ token: `guessed-token-${i}`.padEnd(43, 'x'), password: 'long-enough-password' });
      last = res.status;
      if (i < PER_ADDRESS) expect(res.status).toBe(400);
    }
    expect(last).toBe(429);
  });
});
