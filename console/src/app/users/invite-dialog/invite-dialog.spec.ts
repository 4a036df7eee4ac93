import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { openDialog } from '../../../testing/dialogs';
import type { InvitationResult } from '../user.model';
import { InviteDialog } from './invite-dialog';

describe('InviteDialog', () => {
  let http: HttpTestingController;

  async function open() {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const opened = await openDialog<InviteDialog, InvitationResult>(InviteDialog);
    const email = await opened.loader.getHarness(
      MatInputHarness.with({ selector: '[data-testid="invite-email"]' }),
    );
    const name = await opened.loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName="name"]' }),
    );
    const send = await opened.loader.getHarness(
      MatButtonHarness.with({ selector: '[data-testid="send-invite"]' }),
    );
    return { ...opened, email, name, send };
  }

  afterEach(() => http.verify());

  it('refuses a missing or malformed address in place', async () => {
    const { email, send, dialog } = await open();
    await send.click();
    expect(await dialog.getContentText()).toContain('Enter an e-mail address.');
    await email.setValue('not an address');
    await send.click();
    http.expectNone('/v1/users');
  });

  it('invites a developer by default, leaving out an empty name', async () => {
    const { email, name, send, closed, settle } = await open();
    await email.setValue(' new@example.test ');
    await name.setValue('   ');
    await send.click();
    const request = http.expectOne('/v1/users');
    expect(request.request.body).toEqual({ email: 'new@example.test', role: 'developer' });
    request.flush({ user: { id: 'usr_9' }, invitation: { url: 'http://x/accept' } });
    await settle();
    expect(closed()?.value).toMatchObject({ user: { id: 'usr_9' } });
  });

  it('sends the chosen role and the trimmed name', async () => {
    const { email, name, send, loader } = await open();
    await email.setValue('v@example.test');
    await name.setValue(' Vera ');
    const role = await loader.getHarness(MatSelectHarness);
    await role.clickOptions({ text: 'Viewer' });
    expect(await loader.getHarness(MatSelectHarness).then((s) => s.getValueText())).toBe('Viewer');
    await send.click();
    const request = http.expectOne('/v1/users');
    expect(request.request.body).toEqual({ email: 'v@example.test', role: 'viewer', name: 'Vera' });
    request.flush({});
  });

  it('shows the API’s refusal and stays open', async () => {
    const { email, send, dialog, closed } = await open();
    await email.setValue('taken@example.test');
    await send.click();
    http
      .expectOne('/v1/users')
      .flush(
        { title: 'Already a user', detail: 'taken@example.test already has an account.' },
        { status: 409, statusText: 'Conflict' },
      );
    expect(await dialog.getContentText()).toContain(
      'Already a user — taken@example.test already has an account.',
    );
    expect(closed()).toBeUndefined();
    expect(await send.isDisabled()).toBe(false);
  });
});
