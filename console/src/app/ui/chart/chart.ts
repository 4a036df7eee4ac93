import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  viewChild,
} from '@angular/core';
import type { ChartConfiguration, ChartDataset, TooltipItem } from 'chart.js';
import { ThemeService } from '../../theme/theme.service';
import { Chart } from './chart-registry';
import { ChartSpec } from './chart-spec';
import { frequencyTickLabel } from './frequency-ticks';
import { wrapLabel } from './wrap-label';

interface Palette {
  series: string[];
  text: string;
  muted: string;
  grid: string;
  surface: string;
  font: string;
}

/**
 * Canvas needs concrete colours, but the theme's custom properties hold light-dark() pairs. A hidden
 * probe element resolves each one through the cascade into the rgb() the current scheme picks.
 */
function readPalette(host: HTMLElement): Palette {
  const probe = document.createElement('span');
  probe.style.display = 'none';
  host.appendChild(probe);
  const resolve = (name: string, fallback: string) => {
    probe.style.color = fallback;
    probe.style.color = `var(${name}, ${fallback})`;
    return getComputedStyle(probe).color || fallback;
  };
  const palette: Palette = {
    series: [1, 2, 3, 4, 5, 6].map((n) => resolve(`--iso-series-${n}`, '#15696d')),
    text: resolve('--mat-sys-on-surface', '#191c1c'),
    muted: resolve('--mat-sys-on-surface-variant', '#3f4949'),
    grid: resolve('--mat-sys-outline-variant', '#bec8c9'),
    surface: resolve('--mat-sys-surface-container-highest', '#e0e3e3'),
    font: getComputedStyle(host).fontFamily || 'Roboto, sans-serif',
  };
  probe.remove();
  return palette;
}

function withAlpha(colour: string, alpha: number): string {
  // Resolved colours come back as rgb(r, g, b); anything else is used as is.
  const match = /^rgba?\((\d+),\s*(\d+),\s*(\d+)/.exec(colour);
  return match ? `rgba(${match[1]}, ${match[2]}, ${match[3]}, ${alpha})` : colour;
}

function toConfig(spec: ChartSpec, palette: Palette, labelChars = 32): ChartConfiguration {
  const datasets = spec.series.map((series) => {
    // Colour 0 is the muted outline colour (room walls, reference lines); 1-6 are the series colours.
    const colour =
      series.colour === 0
        ? palette.muted
        : palette.series[(series.colour - 1 + palette.series.length) % palette.series.length];
    const kind = series.kind ?? spec.kind;
    const dataset = {
      type: kind,
      label: series.label,
      data: (series.points ?? series.values ?? []) as never,
      borderColor: colour,
      backgroundColor:
        kind === 'bar'
          ? withAlpha(colour, 0.75)
          : kind === 'scatter' && !series.showLine
            ? colour
            : withAlpha(colour, 0.15),
      borderWidth: kind === 'bar' ? 0 : 2,
      borderDash: series.dashed ? [6, 4] : undefined,
      fill: series.fill ?? false,
      pointRadius: series.pointRadius ?? (kind === 'scatter' ? 5 : 0),
      pointHoverRadius: kind === 'scatter' ? 7 : 3,
      pointStyle: series.pointStyle ?? 'circle',
      showLine: kind === 'scatter' ? (series.showLine ?? false) : undefined,
      tension: 0,
      yAxisID: series.axis === 'right' ? 'right' : 'y',
    };
    return dataset as ChartDataset;
  });
  const hasRight = spec.series.some((series) => series.axis === 'right');
  const axisTitle = (text: string | undefined) => ({
    display: Boolean(text),
    text: text ?? '',
    color: palette.muted,
  });
  const ticks = { color: palette.muted };
  const grid = { color: withAlpha(palette.grid, 0.7) };
  const x =
    spec.xScale === 'log'
      ? {
          type: 'logarithmic' as const,
          title: axisTitle(spec.xTitle),
          grid,
          ticks: {
            ...ticks,
            autoSkip: false,
            maxRotation: 0,
            callback: (value: string | number) => frequencyTickLabel(Number(value)),
          },
        }
      : {
          type: 'category' as const,
          title: axisTitle(spec.xTitle),
          grid,
          ticks: { ...ticks, maxRotation: 0, autoSkipPadding: 12 },
          stacked: spec.stacked,
        };
  const valueAxis = {
    type: 'linear' as const,
    grid,
    ticks: {
      ...ticks,
      precision: spec.kind === 'bar' ? 0 : undefined,
      stepSize: spec.yStep,
    },
    min: spec.yMin,
    max: spec.yMax,
    stacked: spec.stacked,
    beginAtZero: spec.kind === 'bar',
  };
  return {
    type: spec.kind,
    data: { labels: spec.labels, datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      parsing: spec.xScale === 'category' ? undefined : false,
      normalized: true,
      interaction: { mode: 'index', intersect: false },
      color: palette.text,
      font: { family: palette.font },
      plugins: {
        legend: { position: 'bottom', labels: { color: palette.text, boxWidth: 14, boxHeight: 3 } },
        tooltip: {
          enabled: true,
          callbacks: spec.horizontal
            ? { title: (items: TooltipItem<'bar'>[]) => spec.labels?.[items[0]?.dataIndex ?? 0] ?? '' }
            : {},
        },
      },
      indexAxis: spec.horizontal ? 'y' : 'x',
      scales: {
        x: spec.horizontal ? { ...valueAxis, title: axisTitle(spec.xTitle) } : x,
        y: spec.horizontal
          ? {
              ...x,
              title: axisTitle(spec.yTitle),
              ticks: {
                color: palette.text,
                autoSkip: false,
                // Long categories (routes) on a few short lines, never cut at the canvas edge.
                callback: (value: string | number) =>
                  wrapLabel(spec.labels?.[Number(value)] ?? String(value), labelChars),
              },
            }
          : { ...valueAxis, title: axisTitle(spec.yTitle) },
        ...(hasRight
          ? {
              right: {
                type: 'linear',
                position: 'right',
                title: axisTitle(spec.rightTitle),
                grid: { drawOnChartArea: false },
                ticks,
                min: -180,
                max: 180,
              },
            }
          : {}),
      },
    },
  } as ChartConfiguration;
}

/** A chart.js canvas with the console's colours; the summary is what a screen reader hears. */
@Component({
  selector: 'iso-chart',
  template: `<canvas #canvas role="img" [attr.aria-label]="spec().summary"></canvas>`,
  host: {
    '[style.height.px]': 'barsHeightPx()',
  },
  styles: `
    :host {
      display: block;
      position: relative;
      height: 280px;
      min-width: 0;
    }
    canvas {
      max-width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartView {
  readonly spec = input.required<ChartSpec>();

  /**
   * Horizontal bars get height for their categories (wrapped labels take up to three lines), so many
   * routes are not squeezed into the default 280 px; other charts keep the stylesheet's height.
   */
  protected readonly barsHeightPx = computed(() => {
    const spec = this.spec();
    if (!spec.horizontal) return null;
    return Math.max(280, 90 + (spec.labels?.length ?? 0) * 46);
  });

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly canvas = viewChild.required<ElementRef<HTMLCanvasElement>>('canvas');
  private readonly theme = inject(ThemeService);
  private chart?: Chart;

  constructor() {
    effect(() => {
      const spec = this.spec();
      this.theme.revision();
      const canvas = this.canvas().nativeElement;
      // Colours resolve after the theme class changes, so read them at draw time.
      // On a narrow screen long category labels wrap shorter, leaving the bars room.
      const labelChars = this.host.nativeElement.clientWidth < 560 ? 18 : 32;
      const config = toConfig(spec, readPalette(this.host.nativeElement), labelChars);
      this.chart?.destroy();
      this.chart = new Chart(canvas, config);
    });
    inject(DestroyRef).onDestroy(() => this.chart?.destroy());
  }
}
