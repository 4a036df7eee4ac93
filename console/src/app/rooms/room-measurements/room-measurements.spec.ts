import { HttpRequest, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { provideRouter } from '@angular/router';
import { fmtBody, pcm16Body, riffFile } from '../../../../../shared/analysis/wav-test-files';
import { fitParametricEq } from '../../../../../shared/eq-fit/fit-parametric-eq';
import { stage3MeasuredResponses } from '../../../../../seeds/demo-stage3-measurements';
import {
  ROOM_ID,
  demoImpulseResponse,
  demoMeasurement,
  demoRoom,
  demoTargetCurve,
  demoTuning,
  page,
} from '../../../testing/fixtures';
import { clickNow, requested } from '../../../testing/requests';
import { signInAs } from '../../../testing/session';
import type { Room } from '../room.model';
import type { AverageResponse, EqFitRequest, EqFitResult, Measurement } from './measurement.model';
import { RoomMeasurements } from './room-measurements';

const BASE = `/v1/rooms/${ROOM_ID}/measurements`;
const responses = stage3MeasuredResponses();

const analysis = demoImpulseResponse();

function measurement(
  id: string,
  channel: string,
  micPosition: string,
  kind: Measurement['kind'],
  minutesAfterNine: number,
): Measurement {
  return demoMeasurement({
    id,
    channel,
    micPosition,
    kind,
    source: kind === 'impulseResponse' ? { type: 'wav', fileName: `${channel}.wav` } : { type: 'text' },
    summary:
      kind === 'spl'
        ? { splDb: 82, weighting: 'C' }
        : kind === 'impulseResponse'
          ? { arrivalMs: analysis.arrival.arrivalMs, t30S: analysis.decay.t30S }
          : { points: 120, fromHz: 20, toHz: 20000 },
    createdAt: `2026-03-02T09:${String(minutesAfterNine).padStart(2, '0')}:00.000Z`,
  });
}

const surround = measurement('mea_ir', 'M+090', 'MLP', 'impulseResponse', 30);
const leftAtMlp = measurement('mea_l1', 'M+030', 'MLP', 'frequencyResponse', 10);
const leftBeside = measurement('mea_l2', 'M+030', 'MLP left 0.5 m', 'frequencyResponse', 12);
const centreSpl = measurement('mea_spl', 'M+000', 'MLP', 'spl', 5);
const list = [centreSpl, leftAtMlp, leftBeside, surround];

const warmCurve = demoTargetCurve();

/** What `POST /v1/eq/fit` answers: the shared fit the API runs, with the stored target resolved. */
function fitAnswer(body: EqFitRequest): EqFitResult {
  const target =
    body.target.kind === 'stored'
      ? { kind: 'points' as const, points: warmCurve.points }
      : { kind: 'flat' as const };
  const result = fitParametricEq({ ...body, target });
  return { sampleRateHz: body.sampleRateHz, ...result, cautions: [] };
}

describe('RoomMeasurements', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RoomMeasurements>;
  let loader: HarnessLoader;
  let root: HarnessLoader;

  const detect = () => fixture.detectChanges();
  const host = () => fixture.nativeElement as HTMLElement;
  const byTestId = <T extends Element = HTMLElement>(id: string) =>
    host().querySelector<T & Element>(`[data-testid="${id}"]`);
  const text = () => host().textContent!.replace(/\s+/g, ' ');
  const ask = (match: string | ((r: HttpRequest<unknown>) => boolean)) => requested(http, detect, match);
  const fitRequest = () => ask('/v1/eq/fit');

  async function settle() {
    fixture.detectChanges();
    await fixture.whenStable();
  }

  /** Mounts the panel for the room and answers the list and the target curves. */
  async function mount(measurements: Measurement[] = list, room: Room = demoRoom()) {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('developer');
    fixture = TestBed.createComponent(RoomMeasurements);
    fixture.componentRef.setInput('room', room);
    (await ask(`${BASE}?limit=100&stage=before`)).flush(page(measurements));
    (await ask('/v1/target-curves?limit=100')).flush(page([warmCurve]));
    detect();
    loader = TestbedHarnessEnvironment.loader(fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  }

  /** Answers the detail and the average of a channel, then the fit; returns the fit's request body. */
  async function answerPlot(detail: Measurement, average: AverageResponse): Promise<EqFitRequest> {
    (await ask(`${BASE}/${detail.id}`)).flush(detail);
    (await ask((r) => r.url === `${BASE}/average`)).flush(average);
    const fit = await fitRequest();
    const body = fit.request.body as EqFitRequest;
    fit.flush(fitAnswer(body));
    await settle();
    return body;
  }

  function surroundAverage(): AverageResponse {
    return {
      channel: 'M+090',
      measurementIds: [surround.id],
      micPositions: ['MLP'],
      frequenciesHz: analysis.frequencyResponse.frequenciesHz,
      magnitudeDb: analysis.frequencyResponse.magnitudeDb,
    };
  }

  function leftAverage(): AverageResponse {
    return {
      channel: 'M+030',
      measurementIds: [leftAtMlp.id, leftBeside.id],
      micPositions: ['MLP', 'MLP left 0.5 m'],
      ...responses['M+030'],
    };
  }

  async function setText(testId: string, value: string) {
    const input = byTestId<HTMLInputElement>(testId)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    detect();
  }

  async function setNumber(testId: string, value: string) {
    const input = byTestId<HTMLInputElement>(testId)!;
    input.value = value;
    input.dispatchEvent(new Event('change'));
    detect();
    await new Promise((resolve) => setTimeout(resolve));
  }

  afterEach(() => {
    http.verify();
    localStorage.clear();
  });

  it('lists the room’s measurements and shows the newest impulse response with its decay, modes and fitted EQ', async () => {
    await mount();
    const rows = [...byTestId('measurement-list')!.querySelectorAll('tbody tr')];
    expect(rows.map((row) => row.querySelector('th')?.textContent?.trim())).toEqual([
      'M+000',
      'M+030',
      'M+030',
      'M+090',
    ]);
    // An SPL reading has no response to plot.
    expect(rows[0].querySelector('button.channel-button')).toBeNull();

    const detail = { ...surround, result: analysis };
    const body = await answerPlot(detail, surroundAverage());
    expect(rows[3].getAttribute('class')).toContain('is-selected');
    // The fit gets the room's volume and the measured T30, the room's band count and cut, no boost.
    const { widthM, lengthM, heightM } = demoRoom().dimensions;
    expect(body.room?.volumeM3).toBeCloseTo(widthM * lengthM * heightM, 9);
    expect(body.room?.reverberationTimeS).toBe(analysis.decay.t30S);
    expect(body.maxBands).toBe(8);
    expect(body.maxCutDb).toBe(12);
    expect(body.maxBoostDb).toBe(0);
    expect(body.target).toEqual({ kind: 'flat' });
    expect(body.fromHz).toBeUndefined();

    expect(text()).toContain('Response of M+090');
    expect(text()).toContain('Impulse response at MLP');
    expect(byTestId('ir-facts')?.textContent).toContain('Arrival');
    expect(byTestId('schroeder')).not.toBeNull();
    expect(byTestId('decay-table')?.querySelectorAll('tbody tr').length).toBeGreaterThan(0);
    expect(byTestId('mode-table')?.querySelectorAll('tbody tr').length).toBe(10);
    const fit = fitAnswer(body);
    expect(byTestId('fit-summary')?.textContent).toContain(
      `${fit.bands.length} band${fit.bands.length === 1 ? '' : 's'} from`,
    );
    expect(byTestId('response-chart')).not.toBeNull();
  });

  it('averages a channel measured at two positions and fits it without a decay time', async () => {
    await mount();
    await answerPlot({ ...surround, result: analysis }, surroundAverage());
    await clickNow(host().querySelector('[aria-label="Show M+030 at MLP"]'), detect);
    const body = await answerPlot({ ...leftAtMlp, result: responses['M+030'] }, leftAverage());
    expect(text()).toContain('Response of M+030');
    // Only impulse responses carry a decay time; the fit then assumes one.
    expect(body.room?.reverberationTimeS).toBeUndefined();
    expect(body.measured.frequenciesHz.length).toBeGreaterThan(0);
    expect(byTestId('ir-facts')).toBeNull();
    expect(byTestId('kind-choice')).toBeNull();
  });

  it('refuses a fit range or band count it cannot use before asking, and sends the choices it can', async () => {
    await mount([leftAtMlp, leftBeside]);
    const first = await answerPlot({ ...leftBeside, result: responses['M+030'] }, leftAverage());
    expect(first.maxBands).toBe(8);

    await setNumber('fit-from', '500');
    const narrowed = await fitRequest();
    expect((narrowed.request.body as EqFitRequest).fromHz).toBe(500);
    narrowed.flush(fitAnswer(narrowed.request.body as EqFitRequest));
    await setNumber('fit-to', '200');
    await settle();
    expect(byTestId('fit-controls')?.textContent).toContain('The upper end must be above the lower end.');
    http.expectNone('/v1/eq/fit');

    await setNumber('fit-to', '');
    const widened = await fitRequest();
    widened.flush(fitAnswer(widened.request.body as EqFitRequest));
    await setNumber('fit-bands', '12');
    await settle();
    expect(byTestId('fit-controls')?.textContent).toContain(
      "Use 1 to 8 bands (the room's limit per channel).",
    );
    http.expectNone('/v1/eq/fit');

    await setNumber('fit-bands', '3');
    const fewer = await fitRequest();
    const fewerBody = fewer.request.body as EqFitRequest;
    expect(fewerBody.maxBands).toBe(3);
    expect(fewerBody.fromHz).toBe(500);
    const answer = fitAnswer(fewerBody);
    expect(answer.bands.length).toBeLessThanOrEqual(3);
    fewer.flush(answer);
    await settle();

    // Boosts up to the room's limit, and a stored target by name.
    await clickNow(host().querySelector('mat-checkbox input'), detect);
    const boosted = await fitRequest();
    expect((boosted.request.body as EqFitRequest).maxBoostDb).toBe(demoRoom().limits!.eqMaxBoostDb);
    boosted.flush(fitAnswer(boosted.request.body as EqFitRequest));
    await settle();
    await clickNow(byTestId('fit-reset'), detect);
    const reset = await fitRequest();
    expect(reset.request.body).toEqual(first);
    reset.flush(fitAnswer(reset.request.body as EqFitRequest));
    await settle();
    expect(
      await (
        await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="fit-reset"]' }))
      ).isDisabled(),
    ).toBe(true);
  });

  it('fits toward a stored target curve', async () => {
    await mount([leftAtMlp]);
    await answerPlot(
      { ...leftAtMlp, result: responses['M+030'] },
      { ...leftAverage(), micPositions: ['MLP'] },
    );
    const select = byTestId('fit-target')!;
    await clickNow(select.querySelector('.mat-mdc-select-trigger'), detect);
    await clickNow(
      [...document.querySelectorAll('mat-option')].find((o) => o.textContent?.trim() === 'Warm small room'),
      detect,
    );
    const fit = await fitRequest();
    expect((fit.request.body as EqFitRequest).target).toEqual({ kind: 'stored', name: 'Warm small room' });
    fit.flush(fitAnswer(fit.request.body as EqFitRequest));
    await settle();
  });

  it('asks which kind to average when a channel has both, and remembers the choice for the room and channel', async () => {
    const leftIr = measurement('mea_lir', 'M+030', 'MLP', 'impulseResponse', 40);
    await mount([leftAtMlp, leftIr]);
    const irDetail = { ...leftIr, result: analysis };
    (await ask(`${BASE}/${leftIr.id}`)).flush(irDetail);
    // The newest impulse response is shown, so impulse responses are averaged.
    const byIr = await ask((r) => r.url === `${BASE}/average`);
    expect(byIr.request.params.get('kind')).toBe('impulseResponse');
    byIr.flush({ ...surroundAverage(), channel: 'M+030', measurementIds: [leftIr.id] });
    const first = await fitRequest();
    first.flush(fitAnswer(first.request.body as EqFitRequest));
    await settle();
    expect(byTestId('kind-choice')?.textContent).toContain('M+030 has both kinds');

    const toggle = [...byTestId('kind-choice')!.querySelectorAll('mat-button-toggle button')].find((b) =>
      b.textContent?.includes('Frequency responses'),
    );
    await clickNow(toggle, detect);
    const byFr = await ask((r) => r.url === `${BASE}/average`);
    expect(byFr.request.params.get('kind')).toBe('frequencyResponse');
    byFr.flush({ ...leftAverage(), measurementIds: [leftAtMlp.id], micPositions: ['MLP'] });
    const fit = await fitRequest();
    fit.flush(fitAnswer(fit.request.body as EqFitRequest));
    await settle();
    expect(localStorage.getItem(`isochron.averageKind.${ROOM_ID}.M+030`)).toBe('frequencyResponse');

    // Next visit: the remembered kind is averaged, though the impulse response is the row shown.
    TestBed.resetTestingModule();
    await mount([leftAtMlp, leftIr]);
    (await ask(`${BASE}/${leftIr.id}`)).flush(irDetail);
    const remembered = await ask((r) => r.url === `${BASE}/average`);
    expect(remembered.request.params.get('kind')).toBe('frequencyResponse');
    remembered.flush({ ...leftAverage(), measurementIds: [leftAtMlp.id], micPositions: ['MLP'] });
    const again = await fitRequest();
    again.flush(fitAnswer(again.request.body as EqFitRequest));
    await settle();
  });

  /** A two-channel 16-bit WAV at 48 kHz: a click on channel 2 after a loopback click on channel 1. */
  function stereoWav(): File {
    const frames = 4800;
    const loudspeaker = new Float64Array(frames);
    const loopback = new Float64Array(frames);
    loopback[96] = 0.5;
    loudspeaker[800] = 0.5;
    const bytes = riffFile({
      chunks: [
        { id: 'fmt ', body: fmtBody({ channels: 2, sampleRateHz: 48000, bitsPerSample: 16 }) },
        { id: 'data', body: pcm16Body([loopback, loudspeaker]) },
      ],
    });
    return new File([new Uint8Array(bytes)], 'm-030-mlp.wav', { type: 'audio/wav' });
  }

  async function chooseFile(file: File) {
    const input = byTestId<HTMLInputElement>('upload-file')!;
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    // The page reads the WAV header in the browser.
    for (let tick = 0; tick < 50 && !byTestId('wav-facts'); tick++) {
      await new Promise((resolve) => setTimeout(resolve));
      detect();
    }
  }

  async function pick(testId: string, optionText: string) {
    await clickNow(byTestId(testId)!.querySelector('.mat-mdc-select-trigger'), detect);
    await clickNow(
      [...document.querySelectorAll('mat-option')].find((o) => o.textContent?.trim() === optionText),
      detect,
    );
  }

  const submit = () => clickNow(byTestId('upload-submit'), detect);

  it('names every missing field of an upload and sends nothing', async () => {
    await mount([]);
    expect(text()).toContain('No measurements stored for this room yet.');
    await setText('upload-mic', '  ');
    await submit();
    await settle();
    const form = host().querySelector('form.upload')!.textContent!;
    expect(form).toContain('Choose the loudspeaker you measured.');
    expect(form).toContain('Name the microphone position (e.g. MLP or 2).');
    expect(form).toContain('Choose a WAV impulse response or a text response.');
    http.expectNone((r) => r.method === 'POST');
  });

  it('uploads one channel of a multichannel WAV with its loopback and smoothing', async () => {
    await mount([]);
    await pick('upload-channel', 'M-030 — Right');
    await chooseFile(stereoWav());
    expect(byTestId('wav-facts')?.textContent?.replace(/\s+/g, ' ')).toContain('WAV, 2 channels, 48');
    // The loudspeaker and its loopback cannot share a channel; a multichannel file needs the choice.
    await submit();
    await settle();
    expect(host().querySelector('form.upload')!.textContent).toContain(
      'This file has 2 channels: choose the one with the loudspeaker.',
    );
    await pick('upload-reference-channel', 'Channel 1');
    await pick('upload-file-channel', 'Channel 1 of 2');
    await submit();
    await settle();
    expect(host().querySelector('form.upload')!.textContent).toContain(
      'The loudspeaker and the timing reference cannot be the same channel.',
    );
    http.expectNone((r) => r.method === 'POST');

    await pick('upload-file-channel', 'Channel 2 of 2');
    await pick('upload-smoothing', '1/3 octave');
    await submit();
    const upload = await ask((r) => r.method === 'POST' && r.url === BASE);
    const form = upload.request.body as FormData;
    expect(form.get('channel')).toBe('M-030');
    expect(form.get('micPosition')).toBe('MLP');
    // 0-based in the request, counted from 1 on screen.
    expect(form.get('fileChannel')).toBe('1');
    expect(form.get('referenceFileChannel')).toBe('0');
    expect(Number(form.get('smoothingOctaves'))).toBeCloseTo(1 / 3, 12);
    expect((form.get('file') as File).name).toBe('m-030-mlp.wav');
    const stored = measurement('mea_new', 'M-030', 'MLP', 'impulseResponse', 50);
    upload.flush(stored, { status: 201, statusText: 'Created' });
    // The list is read again and the new measurement shown.
    (await ask(`${BASE}?limit=100&stage=before`)).flush(page([stored]));
    (await ask(`${BASE}/${stored.id}`)).flush({ ...stored, result: analysis });
    (await ask((r) => r.url === `${BASE}/average`)).flush({ ...surroundAverage(), channel: 'M-030' });
    const fit = await fitRequest();
    fit.flush(fitAnswer(fit.request.body as EqFitRequest));
    await settle();
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe('Stored M-030 at MLP.');
    expect(byTestId('wav-facts')).toBeNull();
    expect(text()).toContain('Response of M-030');
  });

  it('shows the API’s refusal of an upload with each field named as the form names it', async () => {
    await mount([]);
    await pick('upload-channel', 'M+000 — Centre');
    await chooseFile(stereoWav());
    await pick('upload-file-channel', 'Channel 2 of 2');
    await submit();
    (await ask((r) => r.method === 'POST')).flush(
      {
        title: 'Unusable audio',
        status: 422,
        detail: 'The response is too quiet to analyse.',
        errors: [
          { pointer: '/body/fileChannel', message: 'channel 2 is silent' },
          { pointer: '/body/file', message: 'The response is too quiet to analyse.' },
        ],
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    const problem = byTestId('upload-problem')!.textContent!;
    expect(problem).toContain('Unusable audio');
    expect(problem).toContain('The response is too quiet to analyse.');
    expect(problem).toContain('Channel in the file: channel 2 is silent');
    // The error repeating the detail is not said twice.
    expect(problem).not.toContain('File: The response');
    expect(
      await (
        await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="upload-submit"]' }))
      ).isDisabled(),
    ).toBe(false);
  });

  it('deletes a measurement only after confirmation', async () => {
    await mount([centreSpl]);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="delete-measurement"]' }))
    ).click();
    const confirm = await root.getHarness(MatDialogHarness);
    expect(await confirm.getContentText()).toContain(
      'M+000 at microphone position MLP will be deleted with its analysis.',
    );
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Delete measurement' }))).click();
    const request = await ask(`${BASE}/${centreSpl.id}`);
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    (await ask(`${BASE}?limit=100&stage=before`)).flush(page([]));
    await settle();
    expect(text()).toContain('No measurements stored for this room yet.');
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe('Deleted M+000 at MLP.');
  });

  it('applies the fitted bands to a chosen channel of a tuning as a new version', async () => {
    await mount([leftAtMlp]);
    const body = await answerPlot(
      { ...leftAtMlp, result: responses['M+030'] },
      { ...leftAverage(), micPositions: ['MLP'] },
    );
    const fit = fitAnswer(body);
    expect(fit.bands.length).toBeGreaterThan(0);
    await clickNow(byTestId('apply-fit'), detect);
    (await ask(`/v1/rooms/${ROOM_ID}/tunings?limit=100`)).flush(page([demoTuning()]));
    await settle();
    const dialog = await root.getHarness(MatDialogHarness);
    await (
      await dialog.getHarness(MatButtonHarness.with({ selector: '[data-testid="apply-confirm"]' }))
    ).click();
    const patch = await ask('/v1/tunings/tun_bm80');
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).toEqual({ channels: [{ id: 'M+030', eq: fit.bands }] });
    patch.flush(demoTuning({ version: 4, latestVersion: 4 }));
    await settle();
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe(
      'Fitted EQ applied to M+030 of “Bass-managed 80 Hz”, version 4.',
    );
  });

  it('says there is no tuning to apply a fit to yet', async () => {
    await mount([leftAtMlp]);
    await answerPlot(
      { ...leftAtMlp, result: responses['M+030'] },
      { ...leftAverage(), micPositions: ['MLP'] },
    );
    await clickNow(byTestId('apply-fit'), detect);
    (await ask(`/v1/rooms/${ROOM_ID}/tunings?limit=100`)).flush(page([]));
    await settle();
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe(
      'This room has no tuning yet: start one with New tuning above.',
    );
  });

  it('offers a retry when the list cannot be read', async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('developer');
    fixture = TestBed.createComponent(RoomMeasurements);
    fixture.componentRef.setInput('room', demoRoom());
    (await ask(`${BASE}?limit=100&stage=before`)).flush(null, { status: 503, statusText: 'x' });
    (await ask('/v1/target-curves?limit=100')).flush(page([]));
    await settle();
    expect(host().querySelector('[role="alert"]')?.textContent).toContain(
      'The service is not available right now',
    );
    await clickNow(
      [...host().querySelectorAll('[role="alert"] button')].find((b) => b.textContent?.includes('Retry')),
      detect,
    );
    (await ask(`${BASE}?limit=100&stage=before`)).flush(page([]));
    await settle();
    expect(host().querySelector('[role="alert"]')).toBeNull();
  });
});
