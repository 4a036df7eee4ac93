import { Clipboard } from '@angular/cdk/clipboard';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import { signInAs } from '../../../testing/session';
import type { ConsoleUser } from '../user.model';
import { UsersPage } from './users-page';

function user(id: string, email: string, overrides: Partial<ConsoleUser> = {}): ConsoleUser {
  return {
    id,
    email,
    name: null,
    role: 'developer',
    status: 'active',
    createdAt: '2026-03-01T08:00:00Z',
    updatedAt: '2026-03-01T08:00:00Z',
    lastSignInAt: null,
    ...overrides,
  };
}

const me = user('usr_1', 'admin@example.test', { role: 'admin', name: 'Ada Admin' });
const dev = user('usr_2', 'dev@example.test');
const guest = user('usr_4', 'guest@example.test', { status: 'invited', role: 'viewer' });

describe('UsersPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<UsersPage>;
  let loader: HarnessLoader;
  let root: HarnessLoader;
  const copy = vi.fn(() => true);

  async function settle() {
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function render(outbox: 'none' | 'empty' | 'messages' = 'none', users: ConsoleUser[] = [me, dev]) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: Clipboard, useValue: { copy } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('admin');
    fixture = TestBed.createComponent(UsersPage);
    // Not whenStable(): the page's resources count as pending until these answers come.
    fixture.detectChanges();
    http.expectOne('/v1/users?limit=100').flush({ data: users, hasMore: false });
    const outboxRequest = http.expectOne('/v1/outbox');
    if (outbox === 'none')
      outboxRequest.flush({ title: 'Not found' }, { status: 404, statusText: 'Not Found' });
    else
      outboxRequest.flush({
        data:
          outbox === 'empty'
            ? []
            : [
                {
                  id: 'msg_1',
                  subject: 'You are invited',
                  to: ['new@example.test'],
                  sentAt: '2026-03-01T09:00:00Z',
                  text: `Set your password: ${location.origin}/accept-invitation?token=abc`,
                },
              ],
      });
    await settle();
    loader = TestbedHarnessEnvironment.loader(fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  }

  afterEach(() => {
    http.verify();
    copy.mockClear();
  });

  it('lists users; one’s own role is shown but cannot be changed', async () => {
    await render();
    const columns = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(columns['user'].text).toHaveLength(2);
    expect(columns['user'].text[0]).toContain('Ada Admin');
    expect(columns['user'].text[0]).toContain('admin@example.test');
    expect(columns['user'].text[1]).toBe('dev@example.test');
    // Only the other user's role is a select, and only they can be disabled.
    expect(await loader.getAllHarnesses(MatSelectHarness)).toHaveLength(1);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Disable' }))).toHaveLength(1);
    // A 404 outbox means production: no outbox section.
    expect(fixture.nativeElement.textContent).not.toContain('Development outbox');
  });

  it('changes a role with PATCH and says what changed for their keys', async () => {
    await render();
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Viewer' });
    const request = http.expectOne('/v1/users/usr_2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ role: 'viewer' });
    request.flush({
      ...dev,
      role: 'viewer',
      keys: [{ id: 'key_1', name: 'Rig', role: 'tuning', effect: 'suspended' }],
    });
    await settle();
    const snack = await root.getHarness(MatSnackBarHarness);
    expect(await snack.getMessage()).toContain('dev@example.test is now viewer.');
  });

  it('puts the role back and shows the refusal when the change fails', async () => {
    await render();
    const select = await loader.getHarness(MatSelectHarness);
    await select.clickOptions({ text: 'Admin' });
    http.expectOne('/v1/users/usr_2').flush({ title: 'Last admin' }, { status: 409, statusText: 'Conflict' });
    await settle();
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe('Last admin');
    expect(await (await loader.getHarness(MatSelectHarness)).getValueText()).toBe('Developer');
  });

  it('disables only after confirmation', async () => {
    await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Disable' }))).click();
    const confirm = await root.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Disable dev@example.test?');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Disable user' }))).click();
    const request = http.expectOne('/v1/users/usr_2');
    expect(request.request.body).toEqual({ status: 'disabled' });
    request.flush({ ...dev, status: 'disabled' });
    await settle();
    const columns = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(columns['status'].text).toEqual(['Active', 'Disabled']);

    // Enabling again asks nothing.
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Enable' }))).click();
    expect(http.expectOne('/v1/users/usr_2').request.body).toEqual({ status: 'active' });
  });

  it('adds an invited user to the list, and hands over the link when the e-mail could not go out', async () => {
    await render('empty');
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="invite-user"]' }))
    ).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (
      await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="invite-email"]' }))
    ).setValue('new@example.test');
    await (
      await dialog.getHarness(MatButtonHarness.with({ selector: '[data-testid="send-invite"]' }))
    ).click();
    http.expectOne('/v1/users').flush({
      user: user('usr_3', 'new@example.test', { status: 'invited' }),
      invitation: {
        url: 'http://localhost/accept-invitation?token=t1',
        emailSent: false,
        expiresAt: '2026-03-08T00:00:00Z',
      },
    });
    // The dialog closes once stable; its result then makes the page ask for the outbox again.
    await settle();
    fixture.detectChanges();
    http.expectOne('/v1/outbox').flush({ data: [] });
    await settle();

    const columns = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(columns['user'].text[0]).toBe('new@example.test');
    expect(columns['status'].text[0]).toBe('Invited');
    expect(fixture.nativeElement.textContent).toContain('http://localhost/accept-invitation?token=t1');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Copy link' }))).click();
    expect(copy).toHaveBeenCalledWith('http://localhost/accept-invitation?token=t1');
  });

  it('shows the development outbox with links kept inside the console', async () => {
    await render('messages');
    expect(fixture.nativeElement.textContent).toContain('Development outbox');
    const panel = await loader.getHarness(MatExpansionPanelHarness);
    expect(await panel.getTitle()).toBe('You are invited');
    await panel.expand();
    const link = fixture.nativeElement.querySelector('iso-outbox-panel a') as HTMLAnchorElement;
    expect(link.getAttribute('href')).toBe('/accept-invitation?token=abc');
  });

  it('shows a load failure with a retry', async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs('admin');
    fixture = TestBed.createComponent(UsersPage);
    fixture.detectChanges();
    http.expectOne('/v1/users?limit=100').flush({ title: 'Database busy' }, { status: 503, statusText: 'x' });
    http.expectOne('/v1/outbox').flush({ data: [] });
    await settle();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain('Database busy');
    // A native click: a harness would wait for the page to be stable, which it is not until answered.
    const retry = [...fixture.nativeElement.querySelectorAll('button')].find((b: HTMLButtonElement) =>
      b.textContent?.includes('Retry'),
    ) as HTMLButtonElement;
    retry.click();
    fixture.detectChanges();
    http.expectOne('/v1/users?limit=100').flush({ data: [me], hasMore: false });
    http.expectOne('/v1/outbox').flush({ data: [] });
    await settle();
    expect(fixture.nativeElement.querySelector('[role="alert"]')).toBeNull();
  });
  describe('a new invitation link', () => {
    const reissueButton = () =>
      loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="reissue-invitation"]' }));
    /**
     * A native click on the dialog's confirm button: a harness would wait for the page to be stable,
     * which it is not while the request it starts is unanswered.
     */
    /** Change detection without waiting for stability (a reload keeps the page busy until answered). */
    async function tick() {
      fixture.detectChanges();
      await new Promise((resolve) => setTimeout(resolve));
      fixture.detectChanges();
    }
    async function confirmNewLink() {
      await root.getHarness(MatDialogHarness);
      const button = [...document.querySelectorAll('mat-dialog-container button')].find((b) =>
        b.textContent?.includes('Send new link'),
      ) as HTMLButtonElement;
      button.click();
      fixture.detectChanges();
      await new Promise((resolve) => setTimeout(resolve));
    }

    it('is offered only for users who have not accepted yet', async () => {
      await render('none', [me, dev, guest, user('usr_5', 'off@example.test', { status: 'disabled' })]);
      const buttons = await loader.getAllHarnesses(
        MatButtonHarness.with({ selector: '[data-testid="reissue-invitation"]' }),
      );
      expect(buttons).toHaveLength(1);
      expect(await (await buttons[0].host()).getAttribute('aria-label')).toBe(
        'Send guest@example.test a new invitation link',
      );
    });

    it('asks first; cancelling sends nothing', async () => {
      await render('empty', [me, guest]);
      await (await reissueButton()).click();
      const confirm = await root.getHarness(MatDialogHarness);
      expect(await confirm.getTitleText()).toBe('Send guest@example.test a new invitation?');
      expect(await confirm.getContentText()).toContain('The link sent before stops working');
      await (await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
      await settle();
      http.expectNone('/v1/users/usr_4/invitations');
    });

    it('sends the new link once confirmed, says until when it is valid and shows the new mail', async () => {
      await render('empty', [me, guest]);
      await (await reissueButton()).click();
      await confirmNewLink();
      const request = http.expectOne('/v1/users/usr_4/invitations');
      expect(request.request.method).toBe('POST');
      expect(request.request.body).toEqual({});
      fixture.detectChanges();
      // Waiting for the answer, the button cannot be pressed twice.
      const pending = fixture.nativeElement.querySelector('[data-testid="reissue-invitation"]');
      expect(pending.disabled).toBe(true);
      expect(pending.textContent).toContain('Sending…');
      request.flush({
        user: { ...guest, updatedAt: '2026-03-02T10:00:00Z' },
        invitation: {
          url: 'http://localhost/accept-invitation?token=t2',
          emailSent: true,
          expiresAt: '2026-03-16T10:00:00Z',
        },
      });
      await tick();
      http.expectOne('/v1/outbox').flush({
        data: [
          {
            id: 'msg_2',
            subject: 'Your new invitation',
            to: ['guest@example.test'],
            sentAt: '2026-03-02T10:00:00Z',
            text: 'Set your password: http://localhost/accept-invitation?token=t2',
          },
        ],
      });
      await settle();
      const message = await (await root.getHarness(MatSnackBarHarness)).getMessage();
      expect(message).toContain('A new invitation sent to guest@example.test, valid until');
      expect(message).toContain('2026');
      expect(fixture.nativeElement.textContent).not.toContain('could not be sent');
      expect(await (await loader.getHarness(MatExpansionPanelHarness)).getTitle()).toBe(
        'Your new invitation',
      );
      expect(await (await reissueButton()).isDisabled()).toBe(false);
    });

    it('hands over the new link when the e-mail could not go out', async () => {
      await render('empty', [me, guest]);
      await (await reissueButton()).click();
      await confirmNewLink();
      http.expectOne('/v1/users/usr_4/invitations').flush({
        user: guest,
        invitation: {
          url: 'http://localhost/accept-invitation?token=t3',
          emailSent: false,
          expiresAt: '2026-03-16T10:00:00Z',
        },
      });
      await tick();
      http.expectOne('/v1/outbox').flush({ data: [] });
      await settle();
      expect(fixture.nativeElement.textContent).toContain('http://localhost/accept-invitation?token=t3');
      expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe(
        'The e-mail to guest@example.test could not be sent; copy the link below.',
      );
    });

    it('shows the refusal when they accepted meanwhile, and reloads the list', async () => {
      await render('none', [me, guest]);
      await (await reissueButton()).click();
      await confirmNewLink();
      http
        .expectOne('/v1/users/usr_4/invitations')
        .flush(
          { title: 'Already accepted', detail: 'guest@example.test has already accepted the invitation.' },
          { status: 409, statusText: 'Conflict' },
        );
      await tick();
      http
        .expectOne('/v1/users?limit=100')
        .flush({ data: [me, { ...guest, status: 'active' }], hasMore: false });
      http.expectOne('/v1/outbox').flush({ title: 'Not found' }, { status: 404, statusText: 'Not Found' });
      await settle();
      expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toContain('Already accepted');
      expect(
        await loader.getAllHarnesses(
          MatButtonHarness.with({ selector: '[data-testid="reissue-invitation"]' }),
        ),
      ).toHaveLength(0);
    });
  });
});
