import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { firstValueFrom } from 'rxjs';
import { LIMITS } from '../../../../../shared/limits';
import { openDialog } from '../../../testing/dialogs';
import type { Permission } from '../../auth/roles';
import { SessionService } from '../../auth/session.service';
import type { ApiKey } from '../key.model';
import { KeyEditDialog } from './key-edit-dialog';

const key: ApiKey = {
  id: 'key_1',
  name: 'Sweep rig',
  role: 'tuning',
  kind: 'live',
  status: 'active',
  prefix: 'iso_live_7Hq',
  lastFour: 'x9Zk',
  createdAt: '2026-03-01T08:00:00Z',
  updatedAt: '2026-03-01T08:00:00Z',
  createdById: null,
  lastUsedAt: null,
  expiresAt: '2026-12-31T22:59:59.999Z',
  rateLimitPerMinute: 120,
  revokedAt: null,
  ownerId: 'usr_1',
};

describe('KeyEditDialog', () => {
  let http: HttpTestingController;

  async function open(permissions: Permission[], data: ApiKey = key) {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideNativeDateAdapter()],
    });
    http = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(SessionService);
    const signedIn = firstValueFrom(session.signIn('a@example.test', 'pw'));
    http
      .expectOne('/auth/session')
      .flush({ user: { id: 'usr_1', email: 'a@example.test', role: 'developer' }, permissions });
    await signedIn;
    const opened = await openDialog<KeyEditDialog, ApiKey>(KeyEditDialog, { data });
    const input = (id: string) =>
      opened.loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }));
    const save = await opened.loader.getHarness(MatButtonHarness.with({ text: 'Save' }));
    return { ...opened, input, save };
  }

  afterEach(() => http.verify());

  it('shows the masked key and saves only the fields that changed', async () => {
    const { input, save, dialog, closed, settle } = await open(['keys:own']);
    expect(await dialog.getContentText()).toContain('iso_live_7Hq…x9Zk');
    expect(await save.isDisabled()).toBe(true);
    await (await input('edit-key-name')).setValue('  Sweep rig B ');
    await save.click();
    const request = http.expectOne('/v1/keys/key_1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ name: 'Sweep rig B' });
    request.flush({ ...key, name: 'Sweep rig B' });
    await settle();
    expect(closed()?.value?.name).toBe('Sweep rig B');
  });

  it('refuses a blank name in place', async () => {
    const { input, save, dialog } = await open(['keys:own']);
    await (await input('edit-key-name')).setValue('   ');
    await save.click();
    http.expectNone('/v1/keys/key_1');
    expect(await dialog.getContentText()).toContain('Give the key a name.');
  });

  it('lets only an admin change the rate limit, within the contract’s range; empty means the default', async () => {
    const owner = await open(['keys:own']);
    expect(await (await owner.input('edit-rate-limit')).isDisabled()).toBe(true);
    expect(await owner.dialog.getContentText()).toContain('Only an admin changes rate limits.');
    TestBed.resetTestingModule();

    const { input, save, dialog } = await open(['keys:own', 'keys:all']);
    const rate = await input('edit-rate-limit');
    expect(await rate.isDisabled()).toBe(false);
    await rate.setValue('0');
    await save.click();
    http.expectNone('/v1/keys/key_1');
    expect(await dialog.getContentText()).toContain(`Between ${LIMITS.KeyRateLimit.minimum} and`);

    await rate.setValue('');
    await save.click();
    const request = http.expectOne('/v1/keys/key_1');
    expect(request.request.body).toEqual({ rateLimitPerMinute: null });
    request.flush(key);
  });

  it('keeps an owner from moving the expiry later, and never touches an expired key’s expiry', async () => {
    const owner = await open(['keys:own']);
    expect(await owner.dialog.getContentText()).toContain('You may bring the expiry nearer');
    expect(await (await (await owner.input('edit-expiry')).host()).getAttribute('max')).toBe('2026-12-31');
    TestBed.resetTestingModule();

    const expired = await open(['keys:own', 'keys:all'], { ...key, status: 'expired' });
    expect(await (await expired.input('edit-expiry')).isDisabled()).toBe(true);
    expect(await expired.dialog.getContentText()).toContain('This key has expired and stays expired');
  });

  it('shows the API’s refusal and stays open', async () => {
    const { input, save, dialog, closed } = await open(['keys:own']);
    await (await input('edit-key-name')).setValue('Other');
    await save.click();
    http.expectOne('/v1/keys/key_1').flush({ title: 'Key revoked' }, { status: 409, statusText: 'Conflict' });
    expect(await dialog.getContentText()).toContain('Key revoked');
    expect(closed()).toBeUndefined();
  });
});
