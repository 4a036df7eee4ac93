import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { LAYOUTS } from '../../../../../shared/layouts';
import { answeredRoom } from '../../../testing/fixtures';
import type { Room } from '../room.model';
import { PLAN_STEP_M } from './plan-moves';
import { RoomEditorPage } from './room-editor-page';

const stored: Room = answeredRoom({
  id: 'room_1',
  name: 'Suite B',
  layout: 'bs2051-b',
  dimensions: { widthM: 4.2, lengthM: 5, heightM: 2.7 },
  listener: { x: 2.1, y: 2.6, z: 1.2 },
  loudspeakers: [
    // +30° at 1.8 m: x = 2.1 − 1.8·sin 30° = 1.2, y = 2.6 − 1.8·cos 30° = 1.041 (hand-computed).
    { id: 'M+030', x: 1.2, y: 1.041, z: 1.2 },
    { id: 'M-030', x: 3, y: 1.041, z: 1.2 },
  ],
  sampleRateHz: 48000,
  limits: { delayMaxMs: 50 },
});

describe('RoomEditorPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RoomEditorPage>;
  const el = () => fixture.nativeElement as HTMLElement;
  const row = (id: string) => el().querySelector(`[data-testid="speaker-${id}"]`) as HTMLElement;
  const coord = (id: string, axis: 'x' | 'y' | 'z') =>
    row(id).querySelector(`[data-testid="coord-${axis}"]`) as HTMLInputElement;
  const marker = (id: string) => el().querySelector(`[data-testid="plan-marker-${id}"]`) as SVGGElement;

  async function render(roomId?: string) {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RoomEditorPage);
    if (roomId) fixture.componentRef.setInput('roomId', roomId);
    fixture.detectChanges();
    if (roomId) http.expectOne(`/v1/rooms/${roomId}`).flush(stored);
    // The layouts the API serves are shared/layouts' own list.
    http.expectOne('/v1/layouts').flush({ data: LAYOUTS, hasMore: false });
    http.expectOne((req) => req.url === '/v1/processor-profiles').flush({ data: [], hasMore: false });
    await settle();
  }

  async function settle() {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  function type(input: HTMLInputElement, value: string) {
    input.value = value;
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
  }

  afterEach(() => http.verify());

  it('loads a stored room into the form, the table and the plan', async () => {
    await render('room_1');
    expect(el().querySelector('h1')?.textContent).toContain('Edit Suite B');
    expect(coord('M+030', 'x').value).toBe('1.2');
    expect(marker('M+030').getAttribute('transform')).toBe('translate(1.2 1.041)');
    expect(row('M+030').textContent).toContain('Within range');
    expect(row('M+030').textContent).toContain('30.0°');
  });

  it('places a layout’s loudspeakers at its nominal angles in one step', async () => {
    await render();
    type(el().querySelector('[data-testid="place-distance"]') as HTMLInputElement, '2');
    (el().querySelector('[data-testid="place-speakers"]') as HTMLButtonElement).click();
    await settle();
    // System J (the default) has 10 loudspeakers and an LFE; +30° at 2 m from (3, 3.5):
    // x = 3 − 2·sin 30° = 2, y = 3.5 − 2·cos 30° = 1.768 (hand-computed).
    const layout = LAYOUTS.find((l) => l.id === 'bs2051-j');
    expect(el().querySelectorAll('[data-testid^="plan-marker-"]')).toHaveLength(
      layout?.channels.length ?? -1,
    );
    expect(coord('M+030', 'x').value).toBe('2');
    expect(coord('M+030', 'y').value).toBe('1.768');
  });

  it('moves a loudspeaker on the plan by keyboard into the same values the table edits, and back', async () => {
    await render('room_1');
    const key = (name: string, shiftKey = false) => {
      marker('M+030').dispatchEvent(
        new KeyboardEvent('keydown', { key: name, shiftKey, bubbles: true, cancelable: true }),
      );
      fixture.detectChanges();
    };
    for (let i = 0; i < 9; i++) key('ArrowRight');
    await settle();
    // 9 × 5 cm to the right: x 1.65 m. From the listener (2.1, 2.6) that is atan(0.45/1.559) = 16.1°
    // off the front at √(0.45² + 1.559²) = 1.62 m (hand-computed): outside system B's permitted 30°.
    expect(PLAN_STEP_M).toBe(0.05);
    expect(coord('M+030', 'x').value).toBe('1.65');
    expect(row('M+030').textContent).toContain('Out of range');
    expect(marker('M+030').querySelector('.ring')).not.toBeNull();
    expect(el().querySelector('[data-testid="plan-announcement"]')?.textContent?.trim()).toBe(
      'M+030: azimuth 16.1°, distance 1.62\u00a0m, outside the permitted range.',
    );
    // And the table moves the mark.
    type(coord('M+030', 'x'), '1.2');
    await settle();
    expect(marker('M+030').getAttribute('transform')).toBe('translate(1.2 1.041)');
    expect(marker('M+030').querySelector('.ring')).toBeNull();
  });

  it('saves the moved position and shows the API’s refusal on the field it names', async () => {
    await render('room_1');
    marker('M-030').dispatchEvent(
      new KeyboardEvent('keydown', { key: 'ArrowDown', shiftKey: true, bubbles: true, cancelable: true }),
    );
    fixture.detectChanges();
    (el().querySelector('[data-testid="save-room"]') as HTMLButtonElement).click();
    const request = http.expectOne('/v1/rooms/room_1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body.loudspeakers[1]).toEqual({ id: 'M-030', x: 3, y: 1.051, z: 1.2 });
    request.flush(
      {
        type: 'https://isochron.dev/problems/validation',
        title: 'Invalid room',
        status: 422,
        errors: [{ pointer: '/body/loudspeakers/1/y', message: 'Too close to the front wall.' }],
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    expect(row('M-030').querySelector('mat-error')?.textContent).toContain('Too close to the front wall.');
    expect(el().querySelector('[data-testid="room-save-problem"]')?.textContent).toContain(
      'Invalid room: see the marked fields.',
    );
  });

  it('creates a new room and opens it', async () => {
    await render();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    type(el().querySelector('[data-testid="room-name"]') as HTMLInputElement, '  Booth 2 ');
    (el().querySelector('[data-testid="place-speakers"]') as HTMLButtonElement).click();
    await settle();
    (el().querySelector('[data-testid="save-room"]') as HTMLButtonElement).click();
    const request = http.expectOne('/v1/rooms');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toMatchObject({ name: 'Booth 2', layout: 'bs2051-j', sampleRateHz: 48000 });
    request.flush({ ...stored, id: 'room_2', name: 'Booth 2' });
    await settle();
    expect(navigate).toHaveBeenCalledWith(['/rooms', 'room_2']);
  });

  it('refuses to send a form with marked fields', async () => {
    await render();
    (el().querySelector('[data-testid="save-room"]') as HTMLButtonElement).click();
    await settle();
    http.expectNone('/v1/rooms');
    expect(el().querySelector('[data-testid="room-save-problem"]')?.textContent).toContain(
      'Some values need attention',
    );
  });
});
