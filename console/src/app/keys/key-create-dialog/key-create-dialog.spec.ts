import { Clipboard } from '@angular/cdk/clipboard';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { LIMITS, NAME_MAX_LENGTH } from '../../../../../shared/limits';
import { openDialog } from '../../../testing/dialogs';
import { SessionService } from '../../auth/session.service';
import type { Permission, UserRole } from '../../auth/roles';
import { PlaygroundCredentials } from '../../playground/playground-credentials.service';
import type { CreatedKey } from '../key.model';
import { KeyCreateDialog } from './key-create-dialog';

const created: CreatedKey = {
  id: 'key_1',
  name: 'Sweep rig',
  role: 'calculate',
  kind: 'live',
  secret: 'iso_live_0123456789abcdefghijklmnopqrstuvwxyzABCDEFG',
  prefix: 'iso_live_012',
  lastFour: 'DEFG',
  ownerId: 'usr_1',
  createdById: 'usr_1',
  rateLimitPerMinute: null,
  status: 'active',
  expiresAt: null,
  revokedAt: null,
  lastUsedAt: null,
  createdAt: '2026-03-01T09:00:00.000Z',
  updatedAt: '2026-03-01T09:00:00.000Z',
};

describe('KeyCreateDialog', () => {
  let http: HttpTestingController;
  const copy = vi.fn(() => true);

  async function open(role: UserRole, permissions: Permission[]) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        provideNativeDateAdapter(),
        { provide: Clipboard, useValue: { copy } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(SessionService);
    const signedIn = firstValueFrom(session.signIn('a@example.test', 'pw'));
    http
      .expectOne('/auth/session')
      .flush({ user: { id: 'usr_1', email: 'a@example.test', role }, permissions });
    await signedIn;
    const opened = await openDialog<KeyCreateDialog, CreatedKey | undefined>(KeyCreateDialog);
    const name = await opened.loader.getHarness(
      MatInputHarness.with({ selector: '[data-testid="key-name"]' }),
    );
    const submit = await opened.loader.getHarness(
      MatButtonHarness.with({ selector: '[data-testid="submit-create"]' }),
    );
    return { ...opened, name, submit };
  }

  afterEach(() => {
    http.verify();
    copy.mockClear();
  });

  it('offers a developer only the key roles a developer holds, calculate first', async () => {
    const { loader } = await open('developer', ['keys:own', 'calculate', 'tuning']);
    const role = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="key-role"]' }));
    expect(await role.getValueText()).toBe('Calculate');
    await role.open();
    expect(await Promise.all((await role.getOptions()).map((o) => o.getText()))).toEqual([
      'Calculate',
      'Tuning',
    ]);
  });

  it('refuses a blank name in place and sends nothing', async () => {
    const { name, submit, dialog } = await open('developer', ['keys:own']);
    await name.setValue('    ');
    await submit.click();
    expect(await dialog.getContentText()).toContain('Give the key a name.');
    http.expectNone('/v1/keys');
    expect(await (await name.host()).getAttribute('maxlength')).toBe(String(NAME_MAX_LENGTH));
  });

  it('posts the trimmed name and role, shows the secret once and holds it until acknowledged', async () => {
    const { name, submit, loader, closed, ref, element, settle } = await open('developer', ['keys:own']);
    await name.setValue('  Sweep rig ');
    await submit.click();
    const request = http.expectOne('/v1/keys');
    expect(request.request.body).toEqual({ name: 'Sweep rig', role: 'calculate' });
    request.flush(created);
    await settle();

    const secret = element.querySelector<HTMLInputElement>('[data-testid="new-key-secret"]');
    expect(secret?.value).toBe(created.secret);
    expect(ref.disableClose).toBe(true);
    const done = await loader.getHarness(
      MatButtonHarness.with({ selector: '[data-testid="finish-create"]' }),
    );
    expect(await done.isDisabled()).toBe(true);

    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="copy-secret"]' }))
    ).click();
    expect(copy).toHaveBeenCalledWith(created.secret);
    expect(
      await (
        await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="copy-secret"]' }))
      ).getText(),
    ).toContain('Copied');

    await (await loader.getHarness(MatCheckboxHarness)).check();
    await done.click();
    // The opener gets the key for its list, never the secret.
    expect(closed()?.value).toMatchObject({ id: 'key_1', secret: '' });
  });

  it('lets an admin set a rate limit within the contract’s range and sends it', async () => {
    const { name, submit, loader, dialog } = await open('admin', ['keys:own', 'keys:all']);
    await name.setValue('Batch');
    const rate = await loader.getHarness(
      MatInputHarness.with({ selector: '[data-testid="key-rate-limit"]' }),
    );
    await rate.setValue(String(LIMITS.KeyRateLimit.maximum + 1));
    await submit.click();
    http.expectNone('/v1/keys');
    expect(await dialog.getContentText()).toContain('Between 1 and 1\u202f000\u202f000.');

    await rate.setValue('600');
    await submit.click();
    const request = http.expectOne('/v1/keys');
    expect(request.request.body).toEqual({ name: 'Batch', role: 'calculate', rateLimitPerMinute: 600 });
    request.flush(created);
  });

  it('offers no rate limit field to a developer', async () => {
    const { loader } = await open('developer', ['keys:own']);
    expect(
      await loader.getAllHarnesses(MatInputHarness.with({ selector: '[data-testid="key-rate-limit"]' })),
    ).toEqual([]);
  });

  it('shows the API’s refusal in the dialog and lets the person try again', async () => {
    const { name, submit, dialog, closed } = await open('developer', ['keys:own']);
    await name.setValue('Rig');
    await submit.click();
    http
      .expectOne('/v1/keys')
      .flush(
        { title: 'Too many keys', detail: 'You already hold 10 active keys.' },
        { status: 409, statusText: 'Conflict' },
      );
    expect(await dialog.getContentText()).toContain('Too many keys — You already hold 10 active keys.');
    expect(await submit.isDisabled()).toBe(false);
    expect(closed()).toBeUndefined();
  });

  it('carries the secret to the playground in memory and goes there', async () => {
    const { name, submit, loader, closed } = await open('developer', ['keys:own']);
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await name.setValue('Rig');
    await submit.click();
    http.expectOne('/v1/keys').flush(created);
    await (await loader.getHarness(MatCheckboxHarness)).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try it in the playground' }))).click();
    const credentials = TestBed.inject(PlaygroundCredentials);
    expect(credentials.keySecret()).toBe(created.secret);
    expect(credentials.keyLabel()).toBe('Sweep rig');
    expect(navigate).toHaveBeenCalledWith(['/playground']);
    expect(closed()?.value?.secret).toBe('');
  });

  it('closes with nothing on Cancel', async () => {
    const { loader, closed } = await open('developer', ['keys:own']);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(closed()).toEqual({ value: undefined });
  });
});
