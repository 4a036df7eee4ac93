import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { type ConsoleBrowser, PHONE, horizontalOverflow, launchBrowser, screenshot } from './support/browser';
import { openPage, signIn } from './support/console-pages';
import { type RunningService, startService } from './support/service';

// The stored demo room (Stage 3, seeded with two tunings): its plan from above, the channel table, and
// the keep-stage tools — duplicate, compare, export and the client report.
let service: RunningService;
let browser: ConsoleBrowser;
let page: Page;

beforeAll(async () => {
  service = await startService();
  browser = await launchBrowser(service.origin);
  browser.allowFailure('/auth/session', 401);
  page = await browser.newPage();
  await signIn(page, service.origin, 'dev@kestrel.example');
});

afterAll(async () => {
  await browser?.close();
  await service?.stop();
});

afterEach(() => {
  if (browser) expect(browser.faults()).toEqual([]);
});

it('lists the demo room and opens it with its top view and channel table', async () => {
  await openPage(page, service.origin, '/rooms', 'Rooms');
  await screenshot(page, 'rooms');
  await page.getByRole('link', { name: /Stage 3/ }).click();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  const plan = page.getByTestId('room-top-view').locator('canvas');
  await plan.waitFor();
  expect(await plan.getAttribute('aria-label')).toMatch(
    /seen from above, front wall at the top: 6\.10 m wide and 7\.40 m long/,
  );
  for (const channel of ['M+030', 'U-135', 'LFE1']) {
    await page.getByRole('cell', { name: channel, exact: true }).waitFor();
  }
  await page.getByRole('row', { name: /Bass-managed 80 Hz/ }).waitFor();
  await screenshot(page, 'room');
});

it('duplicates a tuning and compares the copy with its source', async () => {
  const source = page.getByRole('row', { name: /Bass-managed 80 Hz/ }).first();
  await source.getByTestId('duplicate-tuning').click();
  const dialog = page.getByRole('dialog');
  await dialog.getByTestId('duplicate-name').fill('Bass-managed, try 90 Hz');
  await dialog.getByTestId('confirm-duplicate').click();
  await page.getByRole('row', { name: /Bass-managed, try 90 Hz/ }).waitFor();

  await page.getByTestId('compare-left').click();
  await page.getByRole('option', { name: /Bass-managed 80 Hz/ }).click();
  await page.getByTestId('compare-right').click();
  await page.getByRole('option', { name: /Bass-managed, try 90 Hz/ }).click();
  await page.getByTestId('compare-tunings').click();
  await page.getByText(/have the same settings/).waitFor();

  await page.getByTestId('compare-right').click();
  await page.getByRole('option', { name: /Full range/ }).click();
  await page.getByTestId('compare-tunings').click();
  await page.getByText(/Differences from/).waitFor();
  await page.getByTestId('comparison').getByRole('cell', { name: 'M+030' }).waitFor();
  await screenshot(page, 'room-compare');
});

it('exports coefficients and links to the printable report', async () => {
  await page.getByRole('button', { name: /Export Full range/ }).click();
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('menuitem', { name: 'Coefficients as JSON' }).click(),
  ]);
  const exported = JSON.parse(readFileSync((await download.path()) as string, 'utf8')) as {
    header: { convention: string };
    channels: Array<{ id: string }>;
  };
  expect(exported.header.convention).toMatch(/a0 = 1/);
  expect(exported.channels.map((channel) => channel.id)).toContain('M+030');

  // The Report button asks which tuning the report is of.
  await page.getByTestId('room-report').click();
  const choice = page.getByRole('menuitem', { name: /Full range/ });
  const href = await choice.getAttribute('href');
  expect(href).toMatch(/\/report\?tuningId=tun_\w+&version=1$/);
  const [report] = await Promise.all([page.context().waitForEvent('page'), choice.click()]);
  await report.waitForLoadState();
  expect(report.url()).toBe(`${service.origin}${href}`);
  expect(await report.title()).toMatch(/Stage 3/);
  await report.close();
});

it('shows the room on a 390 px phone without sideways scrolling', async () => {
  await page.setViewportSize(PHONE);
  await page.reload();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  await page.getByTestId('room-top-view').locator('canvas').waitFor();
  expect(await horizontalOverflow(page)).toEqual([]);
  await screenshot(page, 'phone-room');
});
