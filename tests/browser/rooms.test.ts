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
  const plan = page.getByTestId('room-top-view').locator('svg.plan');
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

it('exports for a chosen processor profile with what rounding cost and the cautions, then links to the report', async () => {
  // The tuning planned from the demo's measurements has fitted EQ, whose rounding to the demo profile's
  // steps costs something (the README's worked example: the subwoofer's band moved to whole hertz).
  await page.getByRole('button', { name: /Export Planned from measurements/ }).click();
  const dialog = page.getByRole('dialog');
  const headline = dialog.getByTestId('export-rounding');
  await headline.waitFor();
  // The room's profile is the default; the headline names the worst channel and frequency.
  expect(await headline.textContent()).toMatch(
    /Rounding to Generic 8-band, 48\/96 kHz.* changes the EQ by at most \d+\.\d\d\s*dB \([A-Z0-9+-]+ at [\d.k]+ Hz\)/,
  );
  const table = dialog.getByTestId('export-channels');
  expect(await table.locator('tbody tr').count()).toBe(12);
  // The table's worst figure is the headline's.
  const cells = await table.locator('tbody tr td:last-child').allTextContents();
  const worst = Math.max(...cells.map((c) => Number(/(\d+\.\d+)\s*dB/.exec(c)?.[1] ?? 0)));
  expect((await headline.textContent()) ?? '').toContain(worst.toFixed(2));
  expect(await dialog.getByTestId('export-cautions').textContent()).toMatch(
    /Start with the system turned down/,
  );
  await page.waitForTimeout(200);
  await screenshot(page, 'export-dialog');

  const [download] = await Promise.all([
    page.waitForEvent('download'),
    dialog.getByTestId('export-json').click(),
  ]);
  const exported = JSON.parse(readFileSync((await download.path()) as string, 'utf8')) as {
    header: { convention: string; profile: { name: string } | null };
    channels: Array<{ id: string; eqRounding: { maxDeviationDb: number } }>;
  };
  expect(exported.header.convention).toMatch(/a0 = 1/);
  expect(exported.header.profile?.name).toMatch(/Generic 8-band/);
  expect(Math.max(...exported.channels.map((c) => c.eqRounding.maxDeviationDb)).toFixed(2)).toBe(
    worst.toFixed(2),
  );

  // Exact values: nothing rounded, and the download says no profile.
  await dialog.getByTestId('export-profile').focus();
  await dialog.getByTestId('export-profile').press('Enter');
  await page.getByRole('option', { name: 'Exact values (no profile)' }).click();
  await headline.filter({ hasText: 'exact values' }).waitFor();
  expect(await headline.textContent()).toMatch(/changes no channel’s EQ by 0\.01 dB or more/);
  const [exact] = await Promise.all([
    page.waitForEvent('download'),
    dialog.getByTestId('export-json').click(),
  ]);
  const exactBody = JSON.parse(readFileSync((await exact.path()) as string, 'utf8')) as {
    header: { profile: unknown };
  };
  expect(exactBody.header.profile).toBeNull();
  await dialog.getByRole('button', { name: 'Close' }).click();
  await dialog.waitFor({ state: 'detached' });

  // The Report button asks which tuning the report is of.
  await page.getByTestId('room-report').click();
  const choice = page.getByRole('menuitem', { name: /Full range/ });
  const href = await choice.getAttribute('href');
  expect(href).toMatch(/\/report\?tuningId=tun_\w+&version=1$/);
  const [report] = await Promise.all([page.context().waitForEvent('page'), choice.click()]);
  await report.waitForLoadState();
  expect(report.url()).toBe(`${service.origin}${href}`);
  expect(await report.title()).toMatch(/Stage 3/);
  // The report is of the tuning chosen, and reads as printed (print styles, as the browser prints it).
  await report.getByText('Full range (demo)').first().waitFor();
  await report.emulateMedia({ media: 'print' });
  await screenshot(report, 'report-print');
  await report.close();
});

it('shows the room on a 390 px phone without sideways scrolling', async () => {
  await page.setViewportSize(PHONE);
  await page.reload();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  await page.getByTestId('room-top-view').locator('svg.plan').waitFor();
  expect(await horizontalOverflow(page)).toEqual([]);
  // Every loudspeaker's label, as drawn at this width, clear of every other (LFE1 stands beside M+030).
  expect(await overlappingLabels(page)).toEqual([]);
  await screenshot(page, 'phone-room');
  // On a phone the export is on the tuning page.
  await page.getByRole('link', { name: /Planned from measurements/ }).click();
  await page.getByTestId('tuning-export').click();
  await page.getByRole('dialog').getByTestId('export-rounding').waitFor();
  expect(await horizontalOverflow(page)).toEqual([]);
  await screenshot(page, 'phone-export-dialog');
  await page.getByRole('dialog').getByRole('button', { name: 'Close' }).click();
});

/** Pairs of plan labels whose drawn boxes overlap, by their text. */
async function overlappingLabels(page: Page): Promise<string[]> {
  const boxes = await page
    .getByTestId('room-top-view')
    .locator('text.label')
    .evaluateAll((labels) =>
      labels.map((label) => {
        const { left, right, top, bottom } = label.getBoundingClientRect();
        return { text: label.textContent ?? '', left, right, top, bottom };
      }),
    );
  expect(boxes.length).toBeGreaterThan(10);
  const pairs: string[] = [];
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++) {
      const [a, b] = [boxes[i], boxes[j]];
      const apart =
        Math.min(a.right, b.right) <= Math.max(a.left, b.left) ||
        Math.min(a.bottom, b.bottom) <= Math.max(a.top, b.top);
      if (!apart) pairs.push(`${a.text} / ${b.text}`);
    }
  return pairs;
}
