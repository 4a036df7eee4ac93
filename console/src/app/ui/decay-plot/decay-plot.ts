import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import {
  type DecayPlotData,
  cellText,
  cssColour,
  decaySummary,
  frequencyTicks,
  heatMapImage,
  levelColour,
  levelTicks,
  sliceLines,
  timeTicks,
} from './decay-scale';

export type DecayKind = 'waterfall' | 'spectrogram';
export type DecayDrawing = 'heatMap' | 'slices';

/** What carries decay plots: an impulse-response or sweep analysis with `waterfall` and/or `spectrogram`. */
export interface DecaySource {
  waterfall?: DecayPlotData;
  spectrogram?: DecayPlotData;
}

const KIND_WORDS: Record<DecayKind, string> = {
  waterfall: 'Cumulative spectral decay (waterfall)',
  spectrogram: 'Spectrogram',
};

/** Margins around the plot area, px: left for the time or level axis, right for the scale bar. */
const MARGIN = { left: 58, right: 84, top: 14, bottom: 48 };
/** Stacked slices: how far the last slice stands behind the first, at most, px (less on a narrow plot). */
const DEPTH = { x: 70, y: 90 };
/** Room a frequency label needs: about 7 px per character and a gap. */
const LABEL_PX_PER_CHAR = 7;
const LABEL_GAP_PX = 8;

let nextId = 0;

/**
 * Decay over frequency drawn two ways: a heat map (frequency across, time after the arrival down, level
 * as colour on the scale of `decay-scale.ts` with its dB bar) and stacked slices (one level line per time
 * slice, later slices behind). SVG sized to its box, so text stays at its real size on a phone. The
 * arrow keys (or the pointer) move a cursor over the cells and the reading is announced; a text summary
 * says what the plot shows.
 */
@Component({
  selector: 'iso-decay-plot',
  imports: [MatButtonToggleModule, MatFormFieldModule, MatSelectModule],
  templateUrl: './decay-plot.html',
  styleUrl: './decay-plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecayPlotView {
  readonly source = input.required<DecaySource>();
  /** What was measured, e.g. "M+030 at MLP". */
  readonly label = input('');

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly id = `decay-${nextId++}`;

  protected readonly width = signal(640);
  protected readonly chosenKind = signal<DecayKind | null>(null);
  protected readonly drawing = signal<DecayDrawing>('heatMap');
  protected readonly rangeDb = signal(60);
  protected readonly rangeChoices = [40, 60, 80, 100];
  /** The cursor: slice and bin, or null before any is chosen. */
  protected readonly cursor = signal<{ slice: number; bin: number } | null>(null);

  protected readonly kinds = computed(() =>
    (['waterfall', 'spectrogram'] as const).filter((k) => Boolean(this.source()[k]?.timesMs?.length)),
  );
  protected readonly kind = computed((): DecayKind | null => {
    const chosen = this.chosenKind();
    const kinds = this.kinds();
    return chosen && kinds.includes(chosen) ? chosen : (kinds[0] ?? null);
  });
  protected readonly plot = computed(() => {
    const kind = this.kind();
    return kind ? (this.source()[kind] ?? null) : null;
  });
  protected readonly kindWords = KIND_WORDS;

  protected readonly title = computed(() => {
    const kind = this.kind();
    if (!kind) return '';
    const label = this.label();
    return `${KIND_WORDS[kind]}${label ? ` of ${label}` : ''}, ${this.drawing() === 'heatMap' ? 'heat map' : 'stacked slices'}`;
  });
  protected readonly summary = computed(() => {
    const plot = this.plot();
    const kind = this.kind();
    if (!plot || !kind) return '';
    const label = this.label();
    return decaySummary(plot, `${KIND_WORDS[kind]}${label ? ` of ${label}` : ''}`);
  });

  /** Plot area and the whole drawing, px. */
  protected readonly box = computed(() => {
    const width = this.width();
    const plotWidth = Math.max(120, width - MARGIN.left - MARGIN.right);
    const plotHeight = Math.round(Math.min(340, Math.max(200, plotWidth * 0.5)));
    return {
      width: MARGIN.left + plotWidth + MARGIN.right,
      height: MARGIN.top + plotHeight + MARGIN.bottom,
      left: MARGIN.left,
      top: MARGIN.top,
      plotWidth,
      plotHeight,
    };
  });

  /** The stacked slices' depth offset, px: a fifth of the width and a third of the height at most. */
  protected readonly depth = computed(() => {
    const box = this.box();
    return {
      x: Math.round(Math.min(DEPTH.x, box.plotWidth * 0.2)),
      y: Math.round(Math.min(DEPTH.y, box.plotHeight * 0.3)),
    };
  });

  protected readonly image = computed(() => {
    const plot = this.plot();
    return plot ? heatMapImage(plot, this.rangeDb()) : '';
  });
  /** The image's placement: each pixel centred on its cell, so the ticks fall on the cell centres. */
  protected readonly imageBox = computed(() => {
    const plot = this.plot();
    const box = this.box();
    if (!plot) return null;
    const cellWidth = box.plotWidth / Math.max(1, plot.frequenciesHz.length - 1);
    const cellHeight = box.plotHeight / Math.max(1, plot.timesMs.length - 1);
    return {
      x: box.left - cellWidth / 2,
      y: box.top - cellHeight / 2,
      width: box.plotWidth + cellWidth,
      height: box.plotHeight + cellHeight,
      cellWidth,
      cellHeight,
    };
  });

  protected readonly xTicks = computed(() => {
    const plot = this.plot();
    if (!plot) return [];
    const hz = plot.frequenciesHz;
    const faceWidth =
      this.drawing() === 'slices' ? this.box().plotWidth - this.depth().x : this.box().plotWidth;
    // Labels that would touch the one before are left out (a phone's axis keeps every other step or so).
    let lastRight = -Infinity;
    return frequencyTicks(hz[0], hz[hz.length - 1])
      .map((t) => ({ ...t, x: this.box().left + t.at * faceWidth }))
      .filter((t) => {
        const half = (t.label.length * LABEL_PX_PER_CHAR) / 2;
        if (t.x - half < lastRight + LABEL_GAP_PX) return false;
        lastRight = t.x + half;
        return true;
      });
  });
  protected readonly timeAxis = computed(() => {
    const plot = this.plot();
    if (!plot) return [];
    const times = plot.timesMs;
    const box = this.box();
    return timeTicks(times[0], times[times.length - 1]).map((t) => ({
      ...t,
      y: box.top + t.at * box.plotHeight,
    }));
  });
  protected readonly levelAxis = computed(() => {
    const box = this.box();
    const depth = this.depth();
    const faceHeight = box.plotHeight - depth.y;
    return levelTicks(this.rangeDb()).map((t) => ({
      ...t,
      y: box.top + depth.y + t.at * faceHeight,
    }));
  });
  /** The scale bar: its ticks and a gradient of 16 stops. */
  protected readonly scaleTicks = computed(() => {
    const box = this.box();
    return levelTicks(this.rangeDb()).map((t) => ({ ...t, y: box.top + t.at * box.plotHeight }));
  });
  protected readonly scaleStops = computed(() => {
    const range = this.rangeDb();
    return Array.from({ length: 16 }, (_, i) => ({
      offset: `${((i / 15) * 100).toFixed(1)}%`,
      colour: cssColour(levelColour(-(i / 15) * range, range)),
    }));
  });
  protected readonly slices = computed(() => {
    const plot = this.plot();
    const box = this.box();
    if (!plot) return [];
    return sliceLines(plot, this.rangeDb(), {
      width: box.plotWidth,
      height: box.plotHeight,
      depthX: this.depth().x,
      depthY: this.depth().y,
    });
  });
  /**
   * The time axis of the stacked slices: the diagonal from the first slice's base to the last's, labelled
   * at both ends, with its title along it.
   */
  protected readonly depthAxis = computed(() => {
    const plot = this.plot();
    const box = this.box();
    const depth = this.depth();
    if (!plot) return null;
    const n = plot.timesMs.length;
    const x1 = box.left + box.plotWidth - depth.x;
    const y1 = box.top + box.plotHeight;
    const x2 = box.left + box.plotWidth;
    const y2 = box.top + box.plotHeight - depth.y;
    const angle = (Math.atan2(y2 - y1, x2 - x1) * 180) / Math.PI;
    const length = Math.hypot(x2 - x1, y2 - y1) || 1;
    const normal = { x: (y1 - y2) / length, y: (x2 - x1) / length };
    return {
      x1,
      y1,
      x2,
      y2,
      first: `${Math.round(plot.timesMs[0])} ms`,
      last: `${Math.round(plot.timesMs[n - 1])} ms`,
      // The title runs along the diagonal, its baseline 16 px out on the lower-right side, clear of the line;
      // a diagonal too short for it (a phone) keeps only the labelled ends, which carry the unit.
      title:
        length < 90
          ? null
          : `translate(${((x1 + x2) / 2 + 16 * normal.x).toFixed(1)} ${((y1 + y2) / 2 + 16 * normal.y).toFixed(1)}) rotate(${angle.toFixed(1)})`,
    };
  });

  protected readonly readout = computed(() => {
    const plot = this.plot();
    const at = this.cursor();
    if (!plot || !at) return 'Arrow keys or the pointer read a level.';
    return cellText(plot, at.slice, at.bin);
  });
  /** The cursor cell on the heat map, or the point on its slice. */
  protected readonly cursorMark = computed(() => {
    const plot = this.plot();
    const at = this.cursor();
    const cell = this.imageBox();
    if (!plot || !at || !cell) return null;
    const box = this.box();
    if (this.drawing() === 'heatMap') {
      return {
        kind: 'cell' as const,
        x: box.left + at.bin * cell.cellWidth - cell.cellWidth / 2,
        y: box.top + at.slice * cell.cellHeight - cell.cellHeight / 2,
        width: cell.cellWidth,
        height: cell.cellHeight,
      };
    }
    const n = plot.timesMs.length;
    const depth = n > 1 ? at.slice / (n - 1) : 0;
    const offset = this.depth();
    const faceWidth = box.plotWidth - offset.x;
    const faceHeight = box.plotHeight - offset.y;
    const range = this.rangeDb();
    const level = Math.max(-range, Math.min(0, plot.levelDb[at.slice]?.[at.bin] ?? -range));
    return {
      kind: 'point' as const,
      x: box.left + depth * offset.x + (at.bin / Math.max(1, plot.frequenciesHz.length - 1)) * faceWidth,
      y: box.top + box.plotHeight - depth * offset.y - ((level + range) / range) * faceHeight,
    };
  });

  constructor() {
    const element = this.host.nativeElement;
    if (typeof ResizeObserver !== 'undefined') {
      const observer = new ResizeObserver((entries) => {
        const width = Math.floor(entries[0]?.contentRect.width ?? 0);
        if (width > 0 && width !== this.width()) this.width.set(width);
      });
      observer.observe(element);
      inject(DestroyRef).onDestroy(() => observer.disconnect());
    }
  }

  protected chooseKind(kind: DecayKind): void {
    this.chosenKind.set(kind);
  }

  protected chooseDrawing(drawing: DecayDrawing): void {
    this.drawing.set(drawing);
  }

  /** Arrow keys move the cursor (left/right: frequency; up/down: time), Home/End jump to the ends. */
  protected onKey(event: KeyboardEvent): void {
    const plot = this.plot();
    if (!plot) return;
    const bins = plot.frequenciesHz.length;
    const slices = plot.timesMs.length;
    const at = this.cursor() ?? { slice: 0, bin: 0 };
    const step = event.shiftKey ? 8 : 1;
    const moves: Record<string, () => { slice: number; bin: number }> = {
      ArrowRight: () => ({ ...at, bin: Math.min(bins - 1, at.bin + step) }),
      ArrowLeft: () => ({ ...at, bin: Math.max(0, at.bin - step) }),
      ArrowDown: () => ({ ...at, slice: Math.min(slices - 1, at.slice + step) }),
      ArrowUp: () => ({ ...at, slice: Math.max(0, at.slice - step) }),
      Home: () => ({ ...at, bin: 0 }),
      End: () => ({ ...at, bin: bins - 1 }),
    };
    const move = moves[event.key];
    if (!move) return;
    event.preventDefault();
    this.cursor.set(this.cursor() ? move() : at);
  }

  /** The pointer over the heat map picks the cell under it; over the slices, the frequency on the front slice. */
  protected onPointer(event: PointerEvent): void {
    const plot = this.plot();
    const svg = event.currentTarget as SVGElement | null;
    if (!plot || !svg) return;
    const rect = svg.getBoundingClientRect();
    const box = this.box();
    const x = event.clientX - rect.left - box.left;
    const y = event.clientY - rect.top - box.top;
    const bins = plot.frequenciesHz.length;
    const slices = plot.timesMs.length;
    const faceWidth = this.drawing() === 'slices' ? box.plotWidth - this.depth().x : box.plotWidth;
    // Half a cell of slack around the plot area; anything further out is not over the plot.
    const slackX = faceWidth / Math.max(1, bins - 1) / 2;
    if (x < -slackX || x > faceWidth + slackX || y < 0 || y > box.plotHeight) return;
    const bin = Math.round((x / faceWidth) * (bins - 1));
    const slice =
      this.drawing() === 'slices'
        ? (this.cursor()?.slice ?? 0)
        : Math.round((y / box.plotHeight) * (slices - 1));
    this.cursor.set({
      slice: Math.min(slices - 1, Math.max(0, slice)),
      bin: Math.min(bins - 1, Math.max(0, bin)),
    });
  }
}
