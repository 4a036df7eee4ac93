import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { Location } from '@angular/common';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { UserRole } from './auth/roles';
import { routes } from './app.routes';
import { rolePermissions } from '../testing/session';

/** Navigates the real route table as a user of this role (or a visitor) and returns the page's text. */
async function visit(url: string, role: UserRole | null) {
  TestBed.configureTestingModule({
    providers: [
      provideRouter(routes, withComponentInputBinding()),
      provideHttpClient(),
      provideHttpClientTesting(),
    ],
  });
  const http = TestBed.inject(HttpTestingController);
  const harness = await RouterTestingHarness.create();
  const navigation = harness.navigateByUrl(url);
  // The guard asks who is signed in once the address is recognised, a few ticks later.
  let found: TestRequest[] = [];
  for (let tick = 0; tick < 50 && found.length === 0; tick++) {
    await new Promise((resolve) => setTimeout(resolve));
    found = http.match('/auth/session');
  }
  expect(found).toHaveLength(1);
  const session = found[0];
  if (role === null) session.flush(null, { status: 401, statusText: 'Unauthorized' });
  else
    session.flush({
      user: { id: 'usr_1', email: `${role}@example.test`, role },
      permissions: rolePermissions(role),
    });
  await navigation;
  harness.detectChanges();
  // Pages ask for their data; none of that is under test here.
  for (const request of http.match(() => true)) request.flush(null, { status: 503, statusText: 'x' });
  return { harness, router: TestBed.inject(Router), location: TestBed.inject(Location) };
}

describe('the route table', () => {
  it('sends a visitor to sign in and back to the page asked for afterwards', async () => {
    const { router } = await visit('/users', null);
    expect(router.url).toBe('/sign-in?next=%2Fusers');
  });

  it('shows a viewer a plain "needs another role" page at the address of a page they may not open', async () => {
    for (const page of ['/rooms', '/keys', '/users']) {
      TestBed.resetTestingModule();
      const { location, router, harness } = await visit(page, 'viewer');
      // The page says what is missing instead of jumping elsewhere, and the address bar is left alone.
      expect(router.url).toBe(
        `/needs-permission?needs=${page === '/users' ? 'users' : page === '/keys' ? 'keys:own' : 'tuning'}&page=${encodeURIComponent(page)}`,
      );
      expect(location.path()).not.toContain('needs-permission');
      const text = harness.fixture.nativeElement.textContent as string;
      expect(text).toContain('This page needs another role');
      expect(text).toContain(`${page} is for people who may`);
      expect(text).toContain('You are signed in as Viewer.');
    }
  });

  it('opens the rooms page for a developer, and the users page only for an admin', async () => {
    const developer = await visit('/rooms', 'developer');
    expect(developer.router.url).toBe('/rooms');
    expect(developer.harness.fixture.nativeElement.textContent).not.toContain('needs another role');
    TestBed.resetTestingModule();
    const stillDeveloper = await visit('/users', 'developer');
    expect(stillDeveloper.harness.fixture.nativeElement.textContent).toContain('the Admin role');
    TestBed.resetTestingModule();
    const admin = await visit('/users', 'admin');
    expect(admin.harness.fixture.nativeElement.textContent).not.toContain('needs another role');
  });

  it('answers an unknown address inside the console with a not-found page', async () => {
    const { harness, router } = await visit('/no/such/page', 'developer');
    expect(router.url).toBe('/no/such/page');
    expect(harness.fixture.nativeElement.textContent).toContain('Nothing here');
  });

  it('sends a signed-in user away from the sign-in page', async () => {
    const { router } = await visit('/sign-in', 'viewer');
    expect(router.url).toBe('/');
  });
});
