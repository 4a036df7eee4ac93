import {
  ChangeDetectionStrategy,
  Component,
  booleanAttribute,
  ElementRef,
  computed,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import {
  OUT_OF_RANGE_MARK,
  SPEAKER_MARKS,
  speakerMark,
  type SpeakerShape,
} from '../../../../../shared/geometry/speaker-marks';
import type { components } from '../../../../../shared/contract/api-types';
import { formatQuantity } from '../../format/format';
import { topViewSummary } from '../top-view';
import { labelBox, placeLabels, type LabelPlace } from './plan-labels';
import {
  PLAN_FINE_STEP_M,
  PLAN_STEP_M,
  clientToRoom,
  nudged,
  onFloor,
  type PlanBox,
  type PlanPoint,
} from './plan-moves';

/** The margin round the walls on the plan, in metres (room for labels and rings at a wall). */
const MARGIN_M = 0.4;

export interface PlanSpeaker {
  id: string;
  x: number;
  y: number;
}

/** What the plan shows of a loudspeaker's geometry (the contract's `SpeakerGeometry`, as the room answers it). */
export type PlanSpeakerGeometry = Pick<
  components['schemas']['SpeakerGeometry'],
  'id' | 'distanceM' | 'azimuthDeg' | 'withinTolerance'
>;

/** A loudspeaker moved on the plan: its row in the table and its new floor position in metres. */
export interface PlanMove {
  index: number;
  x: number;
  y: number;
}

interface Marker {
  index: number;
  id: string;
  x: number;
  y: number;
  shape: SpeakerShape;
  colour: number;
  outside: boolean;
  valueText: string;
  azimuthDeg: number | null;
  label: LabelPlace;
}

/** Where a loudspeaker points from the listener, in words, as the table shows the numbers. */
function whereText(id: string, geometry: PlanSpeakerGeometry | undefined): string {
  if (!geometry) return `${id}: position not checked yet`;
  const range =
    geometry.withinTolerance === true
      ? 'within the permitted range'
      : geometry.withinTolerance === false
        ? 'outside the permitted range'
        : 'no permitted range in this layout';
  return (
    `${id}: azimuth ${formatQuantity(geometry.azimuthDeg, '°', 1)}, ` +
    `distance ${formatQuantity(geometry.distanceM, 'm')}, ${range}`
  );
}

/**
 * The room seen from above, where loudspeakers are moved by dragging them (mouse, pen or touch) or, once
 * focused, with the arrow keys ({@link PLAN_STEP_M} a press, {@link PLAN_FINE_STEP_M} with Shift). It
 * draws the same marks as the printed report (shared/geometry/speaker-marks) and changes nothing
 * itself: every move is an output the editor writes into the same form values the table edits, and the
 * positions, directions and range checks come back in through the inputs. After a move the new azimuth
 * and distance are announced to screen readers.
 *
 * With `readOnly` it is the room page's plan: the same drawing, nothing to move, each loudspeaker an
 * image named by its channel, direction, distance and range check (and a tooltip saying the same).
 */
@Component({
  selector: 'iso-plan-editor',
  templateUrl: './plan-editor.html',
  styleUrl: './plan-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanEditor {
  readonly name = input('New room');
  readonly dimensions = input.required<{ widthM: number; lengthM: number }>();
  readonly listener = input.required<PlanPoint>();
  readonly speakers = input.required<readonly PlanSpeaker[]>();
  readonly geometry = input<readonly PlanSpeakerGeometry[]>([]);
  /** Draw only: no dragging, no keys, no instructions. */
  readonly readOnly = input(false, { transform: booleanAttribute });

  readonly move = output<PlanMove>();

  protected readonly stepCm = Math.round(PLAN_STEP_M * 100);
  protected readonly fineStepCm = Math.round(PLAN_FINE_STEP_M * 100);
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');

  protected readonly box = computed<PlanBox>(() => {
    const { widthM, lengthM } = this.dimensions();
    return { minX: -MARGIN_M, minY: -MARGIN_M, width: widthM + 2 * MARGIN_M, height: lengthM + 2 * MARGIN_M };
  });
  protected readonly viewBox = computed(() => {
    const b = this.box();
    return `${b.minX} ${b.minY} ${b.width} ${b.height}`;
  });
  /** The size of a mark in metres: marks stay the same size on screen whatever the room's size. */
  protected readonly unit = computed(() => Math.max(this.box().width, this.box().height) / 60);

  /** Label size, metres (as the marks, the same on screen whatever the room's size). */
  protected readonly labelSizeM = computed(() => this.unit() * 1.8);

  /** Where each loudspeaker's label goes, clear of every other label, mark and the listener. */
  private readonly labels = computed<LabelPlace[]>(() => {
    const u = this.unit();
    const b = this.box();
    const listener = this.listener();
    const obstacles = [
      // The listener's cross and its name below it (drawn at a baseline 3.6 units down).
      {
        left: listener.x - 1.4 * u,
        top: listener.y - 1.4 * u,
        right: listener.x + 1.4 * u,
        bottom: listener.y + 1.4 * u,
      },
      labelBox('Listener', listener.x, listener.y + 3 * u, this.labelSizeM()),
      labelBox('Front wall', this.dimensions().widthM / 2, -1.9 * u, u * 2),
    ];
    return placeLabels(
      this.speakers().map((s) => ({ x: s.x, y: s.y, text: s.id })),
      {
        fontSizeM: this.labelSizeM(),
        // The diamond, the largest shape, reaches 1.2 units; the range ring 1.9.
        markRadiusM: 1.2 * u,
        labelGapM: 2 * u,
        bounds: { left: b.minX, top: b.minY, right: b.minX + b.width, bottom: b.minY + b.height },
        obstacles,
      },
    );
  });

  protected readonly markers = computed<Marker[]>(() => {
    const geometry = new Map(this.geometry().map((g) => [g.id, g]));
    const labels = this.labels();
    return this.speakers().map((speaker, index) => {
      const mark = speakerMark(speaker.id);
      const g = geometry.get(speaker.id);
      return {
        label: labels[index],
        index,
        id: speaker.id,
        x: speaker.x,
        y: speaker.y,
        shape: mark.shape,
        colour: mark.seriesColour,
        outside: g?.withinTolerance === false,
        valueText: whereText(speaker.id, g),
        azimuthDeg: g ? Math.round(g.azimuthDeg * 10) / 10 : null,
      };
    });
  });

  protected readonly legend = computed(() => {
    const kinds = new Set(this.speakers().map((s) => speakerMark(s.id).kind));
    return SPEAKER_MARKS.filter((mark) => kinds.has(mark.kind));
  });
  protected readonly anyOutside = computed(() => this.markers().some((m) => m.outside));
  protected readonly outOfRangeMark = OUT_OF_RANGE_MARK;

  protected readonly summary = computed(() => {
    const outside = new Set(
      this.markers()
        .filter((m) => m.outside)
        .map((m) => m.id),
    );
    return topViewSummary(
      {
        name: this.name(),
        dimensions: { ...this.dimensions(), heightM: 0 },
        listener: { ...this.listener(), z: 0 },
        loudspeakers: this.speakers().map((s) => ({ ...s, z: 0 })),
      },
      outside,
    );
  });

  /** The row being dragged, or null. */
  protected readonly dragging = signal<number | null>(null);
  private readonly announceIndex = signal<number | null>(null);
  /** Read out after a move ends: the loudspeaker's new direction and distance, and its range check. */
  protected readonly announcement = computed(() => {
    const index = this.announceIndex();
    if (index === null || this.dragging() !== null) return '';
    const marker = this.markers()[index];
    return marker ? `${marker.valueText}.` : '';
  });

  /** The outline of a mark's shape, centred on 0,0, `r` metres from the centre to a corner. */
  protected shapePoints(shape: SpeakerShape, r: number): string {
    const corners: Array<[number, number]> =
      shape === 'triangle'
        ? [
            [0, -r * 1.15],
            [r, r * 0.75],
            [-r, r * 0.75],
          ]
        : shape === 'rectRot'
          ? [
              [0, -r * 1.2],
              [r * 1.2, 0],
              [0, r * 1.2],
              [-r * 1.2, 0],
            ]
          : [
              [-r, -r],
              [r, -r],
              [r, r],
              [-r, r],
            ];
    return corners.map(([x, y]) => `${x},${y}`).join(' ');
  }

  protected grab(event: PointerEvent, index: number): void {
    if (this.readOnly() || event.button !== 0) return;
    event.preventDefault();
    const target = event.currentTarget as SVGGElement;
    target.focus();
    target.setPointerCapture?.(event.pointerId);
    this.dragging.set(index);
    this.announceIndex.set(null);
  }

  protected drag(event: PointerEvent, index: number): void {
    if (this.dragging() !== index) return;
    event.preventDefault();
    const point = clientToRoom(
      this.svg().nativeElement.getBoundingClientRect(),
      this.box(),
      event.clientX,
      event.clientY,
    );
    this.emitMove(index, onFloor(point, this.dimensions()));
  }

  protected drop(event: PointerEvent): void {
    const index = this.dragging();
    if (index === null) return;
    (event.currentTarget as SVGGElement).releasePointerCapture?.(event.pointerId);
    this.dragging.set(null);
    this.announceIndex.set(index);
  }

  protected key(event: KeyboardEvent, index: number): void {
    if (this.readOnly()) return;
    const speaker = this.current(index);
    if (!speaker) return;
    const next = nudged(speaker, event.key, event.shiftKey, this.dimensions());
    if (!next) return;
    event.preventDefault();
    this.emitMove(index, next);
    this.announceIndex.set(index);
  }

  protected blurred(index: number): void {
    if (this.announceIndex() === index) this.announceIndex.set(null);
  }

  /**
   * Moves sent but not yet drawn, with the input they were made on: key presses can come faster than
   * the editor's positions come back in, and each press must start where the last one left off.
   */
  private sent: { base: readonly PlanSpeaker[]; points: Map<number, PlanPoint> } | null = null;

  /** Where a loudspeaker is now: the last move sent for it, until the inputs catch up. */
  private current(index: number): PlanPoint | undefined {
    if (this.sent && this.sent.base !== this.speakers()) this.sent = null;
    return this.sent?.points.get(index) ?? this.speakers()[index];
  }

  private emitMove(index: number, point: PlanPoint): void {
    const speaker = this.current(index);
    if (speaker && speaker.x === point.x && speaker.y === point.y) return;
    this.sent ??= { base: this.speakers(), points: new Map() };
    this.sent.points.set(index, point);
    this.move.emit({ index, ...point });
  }
}
