import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { TuningsService } from './tunings.service';
import type { TuningCreate } from './tuning.model';

describe('TuningsService', () => {
  let tunings: TuningsService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    tunings = TestBed.inject(TuningsService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('creates a tuning under its room', () => {
    const body: TuningCreate = { name: 'First', channels: [] };
    tunings.create('room_1', body).subscribe();
    const request = http.expectOne('/v1/rooms/room_1/tunings');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toBe(body);
    request.flush({});
  });

  it('reads the latest version unless one is named', () => {
    tunings.tuning('tun_1').subscribe();
    http.expectOne('/v1/tunings/tun_1').flush({});
    tunings.tuning('tun_1', 3).subscribe();
    http.expectOne('/v1/tunings/tun_1?version=3').flush({});
  });

  it('pages through versions by version number', async () => {
    const versions = firstValueFrom(tunings.versions('tun_1'));
    http
      .expectOne('/v1/tunings/tun_1/versions?limit=100')
      .flush({ data: [{ version: 1 }, { version: 2 }], hasMore: true });
    http
      .expectOne('/v1/tunings/tun_1/versions?limit=100&startingAfter=2')
      .flush({ data: [{ version: 3 }], hasMore: false });
    expect((await versions).map((v) => v.version)).toEqual([1, 2, 3]);
  });

  it('updates with PATCH, deletes, and restores a version with an empty POST', async () => {
    tunings.update('tun_1', { name: 'New name' }).subscribe();
    const update = http.expectOne('/v1/tunings/tun_1');
    expect(update.request.method).toBe('PATCH');
    expect(update.request.body).toEqual({ name: 'New name' });
    update.flush({});

    const removed = firstValueFrom(tunings.remove('tun_1'));
    const remove = http.expectOne('/v1/tunings/tun_1');
    expect(remove.request.method).toBe('DELETE');
    remove.flush(null, { status: 204, statusText: 'No Content' });
    expect(await removed).toBeUndefined();

    tunings.restore('tun_1', 2).subscribe();
    const restore = http.expectOne('/v1/tunings/tun_1/versions/2/restore');
    expect(restore.request.method).toBe('POST');
    expect(restore.request.body).toBeNull();
    restore.flush({});
  });

  it('duplicates with the name, adding the version only when one is chosen', () => {
    tunings.duplicate('tun_1', 'Variant').subscribe();
    expect(http.expectOne('/v1/tunings/tun_1/duplicate').request.body).toEqual({ name: 'Variant' });
    tunings.duplicate('tun_1', 'Older', 2).subscribe();
    expect(http.expectOne('/v1/tunings/tun_1/duplicate').request.body).toEqual({ name: 'Older', version: 2 });
  });

  it('compares two sides, naming versions only where given', () => {
    tunings.compare({ tuningId: 'tun_1' }, { tuningId: 'tun_2', version: 4 }).subscribe();
    const request = http.expectOne((r) => r.url === '/v1/tunings/compare');
    expect(request.request.params.get('left')).toBe('tun_1');
    expect(request.request.params.get('right')).toBe('tun_2');
    expect(request.request.params.has('leftVersion')).toBe(false);
    expect(request.request.params.get('rightVersion')).toBe('4');
    request.flush({});
  });

  it('exports as a blob with the Accept header matching the format', () => {
    tunings.export('tun_1', 'csv', 5).subscribe();
    const csv = http.expectOne('/v1/tunings/tun_1/export?format=csv&version=5');
    expect(csv.request.headers.get('Accept')).toBe('text/csv');
    expect(csv.request.responseType).toBe('blob');
    csv.flush(new Blob(['x']));

    tunings.export('tun_1', 'json').subscribe();
    const json = http.expectOne('/v1/tunings/tun_1/export?format=json');
    expect(json.request.headers.get('Accept')).toBe('application/json');
    json.flush(new Blob(['{}']));
  });
});
