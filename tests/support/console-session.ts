import request from 'supertest';
import { hashPassword } from '../../api/auth/password';
import type { TestContext } from './test-context';

/** The header the console sends on every state-changing request (the CSRF guard wants it). */
export const CONSOLE_HEADERS = { 'X-Requested-With': 'isochron-console' } as const;

/** Password given to the test users; long enough for the server's rules, never stored in clear. */
export const TEST_PASSWORD = 'tilted-mid-side-7714';

export const TEST_EMAILS = {
  admin: 'admin@test.example',
  developer: 'dev@test.example',
  viewer: 'viewer@test.example',
  other: 'other@test.example',
} as const;

/** The test context's users have no password; give them one (hashed, as the service would). */
export async function givePasswords(ctx: TestContext, password = TEST_PASSWORD): Promise<void> {
  const passwordHash = await hashPassword(password);
  await ctx.db.write((transaction) =>
    ctx.db.models.User.update({ passwordHash }, { where: {}, transaction }),
  );
}

/** A supertest agent that keeps cookies, signed in as one of the test users. */
export async function signedInAgent(
  ctx: TestContext,
  who: keyof typeof TEST_EMAILS,
  password = TEST_PASSWORD,
): Promise<ReturnType<typeof request.agent>> {
  const agent = request.agent(ctx.app);
  const res = await agent
    .post('/auth/session')
    .set(CONSOLE_HEADERS)
    .send({ email: TEST_EMAILS[who], password });
  if (res.status !== 200)
    throw new Error(`sign-in as ${who} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** The value of the session cookie a response sets, or undefined. */
export function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const cookies = (res.headers['set-cookie'] as string[] | undefined) ?? [];
  const cookie = cookies.find((c) => c.startsWith('isochron.sid=') && !c.startsWith('isochron.sid=;'));
  return cookie?.split(';')[0].slice('isochron.sid='.length);
}

/** The session id inside a signed cookie value (`s:<id>.<signature>`, URL-encoded). */
export function sessionIdOf(cookieValue: string): string {
  const decoded = decodeURIComponent(cookieValue);
  return decoded.slice(2, decoded.lastIndexOf('.'));
}
