import { HttpRequest, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { UserRole } from '../../auth/roles';
import type { ApiKey } from '../../keys/key.model';
import { page } from '../../../testing/fixtures';
import { clickNow, requested } from '../../../testing/requests';
import { signInAs } from '../../../testing/session';
import type { UsageLimits, UsageResponse, UsageRow } from '../usage.model';
import { UsagePage } from './usage-page';

const HOUR_MS = 3_600_000;

const rig: ApiKey = {
  id: 'key_rig',
  name: 'Sweep rig — Stage 3',
  role: 'calculate',
  kind: 'live',
  status: 'active',
  prefix: 'iso_live_k3y',
  lastFour: '7b6c',
  createdAt: '2026-03-01T08:00:00Z',
  updatedAt: '2026-03-01T08:00:00Z',
  createdById: null,
  lastUsedAt: null,
  expiresAt: null,
  rateLimitPerMinute: null,
  revokedAt: null,
  ownerId: 'usr_1',
};

/** An hour bucket `hoursAgo` before now, as the API aligns them. */
function bucket(hoursAgo: number): string {
  return new Date(Math.floor(Date.now() / HOUR_MS) * HOUR_MS - hoursAgo * HOUR_MS).toISOString();
}

function row(
  route: string,
  count: number,
  errorCount: number,
  hoursAgo: number,
  keyId: string | null,
): UsageRow {
  return {
    bucket: bucket(hoursAgo),
    keyId,
    keyName: keyId === rig.id ? rig.name : keyId ? 'Old batch key' : null,
    userId: 'usr_1',
    route,
    count,
    errorCount,
  };
}

const rows: UsageRow[] = [
  row('POST /v1/plans', 14, 2, 30, rig.id),
  row('POST /v1/analysis/impulse-response', 12, 0, 30, rig.id),
  row('GET /v1/rooms', 3, 1, 2, null),
];

const limits: UsageLimits = {
  keyRateLimitPerMinute: 600,
  userRateLimitPerMinute: 1200,
  maxActiveKeysPerUser: 10,
  activeKeys: 2,
};

describe('UsagePage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<UsagePage>;
  let loader: HarnessLoader;

  const detect = () => fixture.detectChanges();
  const usage = () => requested(http, detect, (r) => r.url === '/v1/usage' && r.responseType === 'json');
  const text = () => (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
  const element = (selector: string) => (fixture.nativeElement as HTMLElement).querySelector(selector);

  async function settle() {
    fixture.detectChanges();
    await fixture.whenStable();
  }

  function answer(request: TestRequest, data: UsageRow[], withLimits: UsageLimits = limits) {
    const params = request.request.params;
    const groupBy = params.get('groupBy');
    // The page asks for hourly or daily rows only; anything else would be a grouping it cannot draw.
    if (groupBy !== 'hour' && groupBy !== 'day') throw new Error(`usage asked with groupBy ${groupBy}`);
    const body: UsageResponse = {
      from: params.get('from')!,
      to: params.get('to')!,
      groupBy,
      limits: withLimits,
      data,
    };
    request.flush(body);
  }

  async function render(role: UserRole, data = rows, withLimits = limits): Promise<TestRequest> {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideNativeDateAdapter()],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs(role);
    fixture = TestBed.createComponent(UsagePage);
    const first = await usage();
    if (role !== 'viewer') http.expectOne('/v1/keys?limit=100').flush(page([rig]));
    answer(first, data, withLimits);
    await settle();
    loader = TestbedHarnessEnvironment.loader(fixture);
    return first;
  }

  /** The range a request asks for, in hours, and how far its end is from now. */
  function span(request: TestRequest) {
    const from = Date.parse(request.request.params.get('from')!);
    const to = Date.parse(request.request.params.get('to')!);
    return { hours: (to - from) / HOUR_MS, endFromNowHours: (to - Date.now()) / HOUR_MS };
  }

  const created = URL.createObjectURL;
  const revoked = URL.revokeObjectURL;
  afterEach(() => {
    URL.createObjectURL = created;
    URL.revokeObjectURL = revoked;
    http.verify();
  });

  it('reports the last 7 days by day with totals, limits and each key by name', async () => {
    const first = await render('developer');
    expect(first.request.params.get('groupBy')).toBe('day');
    const { hours, endFromNowHours } = span(first);
    expect(hours).toBeGreaterThanOrEqual(7 * 24);
    expect(hours).toBeLessThanOrEqual(8 * 24);
    // The range ends at the current hour or day, not in the past.
    expect(endFromNowHours).toBeGreaterThanOrEqual(0);
    expect(endFromNowHours).toBeLessThanOrEqual(24);
    expect(first.request.params.has('keyId')).toBe(false);

    expect(element('[data-testid="usage-total"]')?.textContent?.trim()).toBe('29');
    // 3 of 29 calls failed.
    expect(text()).toContain('10.3 %');
    expect(text()).toContain('You see your own keys.');
    expect(element('[data-testid="usage-limits"]')?.textContent?.replace(/\s+/g, ' ')).toContain(
      '600 requests a minute per key',
    );
    expect(text()).toContain('You hold 2 active keys.');
    const table = await loader.getHarness(MatTableHarness);
    const columns = await table.getCellTextByColumnName();
    // Newest bucket first; console calls are named as such, keys by name and masked secret.
    expect(columns['key'].text).toEqual([
      'Console session',
      'Sweep rig — Stage 3 (iso_live_k3y…7b6c)',
      'Sweep rig — Stage 3 (iso_live_k3y…7b6c)',
    ]);
    expect(columns['route'].text[0]).toBe('GET /v1/rooms');
  });

  it('asks again by hour for the last 24 hours', async () => {
    await render('developer');
    const toggle = [
      ...(fixture.nativeElement as HTMLElement).querySelectorAll('mat-button-toggle button'),
    ].find((b) => b.textContent?.includes('24 hours'));
    await clickNow(toggle, detect);
    const next = await usage();
    expect(next.request.params.get('groupBy')).toBe('hour');
    expect(span(next).hours).toBeGreaterThanOrEqual(24);
    expect(span(next).hours).toBeLessThanOrEqual(25);
    answer(next, [rows[2]]);
    await settle();
    expect(element('[data-testid="usage-total"]')?.textContent?.trim()).toBe('3');
  });

  it('narrows to one key and one route, and keeps other routes choosable', async () => {
    await render('developer');
    const [keySelect, routeSelect] = await loader.getAllHarnesses(MatSelectHarness);
    await keySelect.open();
    const keyOptions = await Promise.all((await keySelect.getOptions()).map((o) => o.getText()));
    expect(keyOptions).toEqual(['All keys', 'Sweep rig — Stage 3 (iso_live_k3y…7b6c)']);
    await clickNow(
      [...document.querySelectorAll('mat-option')].find((o) => o.textContent?.includes('Sweep rig')),
      detect,
    );
    const byKey = await usage();
    expect(byKey.request.params.get('keyId')).toBe(rig.id);
    answer(byKey, rows.slice(0, 2));
    await settle();

    await routeSelect.open();
    const routeOptions = await Promise.all((await routeSelect.getOptions()).map((o) => o.getText()));
    expect(routeOptions).toEqual([
      'All routes',
      'GET /v1/rooms',
      'POST /v1/analysis/impulse-response',
      'POST /v1/plans',
    ]);
    await clickNow(
      [...document.querySelectorAll('mat-option')].find((o) => o.textContent?.trim() === 'POST /v1/plans'),
      detect,
    );
    const byRoute = await usage();
    expect(byRoute.request.params.get('route')).toBe('POST /v1/plans');
    expect(byRoute.request.params.get('keyId')).toBe(rig.id);
    answer(byRoute, rows.slice(0, 1));
    await settle();
    expect(element('[data-testid="usage-total"]')?.textContent?.trim()).toBe('14');
    // Routes seen before the filter stay in the list.
    await routeSelect.open();
    expect(await routeSelect.getOptions()).toHaveLength(4);
  });

  it('asks for nothing until both dates of a custom range are picked', async () => {
    await render('developer');
    const toggle = [
      ...(fixture.nativeElement as HTMLElement).querySelectorAll('mat-button-toggle button'),
    ].find((b) => b.textContent?.includes('Dates…'));
    await clickNow(toggle, detect);
    await settle();
    expect(text()).toContain('Pick both dates to see usage for a custom range.');
    expect(
      await (
        await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="download-csv"]' }))
      ).isDisabled(),
    ).toBe(true);
    http.expectNone((r) => r.url === '/v1/usage');
  });

  it('shows a failure with a retry that asks again', async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideNativeDateAdapter()],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('viewer');
    fixture = TestBed.createComponent(UsagePage);
    (await usage()).flush(
      { title: 'Too many requests', status: 429, detail: 'Try again in 12 s.' },
      { status: 429, statusText: 'Too Many Requests' },
    );
    await settle();
    expect(element('[role="alert"]')?.textContent).toContain('Too many requests — Try again in 12 s.');
    await clickNow(
      [...(fixture.nativeElement as HTMLElement).querySelectorAll('[role="alert"] button')].find((b) =>
        b.textContent?.includes('Retry'),
      ),
      detect,
    );
    answer(await usage(), rows);
    await settle();
    expect(element('[role="alert"]')).toBeNull();
  });

  it('shows someone who sees every key the names usage reports, without asking for keys', async () => {
    await render('viewer', rows, { ...limits, activeKeys: null });
    expect(text()).toContain('You see every key.');
    expect(text()).not.toContain('active key.');
    const columns = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(columns['key'].text[1]).toBe('Sweep rig — Stage 3');
  });

  it('downloads the same range as CSV, named after its dates', async () => {
    const first = await render('developer');
    const clicked: Array<{ href: string; download: string }> = [];
    URL.createObjectURL = () => 'blob:usage';
    URL.revokeObjectURL = () => undefined;
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push({ href: this.href, download: this.download });
    });
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="download-csv"]' }))
    ).click();
    const csv = http.expectOne((r: HttpRequest<unknown>) => r.responseType === 'blob');
    expect(csv.request.url).toBe('/v1/usage');
    expect(csv.request.headers.get('Accept')).toBe('text/csv');
    expect(csv.request.params.toString()).toBe(first.request.params.toString());
    csv.flush(new Blob(['bucket,keyId\n'], { type: 'text/csv' }));
    const from = first.request.params.get('from')!.slice(0, 10);
    const to = first.request.params.get('to')!.slice(0, 10);
    expect(clicked).toEqual([{ href: 'blob:usage', download: `isochron-usage-${from}-to-${to}.csv` }]);
  });

  it('says why a download failed', async () => {
    await render('developer');
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="download-csv"]' }))
    ).click();
    http
      .expectOne((r: HttpRequest<unknown>) => r.responseType === 'blob')
      .flush(new Blob(['x']), { status: 500, statusText: 'Server Error' });
    await settle();
    const snack = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatSnackBarHarness);
    expect(await snack.getMessage()).toContain('The server failed to handle the request');
    expect(
      await (
        await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="download-csv"]' }))
      ).isDisabled(),
    ).toBe(false);
  });
});
