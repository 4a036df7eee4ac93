import type { Page } from 'playwright-core';
import path from 'node:path';
import {
  type ConsoleBrowser,
  PHONE,
  SCREENSHOT_DIR,
  contrastProblems,
  horizontalOverflow,
  launchBrowser,
  screenshot,
} from './support/browser';
import { signIn } from './support/console-pages';
import { eventually } from './support/eventually';
import { decayingBurst, pcm24Wav, seededNoise } from './support/synthetic-wav';
import { type RunningService, startService } from './support/service';

// Measurements in the stored demo room (Stage 3, seeded with invented SPL readings, responses at two
// microphone positions and one synthetic impulse response): the list, the measured and predicted
// responses overlaid, decay times and room modes, an upload analysed on arrival, and a delete.
let service: RunningService;
let browser: ConsoleBrowser;
let page: Page;

const SAMPLE_RATE_HZ = 48000;
/** Onset sample of the uploaded burst: 700 / 48 000 Hz = 14.583 ms (the worked example). */
const ONSET_SAMPLE = 700;
/** Reverberation time of the uploaded burst's envelope (energy falls 60 dB in T60, ISO 3382-1). */
const T60_S = 0.4;

/**
 * A decaying noise burst: a spike at the onset, then seeded uniform noise under the envelope
 * 10^(−3t/T60), over a steady background 80 dB down, 1.2 s long, as 24-bit PCM.
 */
function decayingBurstWav(): Buffer {
  const samples = decayingBurst({
    sampleRateHz: SAMPLE_RATE_HZ,
    durationS: 1.2,
    onsetSample: ONSET_SAMPLE,
    t60S: T60_S,
    noise: seededNoise(12345),
  });
  return pcm24Wav([samples], SAMPLE_RATE_HZ);
}

/** The first number in a text such as "14.58 ms" or "0.40 s". */
function numberIn(text: string | null): number {
  return Number(/[−-]?\d+(\.\d+)?/.exec(text ?? '')?.[0].replace('−', '-'));
}

/** Reads a value until it satisfies the check (the page updates asynchronously), or fails after 10 s. */
/** A shot of one part of the page, for a closer look than the full-page screenshot gives. */
async function partShot(page: Page, testId: string, name: string): Promise<void> {
  // With the viewport as tall as the page nothing scrolls, so the sticky toolbar stays at the top.
  const viewport = page.viewportSize() ?? { width: 1366, height: 900 };
  await page.evaluate('window.scrollTo(0, 0)');
  const height = (await page.evaluate('document.documentElement.scrollHeight')) as number;
  await page.setViewportSize({ width: viewport.width, height: Math.min(height, 8000) });
  await page.waitForTimeout(150);
  await page.getByTestId(testId).screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`) });
  await page.setViewportSize(viewport);
}

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

it('lists the demo measurements and shows the impulse response with decay times and room modes', async () => {
  await page.goto(`${service.origin}/rooms`);
  await page.getByRole('link', { name: /Stage 3/ }).click();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  const list = page.getByTestId('measurement-list');
  await list.waitFor();
  // Twelve SPL readings, four responses at MLP, two at position 2, one impulse response.
  expect(await list.locator('tbody tr').count()).toBe(19);
  expect(await list.locator('tbody tr', { hasText: 'SPL reading' }).count()).toBe(12);
  const irRow = list.locator('tbody tr', { hasText: 'Impulse response' });
  await expect(irRow.textContent()).resolves.toMatch(/M\+090/);

  // The newest impulse response is shown first: 2.80 m at 343.8 m/s (21 °C) is 8.14 ms, rounded to
  // sample 391 at 48 kHz = 8.146 ms; the seed's tail was made with T60 = 0.30 s.
  const facts = page.getByTestId('ir-facts');
  await facts.waitFor();
  expect(
    numberIn(await facts.locator('div', { hasText: 'Arrival' }).locator('dd').textContent()),
  ).toBeCloseTo(8.15, 1);
  const t30 = numberIn(await facts.locator('div', { hasText: 'T30' }).locator('dd').textContent());
  expect(Math.abs(t30 - 0.3)).toBeLessThan(0.03);
  await page.getByTestId('decay-table').getByRole('rowheader', { name: '1k Hz' }).waitFor();
  await page.getByTestId('decay-table').getByRole('rowheader', { name: 'Broadband' }).waitFor();
  // Stage 3 is 7.40 m long: the first axial length mode is c / 2L = 343.8 / 14.8 = 23.2 Hz (c at 21 °C).
  const modes = page.getByTestId('mode-table');
  await modes.getByRole('cell', { name: '23.2 Hz' }).waitFor();
  expect(await modes.locator('tbody tr').count()).toBe(10);
  expect(numberIn(await page.getByTestId('schroeder').textContent())).toBeGreaterThan(0);

  const chart = page.getByTestId('response-chart').locator('canvas');
  await page.getByTestId('fit-summary').waitFor();
  const label = (await chart.getAttribute('aria-label')) ?? '';
  expect(label).toMatch(/M\+090: measured at MLP/);
  expect(label).toMatch(/predicted response after the fitted EQ/);
  expect(label).toMatch(/axial room modes at 23\.2/);
  expect(label).toMatch(/Schroeder frequency/);
  await page.waitForTimeout(300);
  expect(await contrastProblems(page)).toEqual([]);
  await screenshot(page, 'room-measurements');
  await partShot(page, 'room-measurements', 'room-measurements-list');
  await partShot(page, 'measurement-response', 'room-measurements-response');
});

it('overlays the spatial average of two positions with the response predicted after a cut-only fit', async () => {
  const row = page
    .getByTestId('measurement-list')
    .locator('tbody tr', { hasText: 'M+030' })
    .filter({
      has: page.getByRole('cell', { name: '2', exact: true }),
    });
  await row.getByRole('button', { name: /Show M\+030 at 2/ }).click();
  await page.getByRole('heading', { name: 'Response of M+030' }).waitFor();
  const chart = page.getByTestId('response-chart').locator('canvas');
  await eventually(
    () => chart.getAttribute('aria-label'),
    (label) =>
      expect(label).toMatch(
        // The two positions were stored in the same millisecond, so either may be listed first.
        /M\+030: spatial average of 2 positions \((MLP, 2|2, MLP)\).*predicted response after the fitted EQ/,
      ),
  );
  const summary = page.getByTestId('fit-summary');
  await summary.waitFor();
  const [before, after] = [...((await summary.textContent()) ?? '').matchAll(/(\d+\.\d)\s*dB/g)].map((m) =>
    Number(m[1]),
  );
  expect(after).toBeLessThan(before);
  // Cut only by default: every fitted band is a cut.
  for (const chip of await page
    .getByRole('list', { name: 'Fitted EQ bands' })
    .locator('li')
    .allTextContents()) {
    expect(chip).toMatch(/· −\d/);
  }
  expect(await page.getByTestId('fit-cautions').count()).toBe(0);
  await page.waitForTimeout(300);
  await screenshot(page, 'room-measurements-average');
  await partShot(page, 'measurement-response', 'room-measurements-average-response');

  // The room allows 3 dB of boost; a fit that uses it must carry the API's caution.
  await page.getByRole('checkbox', { name: /Allow boosts up to 3\.0/ }).check();
  await page.getByTestId('fit-cautions').waitFor();
  const chips = await page.getByRole('list', { name: 'Fitted EQ bands' }).locator('li').allTextContents();
  expect(chips.some((chip) => /· \d/.test(chip))).toBe(true);
  expect(await page.getByTestId('fit-cautions').textContent()).toMatch(/boost/i);
  await screenshot(page, 'room-measurements-boost');
  await page.getByRole('checkbox', { name: /Allow boosts/ }).uncheck();
});

it('refuses an upload with a clear message and analyses a WAV made in the test', async () => {
  const submit = page.getByTestId('upload-submit');
  await submit.click();
  await page.getByText('Choose the loudspeaker you measured.').waitFor();
  await page.getByText('Choose a WAV impulse response or a text response.').waitFor();

  await page.getByTestId('upload-channel').click();
  await page.getByRole('option', { name: /U\+045/ }).click();
  await page.getByTestId('upload-mic').fill('MLP');

  // A WAV with a broken body: the API answers with a problem document naming the file field.
  browser.allowFailure('/v1/rooms/', 422);
  const file = page.getByTestId('upload-file');
  await file.setInputFiles({
    name: 'broken.wav',
    mimeType: 'audio/wav',
    buffer: Buffer.from('RIFF....WAVEjunk'),
  });
  await submit.click();
  const problem = page.getByTestId('upload-problem');
  await problem.waitFor();
  expect(await problem.textContent()).toMatch(/truncated|format chunk|not a WAV|malformed/i);
  await partShot(page, 'room-measurements', 'room-measurements-upload-problem');

  await file.setInputFiles({ name: 'top-front-left.wav', mimeType: 'audio/wav', buffer: decayingBurstWav() });
  await submit.click();
  const row = page
    .getByTestId('measurement-list')
    .locator('tbody tr', { hasText: 'U+045' })
    .filter({ hasText: 'Impulse response' });
  await row.waitFor();
  await page.getByRole('heading', { name: 'Response of U+045' }).waitFor();
  expect(await page.getByTestId('upload-problem').count()).toBe(0);

  const facts = page.getByTestId('ir-facts');
  await eventually(
    () => facts.locator('div', { hasText: 'Arrival' }).locator('dd').textContent(),
    (text) => expect(text).toBe('14.58\u00a0ms'),
  );
  // Tolerance ±10 %: a single noise realisation of a known T60 scatters by a few per cent (ISO 3382-1
  // asks for a decay range well above the noise; here it is 80 dB), and T30 of an exact exponential is T60.
  for (const name of ['EDT', 'T20', 'T30']) {
    const value = numberIn(
      await facts
        .locator('div', { hasText: new RegExp(`^${name}`) })
        .locator('dd')
        .textContent(),
    );
    expect(Math.abs(value - T60_S) / T60_S).toBeLessThan(0.1);
  }
  const listed = numberIn(await row.locator('td').nth(4).textContent());
  expect(Math.abs(listed - T60_S) / T60_S).toBeLessThan(0.1);
  await page.getByTestId('decay-table').waitFor();
  await page.getByTestId('fit-summary').waitFor();
  await page.locator('mat-snack-bar-container').waitFor({ state: 'detached', timeout: 10_000 });
  await page.waitForTimeout(300);
  await partShot(page, 'measurement-response', 'room-measurements-uploaded');
});

it('deletes a measurement after confirmation', async () => {
  const rows = page.getByTestId('measurement-list').locator('tbody tr');
  const before = await rows.count();
  const row = rows.filter({ hasText: 'U+045' }).filter({ hasText: 'Impulse response' });
  await row.getByTestId('delete-measurement').click();
  await page
    .getByRole('dialog')
    .getByText(/U\+045 at microphone position MLP/)
    .waitFor();
  await page.getByTestId('confirm-action').click();
  await eventually(
    () => rows.count(),
    (count) => expect(count).toBe(before - 1),
  );
  expect(await row.count()).toBe(0);
  // The SPL reading of the same loudspeaker stays.
  expect(await rows.filter({ hasText: 'U+045' }).count()).toBe(1);
});

it('fits a 390 px phone without sideways scrolling', async () => {
  await page.setViewportSize(PHONE);
  await page.reload();
  await page.getByTestId('measurement-list').waitFor();
  await page.getByTestId('fit-summary').waitFor();
  await page.waitForTimeout(300);
  expect(await horizontalOverflow(page)).toEqual([]);
  // The list itself fits too: its channel buttons and delete buttons are reachable without scrolling.
  const scroller = page.getByTestId('room-measurements').locator('.iso-table-scroll');
  const widths = await scroller.evaluate((e) => [e.scrollWidth, e.clientWidth]);
  expect(widths[0]).toBeLessThanOrEqual(widths[1]);
  await screenshot(page, 'room-measurements-phone');
  await partShot(page, 'room-measurements', 'room-measurements-phone-list');
  await partShot(page, 'measurement-response', 'room-measurements-phone-response');
});
