import request from 'supertest';
import { CONSOLE_HEADERS, givePasswords, TEST_EMAILS, TEST_PASSWORD } from '../support/console-session';
import { createTestContext, type TestContext } from '../support/test-context';

// Online guessing: NIST SP 800-63B §5.2.2 (rate limiting) and the OWASP Authentication Cheat Sheet
// ("authentication responses" — one generic answer whatever was wrong; lockout that an attacker cannot
// turn against the user). The limits are the service's documented ones: 5 free failures per account
// from one address and 20 per address, then waits that double from 1 s.

const PER_PAIR = 5;
const PER_ADDRESS = 20;

/** A sign-in from a client address (the test service trusts one proxy hop, so X-Forwarded-For names it). */
const attempt = (ctx: TestContext, email: string, password: string, from = '198.51.100.7') =>
  request(ctx.app)
    .post('/auth/session')
    .set(CONSOLE_HEADERS)
    .set('X-Forwarded-For', from)
    .send({ email, password });
const behindProxy = { env: { TRUST_PROXY_HOPS: '1' } };

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

describe('throttling one account from one address', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext(behindProxy);
    await givePasswords(ctx);
  });
  afterAll(() => ctx.close());

  it(`makes that address wait after ${PER_PAIR} failures for the account, even with the right password`, async () => {
    for (let i = 0; i < PER_PAIR; i++) {
      expect((await attempt(ctx, TEST_EMAILS.developer, `guess-number-${i}`)).status).toBe(401);
    }
    // The sixth failure starts the first wait.
    expect((await attempt(ctx, TEST_EMAILS.developer, 'guess-number-x')).status).toBe(401);
    const blocked = await attempt(ctx, TEST_EMAILS.developer, TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(blocked.headers['retry-after']).toBe('1');
    // Case and spaces do not make a new account to guess at.
    expect((await attempt(ctx, ' DEV@test.example', TEST_PASSWORD)).status).toBe(429);
    // Other accounts from the same address are not held up by it.
    expect((await attempt(ctx, TEST_EMAILS.viewer, TEST_PASSWORD)).status).toBe(200);
  });

  it('cannot lock the real user out from another address', async () => {
    for (let i = 0; i < 40; i++) {
      const res = await attempt(ctx, TEST_EMAILS.admin, `guess-${i}`, '203.0.113.66');
      expect([401, 429]).toContain(res.status);
    }
    expect((await attempt(ctx, TEST_EMAILS.admin, 'guess-more', '203.0.113.66')).status).toBe(429);
    const user = await attempt(ctx, TEST_EMAILS.admin, TEST_PASSWORD, '192.0.2.10');
    expect(user.status).toBe(200);
  });

  it('lets a burst of parallel guesses through no further than the free failures and one more', async () => {
    const burst = await Promise.all(
      Array.from({ length: 20 }, (_, i) => attempt(ctx, TEST_EMAILS.other, `parallel-${i}`, '203.0.113.99')),
    );
    const statuses = burst.map((r) => r.status);
    expect(statuses.filter((s) => s === 401)).toHaveLength(PER_PAIR + 1);
    expect(statuses.filter((s) => s === 429)).toHaveLength(20 - PER_PAIR - 1);
  });

  it('does not count successful sign-ins, and a success forgets earlier failures of the pair', async () => {
    for (let i = 0; i < PER_PAIR - 1; i++) {
      expect((await attempt(ctx, TEST_EMAILS.viewer, `typo-${i}`, '192.0.2.20')).status).toBe(401);
    }
    expect((await attempt(ctx, TEST_EMAILS.viewer, TEST_PASSWORD, '192.0.2.20')).status).toBe(200);
    for (let i = 0; i < PER_PAIR; i++) {
      expect((await attempt(ctx, TEST_EMAILS.viewer, `typo-again-${i}`, '192.0.2.20')).status).toBe(401);
    }
    for (let i = 0; i < PER_PAIR + 2; i++) {
      expect((await attempt(ctx, TEST_EMAILS.developer, TEST_PASSWORD, '192.0.2.30')).status).toBe(200);
    }
  });
});

describe('throttling per client address', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext(behindProxy);
    await givePasswords(ctx);
  });
  afterAll(() => ctx.close());

  it(`answers 429 after ${PER_ADDRESS} failures from one address spread over many accounts`, async () => {
    for (let i = 0; i <= PER_ADDRESS; i++) {
      expect((await attempt(ctx, `sprayed-${i}@test.example`, 'Winter2026!')).status).toBe(401);
    }
    const blocked = await attempt(ctx, 'sprayed-last@test.example', 'Winter2026!');
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect((await attempt(ctx, TEST_EMAILS.admin, TEST_PASSWORD)).status).toBe(429);
    // Refused attempts are not even checked, so they leave no audit rows: a flood cannot fill the table.
    expect(await ctx.db.models.AuditEvent.count({ where: { action: 'session.signInFailed' } })).toBe(
      PER_ADDRESS + 1,
    );
    // Another address is not affected.
    expect((await attempt(ctx, TEST_EMAILS.admin, TEST_PASSWORD, '192.0.2.44')).status).toBe(200);
  });

  it('throttles invitation tokens guessed from one address', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 13; i++) {
      const res = await request(ctx.app)
        .post('/auth/invitations/accept')
        .set(CONSOLE_HEADERS)
        .set('X-Forwarded-For', '198.51.100.200')
        .send({ token: `guessed-token-${i}`.padEnd(43, 'x'), password: 'long-enough-password' });
      statuses.push(res.status);
    }
    // Ten free failures, the eleventh starts the wait.
    expect(statuses).toEqual([...Array(11).fill(400), 429, 429]);
  });
});
