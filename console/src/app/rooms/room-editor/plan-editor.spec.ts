import { Component, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { PLAN_FINE_STEP_M, PLAN_STEP_M } from './plan-moves';
import { PlanEditor, type PlanMove, type PlanSpeaker, type PlanSpeakerGeometry } from './plan-editor';

@Component({
  selector: 'iso-plan-host',
  imports: [PlanEditor],
  template: `<iso-plan-editor
    name="Suite B"
    [dimensions]="dimensions"
    [listener]="listener"
    [speakers]="speakers()"
    [geometry]="geometry()"
    (move)="moved($event)"
  />`,
})
class Host {
  readonly dimensions = { widthM: 6, lengthM: 7 };
  readonly listener = { x: 3, y: 3.5 };
  readonly speakers = signal<PlanSpeaker[]>([
    { id: 'M+030', x: 1.8, y: 1.4 },
    { id: 'U+045', x: 1.5, y: 2 },
    { id: 'LFE1', x: 0.8, y: 0.6 },
  ]);
  readonly geometry = signal<PlanSpeakerGeometry[]>([
    { id: 'M+030', azimuthDeg: 29.74, distanceM: 2.42, withinTolerance: true },
    { id: 'U+045', azimuthDeg: 45, distanceM: 2.3, withinTolerance: false },
  ]);
  readonly moves: PlanMove[] = [];
  /** Does what the room editor does: the move becomes the position the plan is drawn from. */
  moved(move: PlanMove) {
    this.moves.push(move);
    this.speakers.update((list) =>
      list.map((s, i) => (i === move.index ? { ...s, x: move.x, y: move.y } : s)),
    );
  }
}

describe('PlanEditor', () => {
  let fixture: ComponentFixture<Host>;
  const el = () => fixture.nativeElement as HTMLElement;
  const marker = (id: string) => el().querySelector(`[data-testid="plan-marker-${id}"]`) as SVGGElement;
  const announcement = () => el().querySelector('[data-testid="plan-announcement"]')?.textContent?.trim();

  beforeEach(async () => {
    fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    await fixture.whenStable();
  });

  function press(id: string, key: string, shiftKey = false) {
    const event = new KeyboardEvent('keydown', { key, shiftKey, bubbles: true, cancelable: true });
    marker(id).dispatchEvent(event);
    fixture.detectChanges();
    return event;
  }

  it('draws each loudspeaker where the form has it, as a focusable slider named by its channel', () => {
    const left = marker('M+030');
    expect(left.getAttribute('transform')).toBe('translate(1.8 1.4)');
    expect(left.getAttribute('tabindex')).toBe('0');
    expect(left.getAttribute('role')).toBe('slider');
    expect(left.getAttribute('aria-label')).toBe('M+030');
    expect(left.getAttribute('aria-valuetext')).toBe(
      'M+030: azimuth 29.7°, distance 2.42\u00a0m, within the permitted range',
    );
    // The plan's viewBox is the floor with a 0.4 m margin.
    expect(el().querySelector('svg.plan')?.getAttribute('viewBox')).toBe('-0.4 -0.4 6.8 7.8');
    expect(el().textContent).toContain(`${PLAN_STEP_M * 100} cm a press`);
    expect(el().textContent).toContain(`${PLAN_FINE_STEP_M * 100} cm with Shift`);
  });

  it('keeps the shared marks: shape by layer, a ring and a legend entry for one out of range', () => {
    expect(marker('M+030').querySelector('circle.mark')).not.toBeNull();
    expect(marker('U+045').querySelector('polygon.mark')).not.toBeNull();
    expect(marker('U+045').querySelector('.ring')).not.toBeNull();
    expect(marker('M+030').querySelector('.ring')).toBeNull();
    const legend = [...el().querySelectorAll('.legend li')].map((li) => li.textContent?.trim());
    expect(legend).toEqual([
      'Ear level',
      'Overhead',
      'Subwoofer',
      'Outside the permitted range',
      'Listening position',
    ]);
    expect(el().querySelector('svg.plan')?.getAttribute('aria-label')).toContain(
      "Outside the layout's permitted range: U+045.",
    );
  });

  it('moves a focused loudspeaker by the stated step with the arrow keys, finer with Shift', () => {
    expect(press('M+030', 'ArrowRight').defaultPrevented).toBe(true);
    press('M+030', 'ArrowUp');
    press('M+030', 'ArrowDown', true);
    expect(fixture.componentInstance.moves).toEqual([
      { index: 0, x: 1.85, y: 1.4 },
      { index: 0, x: 1.85, y: 1.35 },
      { index: 0, x: 1.85, y: 1.36 },
    ]);
    expect(marker('M+030').getAttribute('transform')).toBe('translate(1.85 1.36)');
    // Other keys (Tab to the next marker) are left alone.
    expect(press('M+030', 'Tab').defaultPrevented).toBe(false);
  });

  it('announces the new direction and distance from the geometry that comes back', () => {
    press('U+045', 'ArrowLeft');
    fixture.componentInstance.geometry.update((list) =>
      list.map((g) => (g.id === 'U+045' ? { ...g, azimuthDeg: 46.2, distanceM: 2.34 } : g)),
    );
    fixture.detectChanges();
    expect(announcement()).toBe('U+045: azimuth 46.2°, distance 2.34\u00a0m, outside the permitted range.');
    marker('U+045').dispatchEvent(new FocusEvent('blur'));
    fixture.detectChanges();
    expect(announcement()).toBe('');
  });

  it('starts each press where the last one left off, even before the new position is drawn', () => {
    const target = marker('M+030');
    for (const shiftKey of [false, false, true]) {
      target.dispatchEvent(
        new KeyboardEvent('keydown', { key: 'ArrowLeft', shiftKey, bubbles: true, cancelable: true }),
      );
    }
    expect(fixture.componentInstance.moves.map((m) => m.x)).toEqual([1.75, 1.7, 1.69]);
    fixture.detectChanges();
    press('M+030', 'ArrowLeft');
    expect(fixture.componentInstance.moves.at(-1)).toEqual({ index: 0, x: 1.64, y: 1.4 });
  });

  it('stops at the walls', () => {
    press('LFE1', 'ArrowLeft');
    fixture.componentInstance.speakers.update((list) =>
      list.map((s) => (s.id === 'LFE1' ? { ...s, x: 0.02 } : s)),
    );
    fixture.detectChanges();
    press('LFE1', 'ArrowLeft');
    press('LFE1', 'ArrowLeft');
    expect(fixture.componentInstance.moves.map((m) => m.x)).toEqual([0.75, 0]);
  });

  it('follows a drag through the drawing’s box into room metres, and announces where it ended', () => {
    const svg = el().querySelector('svg.plan') as SVGSVGElement;
    // jsdom lays nothing out: 68 × 78 px at (10, 20) is 10 px per metre of the 6.8 × 7.8 m viewBox.
    svg.getBoundingClientRect = () => ({ left: 10, top: 20, width: 68, height: 78 }) as DOMRect;
    const target = marker('M+030');
    const pointer = (type: string, clientX: number, clientY: number) =>
      target.dispatchEvent(
        Object.assign(new MouseEvent(type, { clientX, clientY, bubbles: true, cancelable: true }), {
          pointerId: 1,
        }),
      );
    pointer('pointerdown', 10 + 22, 20 + 18);
    // Room point = (client − box origin) / 10 px − 0.4 m margin: (32 − 10)/10 − 0.4 = 1.8 m.
    pointer('pointermove', 10 + 30, 20 + 25);
    pointer('pointermove', 10 + 200, 20 + 25);
    fixture.detectChanges();
    expect(announcement()).toBe('');
    pointer('pointerup', 10 + 200, 20 + 25);
    fixture.detectChanges();
    expect(fixture.componentInstance.moves).toEqual([
      { index: 0, x: 2.6, y: 2.1 },
      // Dragged past the right wall: kept on it.
      { index: 0, x: 6, y: 2.1 },
    ]);
    expect(announcement()).toMatch(/^M\+030: azimuth/);
    // A move without a grab first does nothing.
    pointer('pointermove', 10 + 40, 20 + 40);
    expect(fixture.componentInstance.moves).toHaveLength(2);
  });
});

@Component({
  selector: 'iso-plan-view-host',
  imports: [PlanEditor],
  template: `<iso-plan-editor
    readOnly
    name="Stage 3"
    [dimensions]="{ widthM: 6.1, lengthM: 7.4 }"
    [listener]="{ x: 3.05, y: 3.3 }"
    [speakers]="speakers"
    [geometry]="geometry"
    (move)="moves.push($event)"
  />`,
})
class ViewHost {
  readonly speakers: PlanSpeaker[] = [
    { id: 'M+030', x: 1.49, y: 0.6 },
    { id: 'M+000', x: 3.05, y: 0.55 },
    { id: 'LFE1', x: 0.9, y: 0.5 },
  ];
  readonly geometry: PlanSpeakerGeometry[] = [
    { id: 'M+030', azimuthDeg: 30, distanceM: 3, withinTolerance: true },
    { id: 'LFE1', azimuthDeg: 40, distanceM: 3.3, withinTolerance: false },
  ];
  readonly moves: PlanMove[] = [];
}

describe('PlanEditor, read-only (the room page’s plan)', () => {
  let fixture: ComponentFixture<ViewHost>;
  const el = () => fixture.nativeElement as HTMLElement;
  const marker = (id: string) => el().querySelector(`[data-testid="plan-marker-${id}"]`) as SVGGElement;

  beforeEach(async () => {
    fixture = TestBed.createComponent(ViewHost);
    fixture.detectChanges();
    await fixture.whenStable();
  });

  it('draws the same plan with nothing to move: images named and titled by channel and position', () => {
    const svg = el().querySelector('svg.plan') as SVGSVGElement;
    expect(svg.getAttribute('data-testid')).toBe('plan-view');
    expect(svg.getAttribute('aria-label')).toContain(
      'Floor plan of Stage 3 seen from above, front wall at the top: 6.10 m wide and 7.40 m long, 3 loudspeakers',
    );
    expect(svg.getAttribute('aria-label')).toContain("Outside the layout's permitted range: LFE1.");
    const left = marker('M+030');
    expect(left.getAttribute('role')).toBe('img');
    expect(left.hasAttribute('tabindex')).toBe(false);
    expect(left.hasAttribute('aria-valuetext')).toBe(false);
    const where = 'M+030: azimuth 30.0°, distance 3.00\u00a0m, within the permitted range';
    expect(left.getAttribute('aria-label')).toBe(where);
    expect(left.querySelector('title')?.textContent).toBe(where);
    expect(marker('LFE1').querySelector('.ring')).not.toBeNull();
    // No instructions, no live region, and keys move nothing.
    expect(el().textContent).not.toContain('arrow keys');
    expect(el().querySelector('[data-testid="plan-announcement"]')).toBeNull();
    left.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowUp', bubbles: true, cancelable: true }));
    left.dispatchEvent(new PointerEvent('pointerdown', { button: 0, bubbles: true }));
    expect(fixture.componentInstance.moves).toEqual([]);
  });

  it('moves the subwoofer’s label off the main beside it, with every label apart', () => {
    const boxes = ['M+030', 'M+000', 'LFE1'].map((id) => {
      const label = marker(id).querySelector('text.label') as SVGTextElement;
      return { id, x: Number(label.getAttribute('x')), y: Number(label.getAttribute('y')) };
    });
    // M+030 keeps its place above; LFE1 (0.59 m to its left) does not sit at the same height above it.
    expect(boxes[0]).toMatchObject({ x: 0 });
    expect(boxes[0].y).toBeLessThan(0);
    expect(boxes[2].x !== 0 || boxes[2].y > 0).toBe(true);
  });
});
