import { HttpRequest, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { findLimitViolations } from '../../../../../shared/plan/tuning-limits';
import {
  PROFILE_ID,
  ROOM_ID,
  demoProfile,
  demoRoom,
  demoTuning,
  demoVersion,
  page,
} from '../../../testing/fixtures';
import { signInAs } from '../../../testing/session';
import type { Room } from '../../rooms/room.model';
import type { Tuning, TuningComparison, TuningVersion } from '../tuning.model';
import { TuningPage } from './tuning-page';

@Component({ selector: 'iso-elsewhere', template: 'elsewhere' })
class Elsewhere {
  readonly shown = true;
}

const TUNING_ID = 'tun_bm80';
const TUNING_URL = `/v1/tunings/${TUNING_ID}`;

interface Scenario {
  room?: Room;
  tuning?: Tuning;
  versions?: TuningVersion[];
  roomTunings?: Tuning[];
  url?: string;
}

describe('TuningPage', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let root: HarnessLoader;
  let router: Router;

  const text = () => harness.routeNativeElement?.textContent ?? '';
  const byTestId = (id: string) => harness.routeNativeElement?.querySelector(`[data-testid="${id}"]`);
  const button = (testId: string) =>
    loader.getHarness(MatButtonHarness.with({ selector: `[data-testid="${testId}"]` }));

  async function settle() {
    harness.detectChanges();
    await harness.fixture.whenStable();
  }

  /**
   * The request matching `url` once the page has made it (a few ticks after a dialog closed or a write
   * answered); whenStable would wait for the answer itself.
   */
  async function requested(url: string | ((r: HttpRequest<unknown>) => boolean)): Promise<TestRequest> {
    for (let tick = 0; tick < 50; tick++) {
      harness.detectChanges();
      const found = http.match(url);
      if (found.length === 1) return found[0];
      expect(found.length).toBe(0);
      await new Promise((resolve) => setTimeout(resolve));
    }
    throw new Error(`no request for ${String(url)}`);
  }

  /**
   * Clicks a button of the page without waiting for the page to be stable (a harness click would wait
   * for the answers to what the click asks for).
   */
  async function press(testId: string) {
    (byTestId(testId) as HTMLButtonElement).click();
    harness.detectChanges();
    await new Promise((resolve) => setTimeout(resolve));
  }

  /** Opens the page at its real route and answers the page's four loads as the API would. */
  async function render(scenario: Scenario = {}) {
    const room = scenario.room ?? demoRoom();
    const tuning = scenario.tuning ?? demoTuning();
    const versions =
      scenario.versions ??
      [1, 2, 3].map((v) => demoVersion(v, v === 3 ? { origin: 'restore', restoredFromVersion: 1 } : {}));
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: 'rooms/:roomId/tunings/:tuningId', component: TuningPage },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    await signInAs('developer');
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(scenario.url ?? `/rooms/${ROOM_ID}/tunings/${TUNING_ID}`);
    http.expectOne(`/v1/rooms/${ROOM_ID}`).flush(room);
    http.expectOne(`/v1/rooms/${ROOM_ID}/tunings?limit=100`).flush(page(scenario.roomTunings ?? [tuning]));
    http.expectOne((r) => r.url === TUNING_URL).flush(tuning);
    http.expectOne(`${TUNING_URL}/versions?limit=100`).flush(page(versions));
    if (room.profileId) (await requested(`/v1/processor-profiles/${room.profileId}`)).flush(demoProfile());
    await settle();
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(harness.fixture);
    return { room, tuning };
  }

  async function snack(): Promise<string> {
    return (await root.getHarness(MatSnackBarHarness)).getMessage();
  }

  afterEach(() => http.verify());

  it('lists every channel with its delay in samples, trim, polarity, high-pass, band count and loudspeaker name', async () => {
    await render();
    const table = await loader.getHarness(
      MatTableHarness.with({ selector: '[data-testid="tuning-channels"]' }),
    );
    const columns = await table.getCellTextByColumnName();
    expect(columns['id'].text).toEqual(['M+030Left', 'M-030Right', 'M+000Centre', 'LFE1Subwoofer']);
    // 1.6875 ms at 48 kHz is 81 samples; 1.5625 ms is 75.
    expect(columns['samples'].text).toEqual(['75', '72', '81', '0']);
    expect(columns['polarity'].text).toEqual(['Normal', 'Normal', 'Normal', 'Inverted']);
    expect(columns['highPass'].text[0].replace(/\s/g, ' ')).toBe('Linkwitz-Riley 24 dB/oct, 80 Hz');
    expect(columns['highPass'].text[3]).toBe('Full range');
    expect(columns['eq'].text).toEqual(['0', '0', '1', '0']);
    expect(columns['trim'].text[2]).toContain('1.8');
    expect(text()).toContain('Version 3 of 3 · 4 channels at 48 kHz');
    expect(byTestId('past-version')).toBeNull();
    expect(byTestId('stale-tuning')).toBeNull();
  });

  it('marks a channel whose settings the room’s processor cannot take', async () => {
    const tuning = demoTuning();
    tuning.channels[1] = { ...tuning.channels[1], trimDb: -14 };
    await render({ tuning });
    const rows = harness.routeNativeElement!.querySelectorAll('[data-testid="tuning-channels"] tbody tr');
    expect(rows[1].textContent).toContain('over limits');
    expect(rows[0].textContent).not.toContain('over limits');
    // The chip says which limit, from the room's own figure (trimMinDb −12 dB).
    expect(rows[1].querySelector('.iso-chip')?.getAttribute('title')).toBe(
      'The room allows trims down to −12 dB.',
    );
  });

  it('says since when and why a tuning was made for the room as it was', async () => {
    await render({
      tuning: demoTuning({
        stale: { since: '2026-03-04T08:00:00.000Z', reasons: ['listener moved 0.80 m', 'limits changed'] },
      }),
    });
    expect(byTestId('stale-tuning')?.textContent).toContain('listener moved 0.80 m; limits changed');
  });

  it('links the report of the version shown', async () => {
    await render();
    expect(byTestId('tuning-report')?.getAttribute('href')).toBe(
      `/v1/rooms/${ROOM_ID}/report?tuningId=${TUNING_ID}&version=3`,
    );
  });

  it('lists versions newest first, says who made them and what they were', async () => {
    await render({
      versions: [
        demoVersion(1),
        demoVersion(2, { createdBy: { userId: 'usr_9', keyId: 'key_77' } }),
        demoVersion(3, { origin: 'restore', restoredFromVersion: 1 }),
      ],
    });
    const table = await loader.getHarness(MatTableHarness.with({ selector: '[data-testid="versions"]' }));
    const columns = await table.getCellTextByColumnName();
    expect(columns['version'].text).toEqual(['v3 latest', 'v2', 'v1']);
    expect(columns['origin'].text).toEqual(['Restored from v1', 'Edited', 'Made from a plan']);
    expect(columns['who'].text).toEqual([
      'You, in the console',
      'User usr_9, with key key_77',
      'You, in the console',
    ]);
    // The latest cannot be restored onto itself, and version 1 has nothing before it to differ from.
    expect(byTestId('restore-v3')).toBeNull();
    expect(byTestId('restore-v2')).not.toBeNull();
    expect(byTestId('changes-v1')).toBeNull();
  });

  it('shows what changed in a version against the one before it', async () => {
    await render();
    await (await button('changes-v3')).click();
    const request = http.expectOne((r) => r.url === '/v1/tunings/compare');
    expect(request.request.params.toString()).toBe(
      `left=${TUNING_ID}&right=${TUNING_ID}&leftVersion=2&rightVersion=3`,
    );
    const comparison: TuningComparison = {
      identical: false,
      left: { tuningId: TUNING_ID, name: 'Bass-managed 80 Hz', version: 2 },
      right: { tuningId: TUNING_ID, name: 'Bass-managed 80 Hz', version: 3 },
      subwoofer: { lfeGainDbDifference: 0, lowPassChanged: false },
      channels: [
        {
          id: 'M+000',
          presentIn: 'both',
          delayMsDifference: 0,
          trimDbDifference: -1.5,
          polarityChanged: false,
          highPassChanged: false,
          bassManagedChanged: false,
          eqChanged: true,
          eqBands: { left: 0, right: 1 },
          maxResponseDifferenceDb: 4.5,
        },
      ],
    };
    request.flush(comparison);
    await settle();
    expect(text()).toContain('Changes in version 3 against version 2');
    expect(harness.routeNativeElement!.querySelector('[data-testid="comparison"]')?.textContent).toContain(
      '0 → 1',
    );
  });

  it('shows a past version read-only and restores it as a new latest version', async () => {
    await render({
      url: `/rooms/${ROOM_ID}/tunings/${TUNING_ID}?version=2`,
      tuning: demoTuning({ version: 2, latestVersion: 3 }),
    });
    expect(byTestId('past-version')?.textContent).toContain(
      'You are looking at version 2; the latest is 3. Past versions cannot be edited.',
    );
    // Read-only: the editor offers no save.
    expect(byTestId('save-channel')).toBeNull();
    await (await button('restore-shown')).click();
    const restore = http.expectOne(`${TUNING_URL}/versions/2/restore`);
    expect(restore.request.method).toBe('POST');
    restore.flush(demoTuning({ version: 4, latestVersion: 4, origin: 'restore' }));
    // The new version is shown at once; versions and the room's tunings are read again.
    (await requested(`${TUNING_URL}/versions?limit=100`)).flush(
      page([1, 2, 3, 4].map((v) => demoVersion(v))),
    );
    (await requested(`/v1/rooms/${ROOM_ID}/tunings?limit=100`)).flush(
      page([demoTuning({ latestVersion: 4 })]),
    );
    // The address drops ?version, and the page asks for the latest again.
    (await requested(TUNING_URL)).flush(demoTuning({ version: 4, latestVersion: 4 }));
    expect(router.url).toBe(`/rooms/${ROOM_ID}/tunings/${TUNING_ID}`);
    await settle();
    expect(await snack()).toBe('Version 2 restored as version 4.');
    expect(byTestId('past-version')).toBeNull();
    expect(text()).toContain('Version 4 of 4');
  });

  it('restores an older version from the list and reports a refusal without changing the page', async () => {
    await render();
    await (await button('restore-v1')).click();
    http
      .expectOne(`${TUNING_URL}/versions/1/restore`)
      .flush(
        { title: 'Outside the room’s limits', status: 422, detail: 'M+000’s trim is -14 dB.' },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await settle();
    expect(await snack()).toContain('M+000’s trim is -14 dB.');
    expect(text()).toContain('Version 3 of 3');
  });

  it('saves an edited channel as a new version', async () => {
    await render();
    await press('pick-M-030');
    const trim = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="field-trimDb"]' }));
    expect(await trim.getValue()).toBe('-0.9');
    await trim.setValue('-2.5');
    await (await button('save-channel')).click();
    const patch = http.expectOne(TUNING_URL);
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body.channels).toHaveLength(1);
    expect(patch.request.body.channels[0]).toMatchObject({ id: 'M-030', trimDb: -2.5, delayMs: 1.5 });
    const saved = demoTuning({ version: 4, latestVersion: 4 });
    saved.channels[1] = { ...saved.channels[1], trimDb: -2.5 };
    patch.flush(saved);
    (await requested(`${TUNING_URL}/versions?limit=100`)).flush(
      page([1, 2, 3, 4].map((v) => demoVersion(v))),
    );
    (await requested(`/v1/rooms/${ROOM_ID}/tunings?limit=100`)).flush(page([saved]));
    await settle();
    expect(await snack()).toBe('M-030 saved as version 4.');
    expect(text()).toContain('Version 4 of 4');
  });

  it('marks the refused field when the API finds the channel outside the room’s limits', async () => {
    // The page was opened before the room got limits: the editor cannot know, the API refuses.
    const { tuning } = await render({ room: demoRoom({ limits: null }) });
    await press('pick-M+030');
    const trim = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="field-trimDb"]' }));
    await trim.setValue('-14');
    await (await button('save-channel')).click();
    const patch = http.expectOne(TUNING_URL);
    const sent = { ...tuning.channels[0], ...patch.request.body.channels[0] };
    const violations = findLimitViolations(
      { sampleRateHz: tuning.sampleRateHz, channels: [sent], subwoofer: tuning.subwoofer },
      demoRoom().limits,
    );
    expect(violations).toHaveLength(1);
    patch.flush(
      {
        type: 'https://isochron.example/problems/limit-exceeded',
        title: "Outside the room's limits",
        status: 422,
        detail: `${violations[0].message}. Nothing was stored.`,
        errors: violations.map((v) => ({
          pointer: v.setting.replace('/channels/', '/body/channels/'),
          message: v.message,
        })),
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    expect(byTestId('save-problem')?.textContent).toContain(
      "Outside the room's limits: see the marked fields.",
    );
    const editor = byTestId('channel-editor')!;
    expect(editor.textContent).toContain(violations[0].message);
    expect(text()).toContain('Version 3 of 3');
  });

  it('asks before dropping unsaved changes when another channel is chosen', async () => {
    await render();
    const trim = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="field-trimDb"]' }));
    await trim.setValue('-3');
    await press('pick-LFE1');
    const confirm = await root.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Discard the changes to M+030?');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await settle();
    expect(byTestId('pick-M+030')?.getAttribute('aria-pressed')).toBe('true');
    expect(await trim.getValue()).toBe('-3');
    await press('pick-LFE1');
    await (
      await (
        await root.getHarness(MatDialogHarness)
      ).getHarness(MatButtonHarness.with({ text: 'Discard changes' }))
    ).click();
    await settle();
    expect(byTestId('pick-LFE1')?.getAttribute('aria-pressed')).toBe('true');
  });

  it('renames the tuning and keeps its notes through the details dialog', async () => {
    await render({ tuning: demoTuning({ notes: 'Checked with pink noise.' }) });
    expect(byTestId('tuning-notes-text')?.textContent).toBe('Checked with pink noise.');
    await (await loader.getHarness(MatMenuHarness)).clickItem({ text: /Name and notes/ });
    const dialog = await root.getHarness(MatDialogHarness);
    const name = await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="tuning-name"]' }));
    expect(await name.getValue()).toBe('Bass-managed 80 Hz');
    await name.setValue('  Bass-managed 80 Hz, final  ');
    await (
      await dialog.getHarness(MatButtonHarness.with({ selector: '[data-testid="save-details"]' }))
    ).click();
    const patch = http.expectOne(TUNING_URL);
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).toEqual({
      name: 'Bass-managed 80 Hz, final',
      notes: 'Checked with pink noise.',
    });
    patch.flush(demoTuning({ name: 'Bass-managed 80 Hz, final', version: 4, latestVersion: 4 }));
    (await requested(`${TUNING_URL}/versions?limit=100`)).flush(
      page([1, 2, 3, 4].map((v) => demoVersion(v))),
    );
    (await requested(`/v1/rooms/${ROOM_ID}/tunings?limit=100`)).flush(page([demoTuning()]));
    await settle();
    expect(byTestId('tuning-title')?.textContent).toBe('Bass-managed 80 Hz, final');
    expect(await snack()).toBe('Saved as version 4.');
  });

  it('deletes only after a confirmation that says how many versions go', async () => {
    await render();
    await (await loader.getHarness(MatMenuHarness)).clickItem({ text: /Delete tuning/ });
    let confirm = await root.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Delete “Bass-managed 80 Hz”?');
    expect(await confirm.getContentText()).toContain('All 3 versions of this tuning are deleted for good.');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await settle();
    http.expectNone(TUNING_URL);

    await (await loader.getHarness(MatMenuHarness)).clickItem({ text: /Delete tuning/ });
    confirm = await root.getHarness(MatDialogHarness);
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Delete tuning' }))).click();
    const request = http.expectOne(TUNING_URL);
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    expect(router.url).toBe(`/rooms/${ROOM_ID}`);
    expect(await snack()).toBe('“Bass-managed 80 Hz” deleted.');
  });

  it('duplicates the version shown under a new name and opens the copy', async () => {
    await render();
    await (await loader.getHarness(MatMenuHarness)).clickItem({ text: /Duplicate v3/ });
    const dialog = await root.getHarness(MatDialogHarness);
    const name = await dialog.getHarness(
      MatInputHarness.with({ selector: '[data-testid="duplicate-name"]' }),
    );
    expect(await name.getValue()).toBe('Bass-managed 80 Hz (variant)');
    await (
      await dialog.getHarness(MatButtonHarness.with({ selector: '[data-testid="confirm-duplicate"]' }))
    ).click();
    const request = http.expectOne(`${TUNING_URL}/duplicate`);
    expect(request.request.body).toEqual({ name: 'Bass-managed 80 Hz (variant)', version: 3 });
    const copy = demoTuning({
      id: 'tun_copy',
      name: 'Bass-managed 80 Hz (variant)',
      version: 1,
      latestVersion: 1,
    });
    request.flush(copy);
    // The same page now shows the copy.
    (await requested('/v1/tunings/tun_copy')).flush(copy);
    (await requested('/v1/tunings/tun_copy/versions?limit=100')).flush(page([demoVersion(1)]));
    await settle();
    expect(router.url).toBe(`/rooms/${ROOM_ID}/tunings/tun_copy`);
    expect(byTestId('tuning-title')?.textContent).toBe('Bass-managed 80 Hz (variant)');
  });

  it('compares the version shown with any version of the room’s tunings', async () => {
    const other = demoTuning({ id: 'tun_full', name: 'Full range', latestVersion: 2, version: 2 });
    await render({ roomTunings: [demoTuning(), other] });
    expect(await (await button('compare-run')).isDisabled()).toBe(true);
    const select = await loader.getHarness(
      MatSelectHarness.with({ selector: '[data-testid="compare-with"]' }),
    );
    await select.open();
    const labels = await Promise.all((await select.getOptions()).map((o) => o.getText()));
    expect(labels).toEqual([
      'Bass-managed 80 Hz · v3 (latest)',
      'Bass-managed 80 Hz · v2',
      'Bass-managed 80 Hz · v1',
      'Full range · v2 (latest)',
      'Full range · v1',
    ]);
    await select.clickOptions({ text: 'Full range · v1' });
    await (await button('compare-run')).click();
    const request = http.expectOne((r) => r.url === '/v1/tunings/compare');
    expect(request.request.params.toString()).toBe(
      `left=${TUNING_ID}&right=tun_full&leftVersion=3&rightVersion=1`,
    );
    request.flush({
      identical: true,
      left: { tuningId: TUNING_ID, name: 'Bass-managed 80 Hz', version: 3 },
      right: { tuningId: 'tun_full', name: 'Full range', version: 1 },
      subwoofer: { lfeGainDbDifference: 0, lowPassChanged: false },
      channels: [],
    } satisfies TuningComparison);
    await settle();
    expect(text()).toContain('“Bass-managed 80 Hz” v3 and “Full range” v1 have the same settings.');
  });

  it('checks against the room’s processor profile when it has one', async () => {
    const tuning = demoTuning();
    // The demo profile takes trims in 0.1 dB steps from −12 dB; −12.5 dB is outside it, not the room's.
    tuning.channels[0] = { ...tuning.channels[0], trimDb: -12.5 };
    await render({ room: demoRoom({ profileId: PROFILE_ID, limits: null }), tuning });
    const rows = harness.routeNativeElement!.querySelectorAll('[data-testid="tuning-channels"] tbody tr');
    expect(rows[0].textContent).toContain('over limits');
    expect(rows[0].querySelector('.iso-chip')?.getAttribute('title')).toContain('profile');
  });

  it('opens the export dialog for the version shown', async () => {
    await render({ room: demoRoom({ profileId: PROFILE_ID }) });
    // The dialog asks for profiles and a preview at once; a harness click would wait for their answers.
    await press('tuning-export');
    (await requested('/v1/processor-profiles?limit=100')).flush(page([demoProfile()]));
    const preview = await requested((r) => r.url === `${TUNING_URL}/export`);
    expect(preview.request.params.get('profile')).toBe(PROFILE_ID);
    expect(preview.request.params.get('version')).toBe('3');
    preview.flush({ title: 'Service unavailable', status: 503 }, { status: 503, statusText: 'x' });
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Export “Bass-managed 80 Hz” v3');
    await dialog.close();
  });

  it('offers a way back to the room when the tuning is not there', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [{ path: 'rooms/:roomId/tunings/:tuningId', component: TuningPage }],
          withComponentInputBinding(),
        ),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(`/rooms/${ROOM_ID}/tunings/tun_gone`);
    http.expectOne(`/v1/rooms/${ROOM_ID}`).flush(demoRoom());
    (await requested(`/v1/rooms/${ROOM_ID}/tunings?limit=100`)).flush(page([]));
    http
      .expectOne('/v1/tunings/tun_gone')
      .flush(
        { title: 'Not found', status: 404, detail: 'No tuning tun_gone.' },
        { status: 404, statusText: 'Not Found' },
      );
    http.expectOne('/v1/tunings/tun_gone/versions?limit=100').flush(page([]));
    await settle();
    const alert = harness.routeNativeElement!.querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('Not found — No tuning tun_gone.');
    expect(alert.querySelector('a')?.getAttribute('href')).toBe(`/rooms/${ROOM_ID}`);
    expect(alert.textContent).not.toContain('Retry');
  });
});
