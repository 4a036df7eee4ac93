import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { Router, provideRouter } from '@angular/router';
import type { UserRole } from '../auth/roles';
import { SessionService } from '../auth/session.service';
import { signInAs } from '../../testing/session';
import { ThemeService } from '../theme/theme.service';
import { Shell } from './shell';

@Component({ selector: 'iso-sign-in-stub', template: 'sign in' })
class SignInStub {
  readonly shown = true;
}

describe('Shell', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<Shell>;
  let loader: HarnessLoader;
  let root: HarnessLoader;

  beforeEach(() => localStorage.clear());
  afterEach(() => {
    http.verify();
    localStorage.clear();
  });

  async function render(role: UserRole) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'sign-in', component: SignInStub }]),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs(role);
    fixture = TestBed.createComponent(Shell);
    fixture.detectChanges();
    await fixture.whenStable();
    loader = TestbedHarnessEnvironment.loader(fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  }

  const navLabels = () =>
    [...(fixture.nativeElement as HTMLElement).querySelectorAll('mat-nav-list a')].map((a) =>
      a.textContent?.replace(/\s+/g, ' ').trim(),
    );

  it('offers only the pages the signed-in role may open, and names the role', async () => {
    await render('viewer');
    const viewer = navLabels();
    TestBed.resetTestingModule();
    localStorage.clear();
    await render('admin');
    const admin = navLabels();
    expect(admin.length).toBeGreaterThan(viewer.length);
    for (const label of viewer) expect(admin).toContain(label);
    const account = await loader.getHarness(MatMenuHarness.with({ triggerText: /AE|admin/ }));
    await account.open();
    expect(document.querySelector('[data-testid="session-role"]')?.textContent).toBe('Admin');
  });

  it('switches the colour scheme from the toolbar', async () => {
    await render('developer');
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Colour scheme"]' }));
    await menu.clickItem({ text: /Dark/ });
    expect(TestBed.inject(ThemeService).mode()).toBe('dark');
    expect(
      (fixture.nativeElement as HTMLElement).querySelector('[aria-label="Colour scheme"] mat-icon')
        ?.textContent,
    ).toBe('dark_mode');
  });

  it('moves focus to the content from the skip link instead of following it', async () => {
    await render('developer');
    const main = document.getElementById('main-content');
    expect(main).not.toBeNull();
    const link = (fixture.nativeElement as HTMLElement).querySelector<HTMLAnchorElement>('.skip-link')!;
    const click = new MouseEvent('click', { cancelable: true, bubbles: true });
    link.dispatchEvent(click);
    expect(click.defaultPrevented).toBe(true);
    expect(document.activeElement).toBe(main);
  });

  it('signs out and goes to the sign-in page', async () => {
    await render('developer');
    const account = await loader.getHarness(MatMenuHarness.with({ selector: '.account-button' }));
    await account.clickItem({ text: /Sign out/ });
    const request = http.expectOne('/auth/session');
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/sign-in');
    expect(TestBed.inject(SessionService).user()).toBeNull();
  });

  it('stays signed in and says why when signing out fails', async () => {
    await render('developer');
    const account = await loader.getHarness(MatMenuHarness.with({ selector: '.account-button' }));
    await account.clickItem({ text: /Sign out/ });
    http.expectOne('/auth/session').flush(null, { status: 503, statusText: 'Service Unavailable' });
    await fixture.whenStable();
    expect(await (await root.getHarness(MatSnackBarHarness)).getMessage()).toBe(
      'The service is not available right now',
    );
    expect(TestBed.inject(SessionService).user()).not.toBeNull();
    expect(TestBed.inject(Router).url).toBe('/');
  });
});
