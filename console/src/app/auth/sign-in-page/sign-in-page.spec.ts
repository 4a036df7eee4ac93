import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import { SignInPage, safeNextPath } from './sign-in-page';

describe('safeNextPath', () => {
  it('follows only same-site console paths', () => {
    expect(safeNextPath('/rooms/room_1?tab=tunings')).toBe('/rooms/room_1?tab=tunings');
    expect(safeNextPath('//elsewhere.example/')).toBe('/');
    expect(safeNextPath('https://elsewhere.example/')).toBe('/');
    expect(safeNextPath('/sign-in?next=/keys')).toBe('/');
    expect(safeNextPath(undefined)).toBe('/');
  });
});

describe('SignInPage', () => {
  let fixture: ComponentFixture<SignInPage>;
  let loader: HarnessLoader;
  let http: HttpTestingController;
  let navigate: ReturnType<typeof vi.spyOn>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture = TestBed.createComponent(SignInPage);
    fixture.componentRef.setInput('next', '/keys');
    fixture.detectChanges();
    await fixture.whenStable();
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  afterEach(() => http.verify());

  const email = () => loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }));
  const password = () =>
    loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }));
  const submit = () => loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }));

  it('asks for both fields before sending anything', async () => {
    await (await submit()).click();
    http.expectNone('/auth/session');
    expect(fixture.nativeElement.textContent).toContain('Enter your e-mail address.');
    expect(fixture.nativeElement.textContent).toContain('Enter your password.');
  });

  it('signs in with the trimmed address and goes to the page asked for', async () => {
    await (await email()).setValue(' dev@example.test ');
    await (await password()).setValue('kestrel-demo');
    await (await submit()).click();
    const request = http.expectOne('/auth/session');
    expect(request.request.body).toEqual({ email: 'dev@example.test', password: 'kestrel-demo' });
    request.flush({ user: { id: 'usr_1', email: 'dev@example.test', role: 'developer' }, permissions: [] });
    expect(navigate).toHaveBeenCalledWith('/keys');
  });

  it('shows a refusal and lets the person try again', async () => {
    await (await email()).setValue('dev@example.test');
    await (await password()).setValue('wrong');
    await (await submit()).click();
    http
      .expectOne('/auth/session')
      .flush({ title: 'Wrong e-mail or password' }, { status: 401, statusText: 'Unauthorized' });
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(
      'Wrong e-mail or password',
    );
    expect(await (await submit()).isDisabled()).toBe(false);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('shows or hides the password on request', async () => {
    const toggle = await loader.getHarness(
      MatButtonHarness.with({ selector: '[aria-label="Show password"]' }),
    );
    await toggle.click();
    expect(await (await password()).getType()).toBe('text');
    expect(await (await toggle.host()).getAttribute('aria-pressed')).toBe('true');
  });
});
