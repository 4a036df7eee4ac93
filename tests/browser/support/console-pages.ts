import type { Page } from 'playwright-core';
import { type ConsoleBrowser, launchBrowser } from './browser';

export const DEMO_PASSWORD = 'kestrel-demo';

/** Signs in through the console's own form and waits for the overview. */
export async function signIn(
  page: Page,
  origin: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<void> {
  await page.goto(`${origin}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${origin}/`);
  await page.getByRole('heading', { name: 'Overview' }).waitFor();
}

/** Opens a console page and waits until its heading and any loading bar are done. */
export async function openPage(
  page: Page,
  origin: string,
  path: string,
  heading: string | RegExp,
): Promise<void> {
  await page.goto(`${origin}${path}`);
  await page.getByRole('heading', { level: 1, name: heading }).waitFor();
  await page
    .locator('mat-progress-bar')
    .first()
    .waitFor({ state: 'detached', timeout: 15_000 })
    .catch(() => undefined);
  // Charts draw on the next frame after their data arrives.
  await page.waitForTimeout(300);
}

export const ADMIN_PAGES: Array<{ path: string; heading: string; name: string }> = [
  { path: '/', heading: 'Overview', name: 'overview' },
  { path: '/keys', heading: 'API keys', name: 'keys' },
  { path: '/usage', heading: 'Usage', name: 'usage' },
  { path: '/playground', heading: 'Playground', name: 'playground' },
  { path: '/rooms', heading: 'Rooms', name: 'rooms' },
  { path: '/users', heading: 'Users', name: 'users' },
  { path: '/reference', heading: 'API documentation', name: 'reference' },
];

/** A browser signed in as `email`; the test fails if the page logged a fault the test did not allow. */
export async function withSignedInBrowser(
  origin: string,
  colorScheme: 'light' | 'dark',
  email: string,
  run: (page: Page, browser: ConsoleBrowser) => Promise<void>,
): Promise<void> {
  const browser = await launchBrowser(origin, colorScheme);
  browser.allowFailure('/auth/session', 401);
  try {
    const page = await browser.newPage();
    await signIn(page, origin, email);
    await run(page, browser);
    expect(browser.faults()).toEqual([]);
  } finally {
    await browser.close();
  }
}
