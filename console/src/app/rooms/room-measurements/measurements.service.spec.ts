import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { MeasurementsService } from './measurements.service';

describe('MeasurementsService', () => {
  let measurements: MeasurementsService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    measurements = TestBed.inject(MeasurementsService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('lists only the room’s measurements taken without a tuning, across pages', async () => {
    const list = firstValueFrom(measurements.list('room_1'));
    http
      .expectOne('/v1/rooms/room_1/measurements?limit=100&stage=before')
      .flush({ data: [{ id: 'mea_1' }], hasMore: true });
    http
      .expectOne('/v1/rooms/room_1/measurements?limit=100&stage=before&startingAfter=mea_1')
      .flush({ data: [{ id: 'mea_2' }], hasMore: false });
    expect((await list).map((m) => m.id)).toEqual(['mea_1', 'mea_2']);
  });

  it('uploads channel, microphone position and the file as multipart form data', () => {
    const file = new File(['RIFF'], 'L-pos1.wav', { type: 'audio/wav' });
    measurements.upload('room_1', 'L', 'MLP', file).subscribe();
    const request = http.expectOne('/v1/rooms/room_1/measurements');
    expect(request.request.method).toBe('POST');
    const form = request.request.body as FormData;
    expect(form.get('channel')).toBe('L');
    expect(form.get('micPosition')).toBe('MLP');
    expect((form.get('file') as File).name).toBe('L-pos1.wav');
    request.flush({});
  });

  it('reads, deletes and averages at the room’s measurement addresses', () => {
    measurements.get('room_1', 'mea 1').subscribe();
    http.expectOne('/v1/rooms/room_1/measurements/mea%201').flush({});
    measurements.delete('room_1', 'mea_1').subscribe();
    expect(http.expectOne('/v1/rooms/room_1/measurements/mea_1').request.method).toBe('DELETE');
    measurements.average('room_1', 'C').subscribe();
    http.expectOne('/v1/rooms/room_1/measurements/average?channel=C').flush({});
  });

  it('posts the fit request to the EQ fit operation', () => {
    const body = {
      sampleRateHz: 48000,
      measured: { frequenciesHz: [100], magnitudeDb: [3] },
      target: { kind: 'flat' as const },
      maxBands: 4,
      maxBoostDb: 0,
      maxCutDb: 12,
    };
    measurements.fitEq(body).subscribe();
    const request = http.expectOne('/v1/eq/fit');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toBe(body);
    request.flush({});
  });
});
