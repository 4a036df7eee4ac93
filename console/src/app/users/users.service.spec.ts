import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { UsersService } from './users.service';

describe('UsersService', () => {
  let users: UsersService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    users = TestBed.inject(UsersService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('lists every user across pages', async () => {
    const all = firstValueFrom(users.listAll());
    http.expectOne('/v1/users?limit=100').flush({ data: [{ id: 'usr_1' }], hasMore: true });
    http
      .expectOne('/v1/users?limit=100&startingAfter=usr_1')
      .flush({ data: [{ id: 'usr_2' }], hasMore: false });
    expect((await all).map((u) => u.id)).toEqual(['usr_1', 'usr_2']);
  });

  it('invites with the request as the body and reissues a link with an empty body', () => {
    users.invite({ email: 'new@example.test', role: 'viewer' }).subscribe();
    const invite = http.expectOne('/v1/users');
    expect(invite.request.method).toBe('POST');
    expect(invite.request.body).toEqual({ email: 'new@example.test', role: 'viewer' });
    invite.flush({});

    users.reissueInvitation('usr 3').subscribe();
    const reissue = http.expectOne('/v1/users/usr%203/invitations');
    expect(reissue.request.method).toBe('POST');
    expect(reissue.request.body).toEqual({});
    reissue.flush({});
  });

  it('answers the updated user with the keys a role change moved', async () => {
    const update = firstValueFrom(users.update('usr_1', { role: 'viewer' }));
    const request = http.expectOne('/v1/users/usr_1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ role: 'viewer' });
    const moved = {
      id: 'key_rig',
      name: 'Rig',
      prefix: 'iso_live_',
      lastFour: 'a1b2',
      role: 'tuning' as const,
      effectiveRoleBefore: 'tuning' as const,
      effectiveRoleAfter: null,
    };
    request.flush({ id: 'usr_1', role: 'viewer', keys: [moved] });
    expect(await update).toEqual({ id: 'usr_1', role: 'viewer', keys: [moved] });
  });

  it('unwraps the outbox messages', async () => {
    const messages = firstValueFrom(users.outbox());
    http.expectOne('/v1/outbox').flush({ data: [{ id: 'msg_1' }] });
    expect(await messages).toEqual([{ id: 'msg_1' }]);
  });
});
