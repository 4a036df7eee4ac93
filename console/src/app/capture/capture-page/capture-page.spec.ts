import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { provideRouter } from '@angular/router';
import { afterEach, vi } from 'vitest';
import type { Measurement } from '../../rooms/room-measurements/measurement.model';
import { demoImpulseResponse, demoMeasurement } from '../../../testing/fixtures';
import { AudioCapture } from '../audio-capture';
import { CapturePage } from './capture-page';

const ROOM = {
  id: 'room_1',
  name: 'Stage 3',
  loudspeakers: [
    { id: 'M+030', name: 'Left', x: 1, y: 1, z: 1 },
    { id: 'M-030', name: 'Right', x: 2, y: 1, z: 1 },
  ],
};

const CAUTION = 'The sweep peaks at −20.0 dBFS: start with the monitors turned down.';

const analysis = demoImpulseResponse();

/**
 * What the API answers for a stored take: the analysis of the recorded sweep (its loudspeaker arriving
 * 5.01 ms after the loopback), with a small waterfall.
 */
function storedTake(channel: string): Measurement {
  return demoMeasurement({
    id: `meas_${channel}`,
    roomId: 'room_1',
    channel,
    kind: 'impulseResponse',
    source: { type: 'wav', fileKind: 'sweepRecording' },
    result: {
      ...analysis,
      timing: {
        referenceArrivalSample: 96,
        referenceArrivalMs: 2,
        referencePeakSample: 97,
        arrivalFromReferenceSamples: 240,
        arrivalFromReferenceMs: 5.01,
        peakFromReferenceSamples: 241,
        peakFromReferenceMs: 5.03,
      },
      waterfall: {
        window: { name: 'rectangular start, half-Hann end', lengthMs: 500, taperMs: 100 },
        timesMs: [0, 300],
        frequenciesHz: [20, 200, 2000, 20000],
        levelDb: [
          [0, -3, -6, -9],
          [-20, -40, -60, -90],
        ],
        binWidthOctaves: 3.3,
        resolutionHz: 2,
      },
    },
  });
}

/** A stand-in for the open input: two input channels, levels for the meter, takes that come back at once. */
function fakeCapture() {
  return {
    inputChannels: 2,
    outputChannels: 2,
    context: { sampleRate: 48000, decodeAudioData: vi.fn(async () => ({ duration: 1 })) },
    levels: () => [-12.04, -Infinity],
    take: vi.fn(async () => ({ sampleRateHz: 48000, channels: [new Float32Array(8), new Float32Array(8)] })),
    useOutput: vi.fn(async () => true),
    close: vi.fn(async () => undefined),
  };
}

describe('CapturePage', () => {
  let fixture: ComponentFixture<CapturePage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function render(media = true) {
    // The page only asks whether the browser can choose an output device.
    vi.stubGlobal('AudioContext', function AudioContext() {});
    if (media)
      vi.stubGlobal('navigator', {
        ...navigator,
        mediaDevices: { getUserMedia: vi.fn(), enumerateDevices: vi.fn(async () => []) },
      });
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CapturePage);
    fixture.componentRef.setInput('roomId', 'room_1');
    fixture.detectChanges();
    http.expectOne('/v1/rooms/room_1').flush(ROOM);
    await fixture.whenStable();
    element = fixture.nativeElement as HTMLElement;
  }

  const byTestId = (id: string) => element.querySelector<HTMLElement>(`[data-testid="${id}"]`);
  const settle = async () => {
    for (let i = 0; i < 5; i++) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      await fixture.whenStable();
    }
  };

  afterEach(() => {
    http?.verify();
    vi.restoreAllMocks();
    vi.unstubAllGlobals();
  });

  it('says what the browser needs, and what to do when the microphone is refused', async () => {
    await render();
    const needs = byTestId('capture-needs')!.textContent!;
    expect(needs).toContain('Permission to use the microphone');
    expect(needs).toMatch(/echo cancellation, noise suppression and\s+automatic gain/);
    vi.spyOn(AudioCapture, 'open').mockRejectedValue(new DOMException('denied', 'NotAllowedError'));
    byTestId('open-input')!.click();
    await settle();
    expect(byTestId('input-problem')!.textContent).toContain('The browser refused the microphone');
    expect(byTestId('input-problem')!.textContent).toContain('Allow the microphone for this site');
    // No input: nothing can be measured yet.
    expect((byTestId('measure-all') as HTMLButtonElement).disabled).toBe(true);
  });

  it('offers no input where the browser has no audio input for pages', async () => {
    await render(false);
    expect(byTestId('capture-needs')!.textContent).toContain('This browser offers no audio input to pages');
    expect((byTestId('open-input') as HTMLButtonElement).disabled).toBe(true);
  });

  it('meters the input, plays nothing before the confirmation, then measures every channel in one pass', async () => {
    await render();
    const capture = fakeCapture();
    vi.spyOn(AudioCapture, 'open').mockResolvedValue(capture as unknown as AudioCapture);
    byTestId('open-input')!.click();
    await settle();
    await new Promise((resolve) => setTimeout(resolve, 150));
    await settle();
    const meters = element.querySelectorAll('[role="meter"]');
    expect(meters).toHaveLength(2);
    expect(meters[0].getAttribute('aria-valuetext')).toBe('−12.0\u00a0dBFS');
    expect(meters[1].getAttribute('aria-valuetext')).toBe('silence');

    // Decay plots asked for with each take.
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    (element.querySelector('[data-testid="decay-waterfall"] input') as HTMLInputElement).click();
    await settle();

    // First try: the confirmation is declined, and nothing plays.
    (await loader.getHarness(MatButtonHarness.with({ text: /Measure 2 channels/ }))).click();
    await settle();
    http.expectOne('/v1/test-signals').flush({ cautions: [{ code: 'testSignalLevel', message: CAUTION }] });
    await settle();
    let dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getContentText()).toContain(CAUTION);
    expect(await dialog.getContentText()).toContain('It plays 2 times');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await settle();
    expect(capture.take).not.toHaveBeenCalled();

    // Second try: confirmed; each channel is played, recorded and stored in turn.
    (await loader.getHarness(MatButtonHarness.with({ text: /Measure 2 channels/ }))).click();
    await settle();
    http.expectOne('/v1/test-signals').flush({ cautions: [{ code: 'testSignalLevel', message: CAUTION }] });
    await settle();
    dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Play and record' }))).click();
    await settle();
    http
      .expectOne((r) => r.url === '/v1/test-signals' && r.responseType === 'arraybuffer')
      .flush(new ArrayBuffer(8));
    for (const channel of ['M+030', 'M-030']) {
      await settle();
      const upload = http.expectOne('/v1/rooms/room_1/measurements');
      const form = upload.request.body as FormData;
      expect(form.get('channel')).toBe(channel);
      expect(form.get('fileKind')).toBe('sweepRecording');
      expect(form.get('waterfall')).toBe('true');
      expect(form.get('decaySlices')).toBe('32');
      upload.flush(storedTake(channel));
    }
    await settle();
    expect(capture.take).toHaveBeenCalledTimes(2);
    expect(capture.take.mock.calls.map((call) => (call as unknown[])[1])).toEqual([0, 1]);
    expect(byTestId('capture-progress')!.textContent).toContain('2 of 2 measured');
    const rows = element.querySelectorAll('[data-testid="capture-channels"] tbody tr');
    expect(Array.from(rows, (r) => r.querySelector('.status')!.textContent!.trim())).toEqual([
      'Measured',
      'Measured',
    ]);
    // The last take is shown with its facts and its waterfall; each row offers a redo.
    expect(byTestId('capture-facts')!.textContent).toContain('5.01\u00a0ms');
    expect(byTestId('capture-decay')!.querySelector('svg title')!.textContent).toBe(
      'Cumulative spectral decay (waterfall) of M-030 at MLP, heat map',
    );
    expect(await loader.getHarness(MatButtonHarness.with({ text: 'Redo' }))).toBeTruthy();
    expect(rows[0].textContent).toContain('5.01\u00a0ms after the loopback');
  });

  it('redoes one channel alone, and marks a take the server refused as failed', async () => {
    await render();
    const capture = fakeCapture();
    vi.spyOn(AudioCapture, 'open').mockResolvedValue(capture as unknown as AudioCapture);
    byTestId('open-input')!.click();
    await settle();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    (element.querySelector('button[aria-label="Measure M-030"]') as HTMLButtonElement).click();
    await settle();
    http.expectOne('/v1/test-signals').flush({ cautions: [{ code: 'testSignalLevel', message: CAUTION }] });
    await settle();
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getContentText()).toContain('It plays once');
    expect(await dialog.getContentText()).toContain('M-030 on output 2');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Play and record' }))).click();
    await settle();
    http
      .expectOne((r) => r.url === '/v1/test-signals' && r.responseType === 'arraybuffer')
      .flush(new ArrayBuffer(8));
    await settle();
    http
      .expectOne('/v1/rooms/room_1/measurements')
      .flush(
        { type: 'x', title: 'Unusable audio', status: 422, detail: 'The recording is silent.' },
        { status: 422, statusText: 'Unprocessable' },
      );
    await settle();
    expect(capture.take).toHaveBeenCalledTimes(1);
    const row = element.querySelector('tr[data-channel="M-030"]')!;
    expect(row.querySelector('.status')!.textContent).toContain('Failed');
    expect(row.querySelector('.row-problem')!.textContent).toContain('silent');
    expect(element.querySelector('tr[data-channel="M+030"] .status')!.textContent).toContain('Not measured');
    expect(await loader.getHarness(MatButtonHarness.with({ text: 'Redo' }))).toBeTruthy();
  });

  it('refuses settings that cannot be measured, before anything plays', async () => {
    await render();
    vi.spyOn(AudioCapture, 'open').mockResolvedValue(fakeCapture() as unknown as AudioCapture);
    byTestId('open-input')!.click();
    await settle();
    const level = byTestId('sweep-level') as HTMLInputElement;
    level.value = '5';
    level.dispatchEvent(new Event('change'));
    await settle();
    expect(element.querySelector('.field-problem')!.textContent).toContain(
      'Give a sweep level from −80 to 0 dBFS.',
    );
    expect((byTestId('measure-all') as HTMLButtonElement).disabled).toBe(true);
  });
});
