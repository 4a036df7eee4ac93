import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { UserRole } from '../../auth/roles';
import { signInAs } from '../../../testing/session';
import type { ApiKey } from '../key.model';
import { KeysPage } from './keys-page';

function key(id: string, overrides: Partial<ApiKey> = {}): ApiKey {
  return {
    id,
    name: `Key ${id}`,
    role: 'calculate',
    kind: 'live',
    status: 'active',
    prefix: 'iso_live_abc',
    lastFour: id.slice(-4).padStart(4, '0'),
    createdAt: '2026-03-01T08:00:00Z',
    updatedAt: '2026-03-01T08:00:00Z',
    createdById: null,
    lastUsedAt: null,
    expiresAt: null,
    rateLimitPerMinute: null,
    revokedAt: null,
    ownerId: 'usr_1',
    ...overrides,
  };
}

describe('KeysPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<KeysPage>;
  let loader: HarnessLoader;
  let root: HarnessLoader;

  async function render(role: UserRole, keys: ApiKey[], users?: Array<{ id: string; email: string }>) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        provideNativeDateAdapter(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs(role);
    fixture = TestBed.createComponent(KeysPage);
    fixture.detectChanges();
    http.expectOne('/v1/keys?limit=100').flush({ data: keys, hasMore: false });
    if (users) http.expectOne('/v1/users?limit=100').flush({ data: users, hasMore: false });
    await settle();
    loader = TestbedHarnessEnvironment.loader(fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  }

  async function settle() {
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function names(): Promise<string[]> {
    const table = await loader.getHarness(MatTableHarness);
    return (await table.getCellTextByColumnName())['name'].text;
  }

  afterEach(() => http.verify());

  it('lists the developer’s keys with masked secrets and counts the active ones', async () => {
    await render('developer', [
      key('key_0001', { name: 'Rig' }),
      key('key_0002', { name: 'Old', revokedAt: '2026-03-02T00:00:00Z' }),
    ]);
    const table = await loader.getHarness(MatTableHarness);
    const columns = await table.getCellTextByColumnName();
    expect(columns['key'].text).toContain('iso_live_abc…0001');
    expect(columns['status'].text).toEqual(expect.arrayContaining(['Active', 'Revoked']));
    expect(fixture.nativeElement.textContent).toContain('1 active of 2');
    // A developer sees no owner column data and no users request (verify() would fail otherwise).
    expect(columns['name'].text[0]).not.toContain('@');
  });

  it('shows an admin whose key each is, by e-mail', async () => {
    await render(
      'admin',
      [key('key_0001', { ownerId: 'usr_7' })],
      [{ id: 'usr_7', email: 'tech@example.test' }],
    );
    expect((await names())[0]).toContain('tech@example.test');
  });

  it('filters by what is typed, and says when nothing matches', async () => {
    await render('developer', [
      key('key_0001', { name: 'Sweep rig' }),
      key('key_0002', { name: 'Batch job' }),
    ]);
    const filter = await loader.getHarness(MatInputHarness.with({ placeholder: 'name, role, status…' }));
    await filter.setValue('sweep');
    expect(await names()).toEqual(['Sweep rig']);
    await filter.setValue('nothing like it');
    expect(fixture.nativeElement.textContent).toContain('No key matches “nothing like it”.');
  });

  it('asks for revoked keys again when they are to be shown', async () => {
    await render('developer', [key('key_0001')]);
    await (await loader.getHarness(MatSlideToggleHarness)).toggle();
    http.expectOne('/v1/keys?limit=100&includeRevoked=true').flush({
      data: [key('key_0001'), key('key_0002', { revokedAt: '2026-03-02T00:00:00Z' })],
      hasMore: false,
    });
    await settle();
    expect(await names()).toHaveLength(2);
  });

  it('revokes only after confirmation and marks the key revoked', async () => {
    await render('developer', [key('key_0001', { name: 'Rig' })]);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="revoke-key"]' }))
    ).click();
    const confirm = await root.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Revoke “Rig”?');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Revoke key' }))).click();
    const request = http.expectOne('/v1/keys/key_0001');
    expect(request.request.method).toBe('DELETE');
    request.flush(key('key_0001', { name: 'Rig', revokedAt: '2026-03-03T00:00:00Z', status: 'revoked' }));
    await settle();
    const columns = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(columns['status'].text).toEqual(['Revoked']);
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe('Key “Rig” revoked.');
  });

  it('sends nothing when the revocation is cancelled', async () => {
    await render('developer', [key('key_0001')]);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="revoke-key"]' }))
    ).click();
    const confirm = await root.getHarness(MatDialogHarness);
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    http.expectNone('/v1/keys/key_0001');
  });

  it('puts a created key at the top of the list without its secret', async () => {
    await render('developer', [key('key_0001', { name: 'Old' })]);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="create-key"]' }))
    ).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (
      await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="key-name"]' }))
    ).setValue('New');
    await (
      await dialog.getHarness(MatButtonHarness.with({ selector: '[data-testid="submit-create"]' }))
    ).click();
    http.expectOne('/v1/keys').flush({
      ...key('key_0009', { name: 'New', createdAt: '2026-03-05T00:00:00Z' }),
      secret: 'iso_live_s3cret',
    });
    await settle();
    await (await root.getHarness(MatCheckboxHarness)).check();
    await (
      await root.getHarness(MatButtonHarness.with({ selector: '[data-testid="finish-create"]' }))
    ).click();
    await settle();
    expect(await names()).toEqual(['New', 'Old']);
    expect(fixture.nativeElement.textContent).not.toContain('iso_live_s3cret');
  });

  it('offers a viewer no create, edit or revoke controls', async () => {
    await render('viewer', [key('key_0001')]);
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="create-key"]' })),
    ).toEqual([]);
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="revoke-key"]' })),
    ).toEqual([]);
  });

  it('shows a load failure with a retry that asks again', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        provideNativeDateAdapter(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('developer');
    fixture = TestBed.createComponent(KeysPage);
    fixture.detectChanges();
    http
      .expectOne('/v1/keys?limit=100')
      .flush({ title: 'Service unavailable' }, { status: 503, statusText: 'x' });
    await settle();
    expect(fixture.nativeElement.querySelector('[role="alert"]')?.textContent).toContain(
      'Service unavailable',
    );
    loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Retry' }))).click();
    http.expectOne('/v1/keys?limit=100').flush({ data: [key('key_0001')], hasMore: false });
    await settle();
    expect(fixture.nativeElement.querySelector('[role="alert"]')).toBeNull();
  });
});
