import type { Locator, Page } from 'playwright-core';
import {
  type ConsoleBrowser,
  PHONE,
  contrastProblems,
  horizontalOverflow,
  launchBrowser,
  screenshot,
} from './support/browser';
import { signIn } from './support/console-pages';
import { eventually } from './support/eventually';
import { decayingBurst, pcm24Wav, seededNoise } from './support/synthetic-wav';
import { type RunningService, startService } from './support/service';

// The measurement form's choices in the demo room (Stage 3): a two-channel WAV with the loudspeaker on
// its second channel and a loopback on its first, the smoothing of the stored response, the kind choice
// for a channel that then has both impulse-response analyses and frequency responses (remembered across
// a reload), and the fit controls (range, band count, a stored target curve, defaults).
let service: RunningService;
let browser: ConsoleBrowser;
let page: Page;

const SAMPLE_RATE_HZ = 48000;
/** The loudspeaker's onset on channel 2: 700 / 48 000 Hz = 14.583 ms. */
const SPEAKER_ONSET = 700;
/** The loopback's spike on channel 1: 96 / 48 000 Hz = 2.0 ms, far from the speaker's arrival. */
const LOOPBACK_ONSET = 96;

/** Channel 1: a lone spike (the loopback); channel 2: a spike and a decaying noise tail (T60 0.4 s). */
function twoChannelWav(): Buffer {
  const noise = seededNoise(777);
  const speaker = decayingBurst({
    sampleRateHz: SAMPLE_RATE_HZ,
    durationS: 1.2,
    onsetSample: SPEAKER_ONSET,
    t60S: 0.4,
    noise,
  });
  const loopback = speaker.map((_, i) => (i === LOOPBACK_ONSET ? 0.8 : 0) + 1e-4 * noise());
  return pcm24Wav([loopback, speaker], SAMPLE_RATE_HZ);
}

/** Opens a select from the keyboard: a long floating label covers the trigger's middle, where a click lands. */
async function openSelect(select: Locator): Promise<void> {
  await select.focus();
  await select.press('Enter');
}

const chartLabel = () => page.getByTestId('response-chart').locator('canvas').getAttribute('aria-label');

async function openStage3(): Promise<void> {
  await page.goto(`${service.origin}/rooms`);
  await page.getByRole('link', { name: /Stage 3/ }).click();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  await page.getByTestId('measurement-list').waitFor();
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

it('asks which channel of a two-channel WAV holds the loudspeaker and sends it with the smoothing chosen', async () => {
  await openStage3();
  await page.getByTestId('upload-channel').click();
  await page.getByRole('option', { name: /^M\+030/ }).click();
  await page.getByTestId('upload-mic').fill('MLP');
  await page.getByTestId('upload-file').setInputFiles({
    name: 'left-two-channels.wav',
    mimeType: 'audio/wav',
    buffer: twoChannelWav(),
  });
  const facts = page.getByTestId('wav-facts');
  await facts.waitFor();
  expect(await facts.textContent()).toMatch(/2 channels, 48\.0\s*kHz/);
  // Without a channel the form says what is missing instead of sending a request the API would refuse.
  await page.getByTestId('upload-submit').click();
  await page.getByText('This file has 2 channels: choose the one with the loudspeaker.').waitFor();

  await openSelect(page.getByTestId('upload-file-channel'));
  await page.getByRole('option', { name: 'Channel 2 of 2' }).click();
  await openSelect(page.getByTestId('upload-reference-channel'));
  await page.getByRole('option', { name: 'Channel 1', exact: true }).click();
  await openSelect(page.getByTestId('upload-smoothing'));
  await page.getByRole('option', { name: '1/3 octave' }).click();
  await screenshot(page, 'measurement-form-multichannel');

  const sent = page.waitForRequest((r) => r.method() === 'POST' && /\/measurements$/.test(r.url()));
  await page.getByTestId('upload-submit').click();
  const body = (await sent).postDataBuffer()?.toString('latin1') ?? '';
  expect(body).toMatch(/name="fileChannel"\r\n\r\n1\r\n/);
  expect(body).toMatch(/name="referenceFileChannel"\r\n\r\n0\r\n/);
  expect(body).toMatch(/name="smoothingOctaves"\r\n\r\n0\.333/);

  // The second channel's onset (14.58 ms) is analysed, not the loopback's (2.00 ms).
  await page.getByRole('heading', { name: 'Response of M+030' }).waitFor();
  const arrival = page.getByTestId('ir-facts').locator('div', { hasText: 'Arrival' }).locator('dd');
  await eventually(
    () => arrival.textContent(),
    (text) => expect(text).toBe('14.58\u00a0ms'),
  );
});

it('offers the kind choice for a channel with both kinds and remembers it across a reload', async () => {
  const choice = page.getByTestId('kind-choice');
  await choice.waitFor();
  // The new impulse response was selected, so its kind is averaged: one position.
  await eventually(chartLabel, (label) => expect(label).toMatch(/M\+030: measured at MLP/));
  await choice.getByRole('radio', { name: 'Frequency responses' }).click();
  await eventually(chartLabel, (label) => expect(label).toMatch(/M\+030: spatial average of 2 positions/));
  expect(await choice.getByRole('radio', { name: 'Frequency responses' }).getAttribute('aria-checked')).toBe(
    'true',
  );
  await page.getByTestId('fit-summary').waitFor();
  await screenshot(page, 'measurement-kind-choice');

  await page.reload();
  await page.getByTestId('kind-choice').waitFor();
  await eventually(chartLabel, (label) => expect(label).toMatch(/M\+030: spatial average of 2 positions/));
  expect(
    await page
      .getByTestId('kind-choice')
      .getByRole('radio', { name: 'Frequency responses' })
      .getAttribute('aria-checked'),
  ).toBe('true');
});

it('fits within the range, band count and stored target chosen, and returns to the defaults', async () => {
  // A stored target curve, made through the API as any caller would.
  const status = await page.evaluate(async () => {
    const response = await fetch('/v1/target-curves', {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'X-Requested-With': 'isochron-console' },
      body: JSON.stringify({
        name: 'Gentle lift',
        points: [
          { frequencyHz: 20, gainDb: 4 },
          { frequencyHz: 200, gainDb: 0 },
          { frequencyHz: 20000, gainDb: 0 },
        ],
      }),
    });
    return response.status;
  });
  expect(status).toBe(201);
  await page.reload();
  const summary = page.getByTestId('fit-summary');
  await summary.waitFor();

  // A lower end above the upper end is refused on the field, and no fit is asked for.
  await page.getByTestId('fit-from').fill('300');
  await page.getByTestId('fit-to').fill('100');
  await page.getByTestId('fit-to').press('Tab');
  await page.getByText('The upper end must be above the lower end.').waitFor();

  await page.getByTestId('fit-from').fill('40');
  await page.getByTestId('fit-from').press('Tab');
  await page.getByTestId('fit-to').fill('160');
  await page.getByTestId('fit-to').press('Tab');
  await page.getByTestId('fit-bands').fill('2');
  await page.getByTestId('fit-bands').press('Tab');
  await eventually(
    () => summary.textContent(),
    (text) => expect(text).toMatch(/from 40 to 160 Hz/),
  );
  // The range and the band count each ask for a fit; the summary reads the range as soon as the first
  // answer lands, so the band count is awaited on its own.
  const bands = page.getByRole('list', { name: 'Fitted EQ bands' }).locator('li');
  await eventually(
    () => bands.count(),
    (count) => expect([1, 2]).toContain(count),
  );
  for (const chip of await bands.allTextContents()) {
    const hz = Number(/([\d.]+)\s*Hz/.exec(chip)?.[1]);
    expect(hz).toBeGreaterThanOrEqual(40);
    expect(hz).toBeLessThanOrEqual(160);
  }

  await openSelect(page.getByTestId('fit-target'));
  await page.getByRole('option', { name: 'Gentle lift' }).click();
  await eventually(chartLabel, (label) => expect(label).toMatch(/target “Gentle lift”/));
  await page.waitForTimeout(300);
  expect(await contrastProblems(page)).toEqual([]);
  await screenshot(page, 'measurement-fit-controls');

  await page.getByTestId('fit-reset').click();
  await eventually(chartLabel, (label) => expect(label).toMatch(/flat target/));
  expect(await page.getByTestId('fit-from').inputValue()).toBe('');
});

it('fits the choices on a 390 px phone in the dark theme', async () => {
  const dark = await launchBrowser(service.origin, 'dark');
  dark.allowFailure('/auth/session', 401);
  try {
    const phone = await dark.newPage(PHONE);
    await signIn(phone, service.origin, 'dev@kestrel.example');
    await phone.goto(`${service.origin}/rooms`);
    await phone.getByRole('link', { name: /Stage 3/ }).click();
    await phone.getByTestId('fit-controls').waitFor();
    await phone.getByTestId('kind-choice').waitFor();
    await phone.getByTestId('fit-summary').waitFor();
    await phone.waitForTimeout(300);
    expect(await horizontalOverflow(phone)).toEqual([]);
    expect(await contrastProblems(phone)).toEqual([]);
    await screenshot(phone, 'measurement-choices-phone-dark');
    expect(dark.faults()).toEqual([]);
  } finally {
    await dark.close();
  }
});
