import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { RoomsService } from './rooms.service';
import type { RoomCreate } from './room.model';

describe('RoomsService', () => {
  let rooms: RoomsService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    rooms = TestBed.inject(RoomsService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('lists rooms, tunings and profiles across pages', async () => {
    const list = firstValueFrom(rooms.rooms());
    http.expectOne('/v1/rooms?limit=100').flush({ data: [{ id: 'room_a' }], hasMore: true });
    http
      .expectOne('/v1/rooms?limit=100&startingAfter=room_a')
      .flush({ data: [{ id: 'room_b' }], hasMore: false });
    expect((await list).map((r) => r.id)).toEqual(['room_a', 'room_b']);

    const tunings = firstValueFrom(rooms.tunings('room a'));
    http.expectOne('/v1/rooms/room%20a/tunings?limit=100').flush({ data: [{ id: 'tun_1' }], hasMore: false });
    expect(await tunings).toHaveLength(1);

    const profiles = firstValueFrom(rooms.profiles());
    http.expectOne('/v1/processor-profiles?limit=100').flush({ data: [{ id: 'pp_1' }], hasMore: true });
    http.expectOne('/v1/processor-profiles?limit=100&startingAfter=pp_1').flush({ data: [], hasMore: false });
    expect(await profiles).toHaveLength(1);
  });

  it('reads one room and one profile at their escaped addresses, and the layouts unwrapped', async () => {
    rooms.room('room/1').subscribe();
    http.expectOne('/v1/rooms/room%2F1').flush({});
    rooms.profile('pp_1').subscribe();
    http.expectOne('/v1/processor-profiles/pp_1').flush({});
    const layouts = firstValueFrom(rooms.layouts());
    http.expectOne('/v1/layouts').flush({ data: [{ id: '0+5+0' }], hasMore: false });
    expect(await layouts).toEqual([{ id: '0+5+0' }]);
  });

  it('creates with POST and updates with PATCH, sending the body as given', () => {
    const body: RoomCreate = {
      name: 'Stage 9',
      layout: '0+2+0',
      dimensions: { widthM: 4, lengthM: 5, heightM: 2.6 },
      listener: { x: 2, y: 2.5, z: 1.2 },
      loudspeakers: [],
    };
    rooms.create(body).subscribe();
    const create = http.expectOne('/v1/rooms');
    expect(create.request.method).toBe('POST');
    expect(create.request.body).toBe(body);
    create.flush({});

    rooms.update('room_1', { name: 'Renamed' }).subscribe();
    const update = http.expectOne('/v1/rooms/room_1');
    expect(update.request.method).toBe('PATCH');
    expect(update.request.body).toEqual({ name: 'Renamed' });
    update.flush({});
  });
});
