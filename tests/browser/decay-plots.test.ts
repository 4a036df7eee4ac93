import path from 'node:path';
import type { Page } from 'playwright-core';
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
import { decayingBurst, pcm24Wav, seededNoise } from './support/synthetic-wav';
import { type RunningService, startService } from './support/service';

// Decay over frequency on a room's measurements: an impulse response uploaded with a waterfall and a
// spectrogram asked for, drawn as a heat map and as stacked slices, in the light and dark schemes, on a
// desktop and a phone. The response is a decaying noise burst (T60 0.25 s) plus one room mode at 63 Hz
// ringing four times longer (T60 1.0 s, energy −60 dB per T60, ISO 3382-1), so the plots must show the
// longest ringing near 63 Hz.

const RATE_HZ = 48000;
const ONSET = 480;
const MODE_HZ = 63;

let service: RunningService;
let browser: ConsoleBrowser;
let page: Page;
let roomUrl = '';

function roomResponseWav(): Buffer {
  const burst = decayingBurst({
    sampleRateHz: RATE_HZ,
    durationS: 1.5,
    onsetSample: ONSET,
    t60S: 0.25,
    noise: seededNoise(777),
  });
  const perSample = Math.pow(10, -3 / (1.0 * RATE_HZ));
  let envelope = 0.2;
  const samples = burst.map((v, i) => {
    if (i < ONSET) return v;
    const mode = envelope * Math.sin((2 * Math.PI * MODE_HZ * (i - ONSET)) / RATE_HZ);
    envelope *= perSample;
    return v + mode;
  });
  return pcm24Wav([samples], RATE_HZ);
}

/** A shot of one part of the page, the viewport stretched to the page so nothing is cut. */
async function partShot(target: Page, testId: string, name: string): Promise<void> {
  const viewport = target.viewportSize() ?? { width: 1366, height: 900 };
  await target.evaluate('window.scrollTo(0, 0)');
  const height = (await target.evaluate('document.documentElement.scrollHeight')) as number;
  await target.setViewportSize({ width: viewport.width, height: Math.min(height, 8000) });
  await target.waitForTimeout(200);
  await target.getByTestId(testId).screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`) });
  await target.setViewportSize(viewport);
}

/** The first number in a text such as "63.4 Hz" (a true minus sign read as one). */
const numberIn = (text: string | null) => Number(/[−-]?\d+(\.\d+)?/.exec(text ?? '')?.[0].replace('−', '-'));

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

it('asks for decay plots with an upload and draws the heat map with a dB scale, a summary and a keyboard cursor', async () => {
  await page.goto(`${service.origin}/rooms`);
  await page.getByRole('link', { name: /Stage 3/ }).click();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  roomUrl = page.url();
  await page.getByTestId('measurement-list').waitFor();

  await page.getByTestId('upload-channel').click();
  await page.getByRole('option', { name: /M\+135/ }).click();
  await page.getByTestId('upload-mic').fill('MLP');
  await page.getByTestId('upload-file').setInputFiles({
    name: 'rear-left.wav',
    mimeType: 'audio/wav',
    buffer: roomResponseWav(),
  });
  const request = page.getByTestId('decay-request');
  await request.waitFor();
  await request.getByText('Waterfall').click();
  await request.getByText('Spectrogram').click();
  // Out of the contract's range: said on the field, and nothing is sent.
  await page.getByTestId('decay-slices-count').fill('500');
  await request.getByText('Give 2 to 128 slices.').waitFor();
  await page.getByTestId('decay-slices-count').fill('48');
  await page.getByTestId('decay-bins-count').fill('128');
  const sent = page.waitForRequest((r) => r.method() === 'POST' && /\/measurements$/.test(r.url()));
  await page.getByTestId('upload-submit').click();
  const body = (await sent).postData() ?? '';
  expect(body).toMatch(/name="waterfall"\r\n\r\ntrue/);
  expect(body).toMatch(/name="decaySlices"\r\n\r\n48/);
  expect(body).toMatch(/name="decayBins"\r\n\r\n128/);

  const decay = page.getByTestId('measurement-decay');
  await decay.waitFor({ timeout: 20_000 });
  const svg = decay.getByTestId('decay-svg');
  expect(await svg.getAttribute('data-drawing')).toBe('heatMap');
  await decay.getByTestId('decay-heat-map').waitFor();
  expect(await decay.getByTestId('decay-heat-map').getAttribute('href')).toMatch(/^data:image\/bmp;base64,/);
  const texts = await svg.locator('text').allTextContents();
  const trimmed = texts.map((t) => t.trim());
  expect(trimmed).toEqual(
    expect.arrayContaining([
      'Time after the arrival (ms)',
      'Level (dB re top)',
      'Frequency (Hz)',
      '−60',
      '1k',
    ]),
  );
  // The accessible name and description of the drawing, and the visible summary: the 63 Hz mode rings longest.
  const title = await svg.locator('title').textContent();
  expect(title).toBe('Cumulative spectral decay (waterfall) of M+135 at MLP, heat map');
  const summary = (await decay.getByTestId('decay-summary').textContent()) ?? '';
  expect(summary).toContain('48 slices from 0\u00a0ms to 300\u00a0ms after the arrival');
  expect(summary).toContain('128 frequencies from 20.0\u00a0Hz to 20.00\u00a0kHz');
  const ringing = numberIn(/Longest ringing near ([\d.]+)/.exec(summary)?.[1] ?? null);
  // Within a sixth of an octave of the mode (bins are 10/127 octave apart, each a power average).
  expect(Math.abs(Math.log2(ringing / MODE_HZ))).toBeLessThan(1 / 6);

  // Keyboard: Tab reaches the plot, arrows move the cursor and the level is read out.
  const area = decay.getByTestId('decay-plot-area');
  await area.focus();
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('ArrowDown');
  const readout = decay.getByTestId('decay-readout');
  // 48 slices over 300 ms: the second starts 300/47 = 6.4 ms after the arrival.
  await page.waitForFunction(
    (element) => /^20\.\d\u00a0Hz at 6\.4\u00a0ms: (−|\d)/.test(element?.textContent ?? ''),
    await readout.elementHandle(),
    { timeout: 5000 },
  );
  expect(await readout.getAttribute('aria-live')).toBe('polite');
  await page.waitForTimeout(300);
  expect(await contrastProblems(page)).toEqual([]);
  await partShot(page, 'measurement-decay', 'decay-heat-map-light');

  await decay.getByTestId('decay-drawing').getByText('Slices').click();
  await decay.getByTestId('decay-slices').waitFor();
  expect(await svg.getAttribute('data-drawing')).toBe('slices');
  expect(await decay.locator('polyline.slice-line').count()).toBe(48);
  const sliceTexts = (await svg.locator('text').allTextContents()).map((t) => t.trim());
  expect(sliceTexts).toEqual(expect.arrayContaining(['0 ms', '300 ms', 'Time (ms)']));
  expect(await contrastProblems(page)).toEqual([]);
  await partShot(page, 'measurement-decay', 'decay-slices-light');

  // A click returns once its event is dispatched; the drawing changes at the next render, so each
  // step waits for what it changed before the next click.
  await decay.getByTestId('decay-kind').getByText('Spectrogram').click();
  await svg
    .locator('title', { hasText: /^Spectrogram of M\+135 at MLP, stacked slices/ })
    .waitFor({ state: 'attached' });
  await decay.getByTestId('decay-drawing').getByText('Heat map').click();
  await decay.getByTestId('decay-heat-map').waitFor();
  await svg
    .locator('title', { hasText: /^Spectrogram of M\+135 at MLP, heat map/ })
    .waitFor({ state: 'attached' });
  expect(await svg.getAttribute('data-drawing')).toBe('heatMap');
  await page.waitForTimeout(200);
  await partShot(page, 'measurement-decay', 'decay-spectrogram-light');
  await screenshot(page, 'decay-room-measurements');
});

it.each(['light', 'dark'] as const)(
  'reads in the %s scheme on a desktop and a 390 px phone',
  async (scheme) => {
    const themed = await launchBrowser(service.origin, scheme);
    themed.allowFailure('/auth/session', 401);
    try {
      for (const [device, viewport] of [
        ['desktop', undefined],
        ['phone', PHONE],
      ] as const) {
        const view = await themed.newPage(viewport);
        if (device === 'desktop') await signIn(view, service.origin, 'dev@kestrel.example');
        await view.goto(roomUrl);
        // The newest impulse response is shown first: the one uploaded above, with its plots.
        const decay = view.getByTestId('measurement-decay');
        await decay.waitFor({ timeout: 20_000 });
        await view.waitForTimeout(300);
        expect(await horizontalOverflow(view)).toEqual([]);
        expect(await contrastProblems(view)).toEqual([]);
        // The drawing fits its card: no wider than the section holding it.
        const [svgWidth, cardWidth] = await decay.evaluate((e) => [
          e.querySelector('svg')!.getBoundingClientRect().width,
          e.getBoundingClientRect().width,
        ]);
        expect(svgWidth).toBeLessThanOrEqual(cardWidth + 1);
        await partShot(view, 'measurement-decay', `decay-heat-map-${device}-${scheme}`);
        await decay.getByTestId('decay-drawing').getByText('Slices').click();
        await decay.getByTestId('decay-slices').waitFor();
        await view.waitForTimeout(200);
        expect(await contrastProblems(view)).toEqual([]);
        await partShot(view, 'measurement-decay', `decay-slices-${device}-${scheme}`);
        await view.close();
      }
      expect(themed.faults()).toEqual([]);
    } finally {
      await themed.close();
    }
  },
);
