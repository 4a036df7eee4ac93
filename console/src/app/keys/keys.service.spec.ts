import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { KeysService } from './keys.service';

describe('KeysService', () => {
  let keys: KeysService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    keys = TestBed.inject(KeysService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('follows the cursor from the last id of each page until hasMore is false', async () => {
    const all = firstValueFrom(keys.listAll());
    const first = http.expectOne((r) => r.url === '/v1/keys' && !r.params.has('startingAfter'));
    expect(first.request.params.get('limit')).toBe('100');
    expect(first.request.params.has('includeRevoked')).toBe(false);
    first.flush({ data: [{ id: 'key_1' }, { id: 'key_2' }], hasMore: true });

    const second = http.expectOne((r) => r.params.get('startingAfter') === 'key_2');
    second.flush({ data: [{ id: 'key_3' }], hasMore: false });

    expect((await all).map((k) => k.id)).toEqual(['key_1', 'key_2', 'key_3']);
  });

  it('asks for revoked keys only when told to, on every page', async () => {
    const all = firstValueFrom(keys.listAll(true));
    const first = http.expectOne('/v1/keys?limit=100&includeRevoked=true');
    first.flush({ data: [{ id: 'key_1' }], hasMore: true });
    http
      .expectOne('/v1/keys?limit=100&includeRevoked=true&startingAfter=key_1')
      .flush({ data: [], hasMore: false });
    expect(await all).toHaveLength(1);
  });

  it('stops on an empty page even if the server says there is more', async () => {
    const all = firstValueFrom(keys.listAll());
    http.expectOne('/v1/keys?limit=100').flush({ data: [], hasMore: true });
    expect(await all).toEqual([]);
  });

  it('creates with POST, updates with PATCH and revokes with DELETE at the escaped key address', () => {
    keys.create({ name: 'Rig', role: 'calculate' }).subscribe();
    const create = http.expectOne('/v1/keys');
    expect(create.request.method).toBe('POST');
    expect(create.request.body).toEqual({ name: 'Rig', role: 'calculate' });
    create.flush({});

    keys.update('key/1', { name: 'Renamed', rateLimitPerMinute: 30 }).subscribe();
    const update = http.expectOne('/v1/keys/key%2F1');
    expect(update.request.method).toBe('PATCH');
    expect(update.request.body).toEqual({ name: 'Renamed', rateLimitPerMinute: 30 });
    update.flush({});

    keys.revoke('key_9').subscribe();
    expect(http.expectOne('/v1/keys/key_9').request.method).toBe('DELETE');
  });
});
