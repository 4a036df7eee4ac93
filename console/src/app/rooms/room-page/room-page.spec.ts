import { HttpRequest, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
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
import { PROFILE_ID, ROOM_ID, demoRoom, demoTuning, page } from '../../../testing/fixtures';
import { clickNow, requested } from '../../../testing/requests';
import { signInAs } from '../../../testing/session';
import type { Room, Tuning, TuningComparison } from '../room.model';
import { RoomPage } from './room-page';

@Component({ selector: 'iso-elsewhere', template: 'elsewhere' })
class Elsewhere {
  readonly shown = true;
}

const ROOM_URL = `/v1/rooms/${ROOM_ID}`;

describe('RoomPage', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let root: HarnessLoader;

  const detect = () => harness.detectChanges();
  const ask = (match: string | ((r: HttpRequest<unknown>) => boolean)) => requested(http, detect, match);
  const element = () => harness.routeNativeElement!;
  const byTestId = (id: string) => element().querySelector(`[data-testid="${id}"]`);
  const text = () => element().textContent!.replace(/\s+/g, ' ');

  async function settle() {
    harness.detectChanges();
    await harness.fixture.whenStable();
  }

  async function render(room: Room | null, tunings: Tuning[] = []) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: 'rooms/:roomId', component: RoomPage },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('developer');
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(`/rooms/${ROOM_ID}`);
    if (room) http.expectOne(ROOM_URL).flush(room);
    else
      http.expectOne(ROOM_URL).flush({ title: 'Not found', status: 404 }, { status: 404, statusText: 'x' });
    http.expectOne(`${ROOM_URL}/tunings?limit=100`).flush(page(tunings));
    if (room) {
      // The measurements panel reads its own list; none are stored here.
      (await ask(`${ROOM_URL}/measurements?limit=100&stage=before`)).flush(page([]));
      (await ask('/v1/target-curves?limit=100')).flush(page([]));
    }
    await settle();
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(harness.fixture);
  }

  afterEach(() => http.verify());

  it('shows the room, its layout check and every loudspeaker’s direction against the layout', async () => {
    const room = demoRoom();
    await render(room);
    expect(element().querySelector('h1')?.textContent).toBe('Stage 3');
    expect(text()).toContain(`${room.layoutName} ·`);
    expect(text()).toContain('processor at 48 kHz');
    const table = await loader.getHarness(MatTableHarness);
    const columns = await table.getCellTextByColumnName();
    expect(columns['id'].text).toEqual(room.geometry.speakers.map((s) => s.id));
    expect(columns['name'].text[room.geometry.speakers.findIndex((s) => s.id === 'U-135')]).toBe(
      'Right top back',
    );
    const chips = columns['tolerance'].text;
    room.geometry.speakers.forEach((speaker, i) =>
      expect(chips[i]).toBe(
        speaker.withinTolerance === true
          ? 'Within range'
          : speaker.withinTolerance === false
            ? 'Out of range'
            : 'Not in layout',
      ),
    );
    for (const warning of room.geometry.warnings) expect(text()).toContain(warning.message);
    if (room.geometry.warnings.length === 0)
      expect(text()).toContain('Every loudspeaker is within the layout’s permitted ranges.');
    expect(byTestId('room-top-view')).not.toBeNull();
    expect(text()).toContain('No tunings stored for this room yet.');
  });

  it('offers the room’s report alone when it has no tuning, and a report per tuning otherwise', async () => {
    await render(demoRoom());
    expect(byTestId('room-report')?.getAttribute('href')).toBe(`${ROOM_URL}/report`);

    TestBed.resetTestingModule();
    await render(demoRoom(), [
      demoTuning(),
      demoTuning({ id: 'tun_full', name: 'Full range', version: 2, latestVersion: 2 }),
    ]);
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '[data-testid="room-report"]' }));
    await menu.open();
    const items = await menu.getItems();
    expect(await Promise.all(items.map((item) => item.getText()))).toEqual([
      'Bass-managed 80 Hz (v3)',
      'Full range (v2)',
    ]);
    const links = [...document.querySelectorAll('.mat-mdc-menu-panel a[mat-menu-item]')];
    expect(links.map((link) => link.getAttribute('href'))).toEqual([
      `${ROOM_URL}/report?tuningId=tun_bm80&version=3`,
      `${ROOM_URL}/report?tuningId=tun_full&version=2`,
    ]);
  });

  it('marks a tuning made for the room as it was', async () => {
    await render(demoRoom(), [
      demoTuning({
        stale: { since: '2026-03-04T08:00:00.000Z', reasons: ['listener moved 0.80 m', 'limits changed'] },
      }),
      demoTuning({ id: 'tun_fresh', name: 'Fresh' }),
    ]);
    const chips = element().querySelectorAll('[data-testid="stale-chip"]');
    expect(chips).toHaveLength(1);
    expect(chips[0].textContent?.trim()).toBe('stale: listener moved 0.80 m …');
    expect(chips[0].getAttribute('title')).toBe('listener moved 0.80 m; limits changed');
  });

  it('starts a new tuning with every loudspeaker at neutral settings and opens it', async () => {
    const room = demoRoom();
    await render(room);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="new-tuning"]' }))
    ).click();
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('New tuning');
    await (await dialog.getHarness(MatInputHarness)).setValue('First pass');
    await (await dialog.getHarness(MatButtonHarness.with({ text: /Create/ }))).click();
    const create = await ask(`${ROOM_URL}/tunings`);
    expect(create.request.method).toBe('POST');
    expect(create.request.body).toEqual({
      name: 'First pass',
      sampleRateHz: 48000,
      channels: room.loudspeakers.map((speaker) => ({ id: speaker.id, delayMs: 0, trimDb: 0 })),
    });
    create.flush(demoTuning({ id: 'tun_new', name: 'First pass', version: 1, latestVersion: 1 }));
    await settle();
    expect(TestBed.inject(Router).url).toBe(`/rooms/${ROOM_ID}/tunings/tun_new`);
  });

  it('duplicates a tuning and lists the copy', async () => {
    await render(demoRoom(), [demoTuning()]);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="duplicate-tuning"]' }))
    ).click();
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Duplicate “Bass-managed 80 Hz”');
    await (
      await dialog.getHarness(MatButtonHarness.with({ selector: '[data-testid="confirm-duplicate"]' }))
    ).click();
    const duplicate = await ask('/v1/tunings/tun_bm80/duplicate');
    expect(duplicate.request.body).toEqual({ name: 'Bass-managed 80 Hz (variant)' });
    const copy = demoTuning({
      id: 'tun_copy',
      name: 'Bass-managed 80 Hz (variant)',
      version: 1,
      latestVersion: 1,
    });
    duplicate.flush(copy);
    (await ask(`${ROOM_URL}/tunings?limit=100`)).flush(page([demoTuning(), copy]));
    await settle();
    const names = (await (await loader.getAllHarnesses(MatTableHarness))[1].getCellTextByColumnName())['name']
      .text;
    expect(names).toEqual(['Bass-managed 80 Hz', 'Bass-managed 80 Hz (variant)']);
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe(
      '“Bass-managed 80 Hz (variant)” created from “Bass-managed 80 Hz”.',
    );
  });

  it('compares two of the room’s tunings', async () => {
    await render(demoRoom(), [demoTuning(), demoTuning({ id: 'tun_full', name: 'Full range' })]);
    const run = await loader.getHarness(
      MatButtonHarness.with({ selector: '[data-testid="compare-tunings"]' }),
    );
    expect(await run.isDisabled()).toBe(true);
    await (
      await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="compare-left"]' }))
    ).clickOptions({
      text: 'Bass-managed 80 Hz',
    });
    expect(await run.isDisabled()).toBe(true);
    await (
      await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="compare-right"]' }))
    ).clickOptions({
      text: 'Full range',
    });
    await run.click();
    const compare = await ask((r) => r.url === '/v1/tunings/compare');
    expect(compare.request.params.toString()).toBe('left=tun_bm80&right=tun_full');
    compare.flush({
      identical: true,
      left: { tuningId: 'tun_bm80', name: 'Bass-managed 80 Hz', version: 3 },
      right: { tuningId: 'tun_full', name: 'Full range', version: 3 },
      subwoofer: { lfeGainDbDifference: 0, lowPassChanged: false },
      channels: [],
    } satisfies TuningComparison);
    await settle();
    expect(text()).toContain('“Bass-managed 80 Hz” v3 and “Full range” v3 have the same settings.');
  });

  it('exports a listed tuning for the room’s profile', async () => {
    await render(demoRoom({ profileId: PROFILE_ID }), [demoTuning()]);
    await clickNow(byTestId('export-tuning'), detect);
    (await ask('/v1/processor-profiles?limit=100')).flush(page([]));
    const preview = await ask((r) => r.url === '/v1/tunings/tun_bm80/export');
    expect(preview.request.params.get('profile')).toBe(PROFILE_ID);
    preview.flush({ title: 'Not found', status: 404 }, { status: 404, statusText: 'x' });
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Export “Bass-managed 80 Hz” v3');
    await dialog.close();
  });

  it('leads back to all rooms when the room is not there', async () => {
    await render(null);
    const alert = element().querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('Not found');
    expect(alert.querySelector('a')?.getAttribute('href')).toBe('/rooms');
    expect(alert.textContent).not.toContain('Retry');
  });

  it('retries after the service failed', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'rooms/:roomId', component: RoomPage }], withComponentInputBinding()),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(`/rooms/${ROOM_ID}`);
    http.expectOne(ROOM_URL).flush(null, { status: 503, statusText: 'Service Unavailable' });
    http.expectOne(`${ROOM_URL}/tunings?limit=100`).flush(page([]));
    await settle();
    await clickNow(
      [...element().querySelectorAll('[role="alert"] button')].find((b) => b.textContent?.includes('Retry')),
      detect,
    );
    (await ask(ROOM_URL)).flush(demoRoom());
    (await ask(`${ROOM_URL}/tunings?limit=100`)).flush(page([]));
    (await ask(`${ROOM_URL}/measurements?limit=100&stage=before`)).flush(page([]));
    (await ask('/v1/target-curves?limit=100')).flush(page([]));
    await settle();
    expect(element().querySelector('[role="alert"]')).toBeNull();
    expect(element().querySelector('h1')?.textContent).toBe('Stage 3');
  });
});
