import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { EnvironmentInjector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import {
  ActivatedRouteSnapshot,
  CanActivateFn,
  RedirectCommand,
  Router,
  RouterStateSnapshot,
  UrlTree,
  provideRouter,
} from '@angular/router';
import { Observable, firstValueFrom, isObservable, of } from 'rxjs';
import { redirectWhenSignedIn, requireCapability, requireSession } from './guards';
import type { Permission } from './roles';

type GuardResult = boolean | UrlTree | RedirectCommand;

describe('route guards', () => {
  let http: HttpTestingController;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });

  afterEach(() => http.verify());

  function run(guard: CanActivateFn, url: string): Promise<GuardResult> {
    const result = runInInjectionContext(TestBed.inject(EnvironmentInjector), () =>
      guard({} as ActivatedRouteSnapshot, { url } as RouterStateSnapshot),
    );
    const stream = (isObservable(result) ? result : of(result)) as Observable<GuardResult>;
    return firstValueFrom(stream);
  }

  function answerSession(permissions: Permission[] | null): void {
    const request = http.expectOne('/auth/session');
    if (permissions === null) request.flush(null, { status: 401, statusText: 'Unauthorized' });
    else request.flush({ user: { id: 'usr_1', email: 'someone@example.test', role: 'viewer' }, permissions });
  }

  describe('requireSession', () => {
    it('lets a signed-in user through', async () => {
      const result = run(requireSession, '/keys');
      answerSession(['keys:own']);
      expect(await result).toBe(true);
    });

    it('sends a visitor to sign in, remembering the page asked for', async () => {
      const result = run(requireSession, '/rooms/room_1?tab=tunings');
      answerSession(null);
      const tree = (await result) as UrlTree;
      expect(router.serializeUrl(tree)).toBe('/sign-in?next=%2Frooms%2Froom_1%3Ftab%3Dtunings');
    });

    it('sends the visitor to sign in when the server cannot say who they are', async () => {
      const result = run(requireSession, '/usage');
      http.expectOne('/auth/session').flush('down', { status: 502, statusText: 'Bad Gateway' });
      expect(router.serializeUrl((await result) as UrlTree)).toBe('/sign-in?next=%2Fusage');
    });
  });

  describe('requireCapability', () => {
    it('lets a user whose permissions carry the capability through', async () => {
      const result = run(requireCapability('users:manage'), '/users');
      answerSession(['users', 'usage:all']);
      expect(await result).toBe(true);
    });

    it('shows the needs-permission page at the same address, naming the permission and the page', async () => {
      const result = run(requireCapability('rooms:view'), '/rooms');
      answerSession(['usage:own']);
      const command = await result;
      expect(command).toBeInstanceOf(RedirectCommand);
      const redirect = command as RedirectCommand;
      expect(router.serializeUrl(redirect.redirectTo as UrlTree)).toBe(
        '/needs-permission?needs=tuning&page=%2Frooms',
      );
      expect(redirect.navigationBehaviorOptions?.skipLocationChange).toBe(true);
    });

    it('refuses everything to a visitor with no session', async () => {
      const result = run(requireCapability('keys:view'), '/keys');
      answerSession(null);
      expect(await result).toBeInstanceOf(RedirectCommand);
    });
  });

  describe('redirectWhenSignedIn', () => {
    it('sends a signed-in user from the sign-in page to the overview', async () => {
      const result = run(redirectWhenSignedIn, '/sign-in');
      answerSession(['usage:own']);
      expect(router.serializeUrl((await result) as UrlTree)).toBe('/');
    });

    it('shows the sign-in page to a visitor', async () => {
      const visitor = run(redirectWhenSignedIn, '/sign-in');
      answerSession(null);
      expect(await visitor).toBe(true);
    });

    it('shows the sign-in page when the session check fails', async () => {
      const failing = run(redirectWhenSignedIn, '/sign-in');
      http.expectOne('/auth/session').flush('down', { status: 500, statusText: 'Server Error' });
      expect(await failing).toBe(true);
    });
  });
});
