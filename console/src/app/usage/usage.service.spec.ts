import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { UsageService } from './usage.service';
import type { UsageQuery } from './usage.model';

const week: UsageQuery = { from: '2026-03-01T00:00:00Z', to: '2026-03-08T00:00:00Z', groupBy: 'day' };

describe('UsageService', () => {
  let usage: UsageService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    usage = TestBed.inject(UsageService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('sends the range and grouping, and a key and route only when chosen', async () => {
    const rows = firstValueFrom(usage.rows(week));
    const plain = http.expectOne((r) => r.url === '/v1/usage');
    expect(plain.request.params.keys().sort()).toEqual(['from', 'groupBy', 'to']);
    expect(plain.request.params.get('from')).toBe(week.from);
    expect(plain.request.params.get('groupBy')).toBe('day');
    plain.flush({
      data: [{ keyId: null, route: 'GET /v1/rooms', bucket: week.from, count: 3, errorCount: 0 }],
    });
    expect((await rows)[0].count).toBe(3);

    usage.report({ ...week, keyId: 'key_1', route: 'POST /v1/eq/fit' }).subscribe();
    const narrowed = http.expectOne((r) => r.url === '/v1/usage');
    expect(narrowed.request.params.get('keyId')).toBe('key_1');
    expect(narrowed.request.params.get('route')).toBe('POST /v1/eq/fit');
    narrowed.flush({ data: [] });
  });

  it('asks for CSV by Accept header and reads the answer as a blob', async () => {
    const csv = firstValueFrom(usage.csv(week));
    const request = http.expectOne((r) => r.url === '/v1/usage');
    expect(request.request.headers.get('Accept')).toBe('text/csv');
    expect(request.request.responseType).toBe('blob');
    request.flush(new Blob(['bucket,count\n'], { type: 'text/csv' }));
    expect(await (await csv).text()).toBe('bucket,count\n');
  });
});
