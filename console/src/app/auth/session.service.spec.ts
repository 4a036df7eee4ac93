import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { SessionService, SessionUser } from './session.service';

const admin: SessionUser = { id: 'usr_1', email: 'admin@example.test', role: 'admin', name: 'Ada' };

describe('SessionService', () => {
  let session: SessionService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    session = TestBed.inject(SessionService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('asks the server once, shares the answer and keeps the permissions it lists', async () => {
    const first = firstValueFrom(session.load());
    const second = firstValueFrom(session.load());
    const request = http.expectOne('/auth/session');
    expect(request.request.method).toBe('GET');
    request.flush({ user: admin, permissions: ['keys:own', 'keys:all', 'users'] });

    expect(await first).toEqual(admin);
    expect(await second).toEqual(admin);
    expect(session.signedIn()).toBe(true);
    expect(session.known()).toBe(true);
    expect(session.role()).toBe('admin');
    expect(session.can('users:manage')).toBe(true);
    expect(session.can('usage:all')).toBe(false);

    // Resolved: a later load answers from memory without a request (verify() fails otherwise).
    expect(await firstValueFrom(session.load())).toEqual(admin);
  });

  it('treats a 401 as nobody signed in, and rethrows any other failure', async () => {
    const anonymous = firstValueFrom(session.load());
    http
      .expectOne('/auth/session')
      .flush({ title: 'Unauthorized' }, { status: 401, statusText: 'Unauthorized' });
    expect(await anonymous).toBeNull();
    expect(session.signedIn()).toBe(false);
    expect(session.known()).toBe(true);

    const fresh = TestBed.runInInjectionContext(() => new SessionService());
    const failing = firstValueFrom(fresh.load());
    http.expectOne('/auth/session').flush('down', { status: 503, statusText: 'Service Unavailable' });
    await expect(failing).rejects.toMatchObject({ status: 503 });
    expect(fresh.known()).toBe(false);
  });

  it('signs in with the email and password as the body and takes the user it answers', async () => {
    const signedIn = firstValueFrom(session.signIn('dev@example.test', 'correct horse'));
    const request = http.expectOne('/auth/session');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'dev@example.test', password: 'correct horse' });
    request.flush({ user: { ...admin, role: 'developer' }, permissions: ['calculate', 'tuning'] });

    expect((await signedIn).role).toBe('developer');
    expect(session.can('rooms:view')).toBe(true);
    expect(session.can('keys:all')).toBe(false);
  });

  it('accepts an invitation with the token and new password and is then signed in', async () => {
    const accepted = firstValueFrom(session.acceptInvitation('tok_abc', 'a long new password'));
    const request = http.expectOne('/auth/invitations/accept');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ token: 'tok_abc', password: 'a long new password' });
    request.flush({ user: admin, permissions: ['users'] });
    expect(await accepted).toEqual(admin);
    expect(session.user()).toEqual(admin);
  });

  it('signs out with DELETE and forgets the user and permissions, also when the session had already ended', async () => {
    const signedIn = firstValueFrom(session.signIn('a@example.test', 'pw'));
    http.expectOne('/auth/session').flush({ user: admin, permissions: ['users'] });
    await signedIn;

    const out = firstValueFrom(session.signOut());
    const request = http.expectOne('/auth/session');
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 401, statusText: 'Unauthorized' });
    await out;
    expect(session.user()).toBeNull();
    expect(session.permissions()).toEqual([]);
    expect(session.can('users:manage')).toBe(false);
  });

  it('keeps the user when signing out fails for another reason', async () => {
    const signedIn = firstValueFrom(session.signIn('a@example.test', 'pw'));
    http.expectOne('/auth/session').flush({ user: admin, permissions: ['users'] });
    await signedIn;

    const out = firstValueFrom(session.signOut());
    http.expectOne('/auth/session').flush('boom', { status: 500, statusText: 'Server Error' });
    await expect(out).rejects.toMatchObject({ status: 500 });
    expect(session.user()).toEqual(admin);
  });
});
