import { provideHttpClient } from '@angular/common/http';
import { HttpRequest } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { EXACT_LAYOUT, exportForProcessor } from '../../../../../shared/processor/processor-export';
import { findLimitViolations } from '../../../../../shared/plan/tuning-limits';
import { OpenDialog, openDialog } from '../../../testing/dialogs';
import { PROFILE_ID, ROOM_ID, demoProfile, demoTuning, page } from '../../../testing/fixtures';
import type { ProcessorProfile } from '../../rooms/room.model';
import type { TuningExport } from '../export-summary';
import type { Tuning } from '../tuning.model';
import { ExportDialog, ExportDialogData } from './export-dialog';

/** A profile with third-octave frequencies and whole-dB gains: rounding to it costs audible dB. */
const coarse = demoProfile({
  id: 'prof_coarse',
  name: 'Coarse third-octave (demo)',
  sampleRatesHz: [96000],
  eq: {
    ...demoProfile().eq,
    frequencyStepUnit: 'octave',
    frequencyHz: { min: 20, max: 20000, step: 1 / 3 },
    gainDb: { min: -12, max: 6, step: 1 },
  },
});

/** The demo tuning with a band on M+030 between third-octave centres and off the demo profile's steps. */
function tuningWithBands(): Tuning {
  const tuning = demoTuning();
  tuning.channels[0] = {
    ...tuning.channels[0],
    eq: [{ type: 'peaking', frequencyHz: 71, gainDb: -6.43, q: 4.237 }],
  };
  return tuning;
}

/**
 * The JSON export as the API builds it: the same pure export of the shared core (exportForProcessor)
 * with the header the API adds.
 */
function exportBody(tuning: Tuning, profile: ProcessorProfile | null, sampleRateHz: number): TuningExport {
  const settings = { sampleRateHz, channels: tuning.channels, subwoofer: tuning.subwoofer };
  const exported = exportForProcessor(settings, sampleRateHz, profile ?? EXACT_LAYOUT);
  return {
    stale: null,
    header: {
      tuningId: tuning.id,
      version: tuning.version,
      name: tuning.name,
      roomId: ROOM_ID,
      roomName: 'Stage 3',
      sampleRateHz,
      profile: profile ? { id: profile.id, name: profile.name } : null,
      createdAt: tuning.versionCreatedAt,
      isochronVersion: '0.1.0',
      convention: 'Sections are normalised a0 = 1.',
      cautions: [],
    },
    coefficientLayout: exported.coefficientLayout,
    channels: exported.channels,
    bassManagement: exported.bassManagement,
  };
}

describe('ExportDialog', () => {
  let http: HttpTestingController;
  let opened: OpenDialog<ExportDialog, unknown>;
  const created = globalThis.URL.createObjectURL;
  const revoked = globalThis.URL.revokeObjectURL;

  beforeEach(() => {
    // Left from the last test, whose application is gone: nothing to run change detection on yet.
    opened = undefined as unknown as OpenDialog<ExportDialog, unknown>;
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    globalThis.URL.createObjectURL = created;
    globalThis.URL.revokeObjectURL = revoked;
    vi.restoreAllMocks();
  });

  async function requested(match: (r: HttpRequest<unknown>) => boolean): Promise<TestRequest> {
    for (let tick = 0; tick < 50; tick++) {
      opened?.fixture.detectChanges();
      const found = http.match(match);
      if (found.length === 1) return found[0];
      expect(found.length).toBe(0);
      await new Promise((resolve) => setTimeout(resolve));
    }
    throw new Error('no such request');
  }
  const preview = () => requested((r) => r.url.endsWith('/export') && r.responseType === 'json');

  /** Opens the dialog; the profiles list and the first preview are answered by the caller. */
  async function open(data: ExportDialogData): Promise<void> {
    const opening = openDialog<ExportDialog>(ExportDialog, { data });
    // The dialog asks for both while it opens; openDialog waits for the page to be stable.
    (await requested((r) => r.url === '/v1/processor-profiles')).flush(page([demoProfile(), coarse]));
    return opening.then((o) => void (opened = o));
  }

  const testId = (id: string) => opened.element.querySelector(`[data-testid="${id}"]`);
  const select = (id: string) =>
    opened.loader.getHarness(MatSelectHarness.with({ selector: `[data-testid="${id}"]` }));
  /**
   * Picks an option by its text without waiting for the dialog to be stable: the choice asks for a new
   * preview at once, and a harness would wait for its answer.
   */
  async function choose(id: string, text: string) {
    await (await select(id)).open();
    const option = [...document.querySelectorAll<HTMLElement>('mat-option')].find(
      (o) => o.textContent?.trim() === text,
    );
    expect(option).toBeDefined();
    option!.click();
  }
  const button = (id: string) =>
    opened.loader.getHarness(MatButtonHarness.with({ selector: `[data-testid="${id}"]` }));

  it('previews the room’s profile at the tuning’s rate and names the channel rounding costs most', async () => {
    const tuning = tuningWithBands();
    const opening = open({ tuning, roomProfileId: PROFILE_ID });
    const first = await preview();
    expect(first.request.url).toBe(`/v1/tunings/${tuning.id}/export`);
    // The tuning's own rate is left to the API; the version shown is the one exported.
    expect(first.request.params.toString()).toBe(`format=json&version=3&profile=${PROFILE_ID}`);
    const body = exportBody(tuning, demoProfile(), 48000);
    first.flush(body);
    await opening;
    await opened.settle();

    expect(await (await select('export-profile')).getValueText()).toBe(
      'Generic 8-band, 48/96 kHz (demo) (the room’s)',
    );
    expect(await (await select('export-rate')).getValueText()).toBe('48 kHz (the tuning’s)');
    const rows = [...testId('export-channels')!.querySelectorAll('tbody tr')];
    expect(rows.map((row) => row.querySelector('code')?.textContent)).toEqual(body.channels.map((c) => c.id));
    expect(rows[3].textContent).toContain('no EQ');
    const worst = [...body.channels].sort(
      (a, b) => b.eqRounding.maxDeviationDb - a.eqRounding.maxDeviationDb,
    )[0];
    // 0.1 dB gain and 0.01 Q steps move the M+030 band a little, and nothing else.
    expect(worst.id).toBe('M+030');
    expect(worst.eqRounding.maxDeviationDb).toBeGreaterThan(0.01);
    expect(testId('export-rounding')?.textContent).toContain(`(${worst.id} at`);
    expect(testId('export-rounding')?.textContent).toContain('Generic 8-band, 48/96 kHz (demo)');
    expect(await (await button('export-json')).isDisabled()).toBe(false);
  });

  it('flags the channels a coarse profile moves by more than half a decibel, at its nearest rate', async () => {
    const tuning = tuningWithBands();
    const opening = open({ tuning, roomProfileId: PROFILE_ID });
    (await preview()).flush(exportBody(tuning, demoProfile(), 48000));
    await opening;
    await choose('export-profile', 'Coarse third-octave (demo)');
    // The coarse profile runs at 96 kHz only: the rate follows, and the API is asked for it.
    const second = await preview();
    expect(second.request.params.get('profile')).toBe('prof_coarse');
    expect(second.request.params.get('sampleRateHz')).toBe('96000');
    const body = exportBody(tuning, coarse, 96000);
    const costly = body.channels.filter((c) => c.eqRounding.maxDeviationDb > 0.5).map((c) => c.id);
    expect(costly).toContain('M+030');
    second.flush(body);
    await opened.settle();
    expect(await (await select('export-rate')).getValueText()).toBe('96 kHz');
    const flagged = [...testId('export-channels')!.querySelectorAll('tbody tr.notable code')].map(
      (code) => code.textContent,
    );
    expect(flagged).toEqual(costly);
    expect(testId('export-rounding')?.classList).toContain('notable');
  });

  it('exports exact values at any common rate', async () => {
    const tuning = demoTuning();
    const opening = open({ tuning, roomProfileId: null });
    const first = await preview();
    expect(first.request.params.get('profile')).toBe('none');
    first.flush(exportBody(tuning, null, 48000));
    await opening;
    const rate = await select('export-rate');
    await rate.open();
    const offered = await Promise.all((await rate.getOptions()).map((o) => o.getText()));
    expect(offered).toEqual([
      '44.1 kHz',
      '48 kHz (the tuning’s)',
      '88.2 kHz',
      '96 kHz',
      '176.4 kHz',
      '192 kHz',
    ]);
    await choose('export-rate', '192 kHz');
    const second = await preview();
    expect(second.request.params.toString()).toBe('format=json&version=3&profile=none&sampleRateHz=192000');
    second.flush(exportBody(tuning, null, 192000));
    await opened.settle();
    expect(testId('export-rounding')?.textContent).toContain('exact values (no processor profile)');
  });

  it('shows why the API refused the export and offers no download', async () => {
    const tuning = demoTuning();
    tuning.channels[2] = { ...tuning.channels[2], trimDb: -12.5 };
    const opening = open({ tuning, roomProfileId: PROFILE_ID });
    const violations = findLimitViolations(
      { sampleRateHz: 48000, channels: tuning.channels, subwoofer: tuning.subwoofer },
      null,
      demoProfile(),
    );
    expect(violations.length).toBeGreaterThan(0);
    (await preview()).flush(
      {
        title: "Outside the processor profile's limits",
        status: 422,
        detail: `${violations[0].message}. Nothing was exported; choose another profile or change the tuning.`,
        errors: violations.map((v) => ({ pointer: '/query/profile', message: v.message })),
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await opening;
    await opened.settle();
    const problem = testId('export-problem')!.textContent!;
    expect(problem).toContain("Outside the processor profile's limits");
    expect(problem).toContain(violations[0].message);
    expect(testId('export-channels')).toBeNull();
    expect(await (await button('export-csv')).isDisabled()).toBe(true);
    expect(await (await button('export-json')).isDisabled()).toBe(true);
  });

  it('says the room changed and lists the export’s cautions', async () => {
    const tuning = demoTuning();
    const opening = open({ tuning, roomProfileId: PROFILE_ID });
    const body = exportBody(tuning, demoProfile(), 48000);
    body.stale = { since: '2026-03-04T08:00:00.000Z', reasons: ['listener moved 0.80 m'] };
    body.header.cautions = [{ code: 'eqBoost', message: 'M+000 is boosted by 3 dB at 125 Hz.' }];
    (await preview()).flush(body);
    await opening;
    await opened.settle();
    expect(testId('export-stale')?.textContent).toContain('listener moved 0.80 m');
    expect(testId('export-cautions')?.textContent).toContain('M+000 is boosted by 3 dB at 125 Hz.');
  });

  it('downloads exactly the previewed choice as CSV and JSON, named after the tuning', async () => {
    const objectUrls: Blob[] = [];
    globalThis.URL.createObjectURL = (blob: Blob) => {
      objectUrls.push(blob);
      return `blob:test/${objectUrls.length}`;
    };
    globalThis.URL.revokeObjectURL = () => undefined;
    const clicked: Array<{ href: string; download: string }> = [];
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push({ href: this.href, download: this.download });
    });
    const tuning = demoTuning();
    const opening = open({ tuning, roomProfileId: PROFILE_ID });
    (await preview()).flush(exportBody(tuning, demoProfile(), 48000));
    await opening;

    await (await button('export-csv')).click();
    const csv = http.expectOne((r) => r.url.endsWith('/export') && r.responseType === 'blob');
    expect(csv.request.params.toString()).toBe(`format=csv&version=3&profile=${PROFILE_ID}`);
    expect(csv.request.headers.get('Accept')).toBe('text/csv');
    csv.flush(new Blob(['channel,delayMs\n'], { type: 'text/csv' }));
    await (await button('export-json')).click();
    const json = http.expectOne((r) => r.url.endsWith('/export') && r.responseType === 'blob');
    expect(json.request.params.get('format')).toBe('json');
    json.flush(new Blob(['{}'], { type: 'application/json' }));

    expect(clicked).toEqual([
      { href: 'blob:test/1', download: 'Bass-managed-80-Hz-v3.csv' },
      { href: 'blob:test/2', download: 'Bass-managed-80-Hz-v3.json' },
    ]);
    expect(await objectUrls[0].text()).toBe('channel,delayMs\n');
  });

  it('reports a failed download', async () => {
    const tuning = demoTuning();
    const opening = open({ tuning, roomProfileId: PROFILE_ID });
    (await preview()).flush(exportBody(tuning, demoProfile(), 48000));
    await opening;
    await (await button('export-csv')).click();
    http
      .expectOne((r) => r.responseType === 'blob')
      .flush(
        new Blob(['{"title":"Service unavailable","status":503}'], { type: 'application/problem+json' }),
        {
          status: 503,
          statusText: 'Service Unavailable',
        },
      );
    await opened.settle();
    const snack = await opened.loader.getHarness(MatSnackBarHarness);
    expect(await snack.getMessage()).toContain('The service is not available right now');
  });
});
