import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import { AcceptInvitationPage } from './accept-invitation-page';

describe('AcceptInvitationPage', () => {
  let fixture: ComponentFixture<AcceptInvitationPage>;
  let loader: HarnessLoader;
  let http: HttpTestingController;

  async function render(token: string | undefined) {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AcceptInvitationPage);
    fixture.componentRef.setInput('token', token);
    fixture.detectChanges();
    await fixture.whenStable();
    loader = TestbedHarnessEnvironment.loader(fixture);
  }

  afterEach(() => http.verify());

  const field = (name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
  const submit = () => loader.getHarness(MatButtonHarness.with({ text: 'Set password' }));

  it('says what to do when the link has no token', async () => {
    await render(undefined);
    expect(fixture.nativeElement.textContent).toContain('This link has no invitation token.');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Set password' }))).toEqual([]);
  });

  it('lists the password’s problems and sends nothing until they are solved', async () => {
    await render('tok_1');
    await (await field('password')).setValue('short');
    await (await field('repeat')).setValue('other');
    await (await submit()).click();
    http.expectNone('/auth/invitations/accept');
    const problems = fixture.nativeElement.querySelector('[aria-label="Password problems"]').textContent;
    expect(problems).toContain('Use at least 12 characters (5 so far).');
    expect(problems).toContain('The two passwords differ.');
  });

  it('sets the password with the token, then goes to the console', async () => {
    await render('tok_1');
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await field('password')).setValue('a long enough password');
    await (await field('repeat')).setValue('a long enough password');
    await (await submit()).click();
    const request = http.expectOne('/auth/invitations/accept');
    expect(request.request.body).toEqual({ token: 'tok_1', password: 'a long enough password' });
    request.flush({ user: { id: 'usr_9', email: 'new@example.test', role: 'viewer' }, permissions: [] });
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toContain('Your password is set.');
    expect(navigate).toHaveBeenCalledWith(['/']);
  });

  it('shows an expired link’s refusal', async () => {
    await render('tok_old');
    await (await field('password')).setValue('a long enough password');
    await (await field('repeat')).setValue('a long enough password');
    await (await submit()).click();
    http
      .expectOne('/auth/invitations/accept')
      .flush({ title: 'This invitation has expired' }, { status: 410, statusText: 'Gone' });
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(
      'This invitation has expired',
    );
  });
});
