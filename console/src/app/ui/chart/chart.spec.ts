import { Component, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Chart } from './chart-registry';
import { ChartView } from './chart';
import type { ChartSpec } from './chart-spec';

/**
 * jsdom has no 2D canvas. A context whose every method does nothing (and that records text drawn)
 * lets chart.js build and draw for real, so the configuration it was given can be read back.
 */
function fakeContext(canvas: HTMLCanvasElement, drawn: string[]): CanvasRenderingContext2D {
  const target: Record<string | symbol, unknown> = {
    canvas,
    measureText: (text: string) => ({
      width: text.length * 6,
      actualBoundingBoxAscent: 8,
      actualBoundingBoxDescent: 2,
    }),
    fillText: (text: string) => drawn.push(text),
    getImageData: () => ({ data: new Uint8ClampedArray(4) }),
    createLinearGradient: () => ({ addColorStop: () => undefined }),
    getLineDash: () => [],
  };
  return new Proxy(target, {
    get: (object, key) => (key in object ? object[key] : () => undefined),
    set: (object, key, value) => {
      object[key] = value;
      return true;
    },
  }) as unknown as CanvasRenderingContext2D;
}

@Component({
  selector: 'iso-chart-host',
  imports: [ChartView],
  template: `<div style="width: 600px; height: 300px"><iso-chart [spec]="spec()" /></div>`,
})
class Host {
  readonly spec = signal<ChartSpec>({ kind: 'line', xScale: 'category', series: [], summary: '' });
}

const response: ChartSpec = {
  kind: 'line',
  xScale: 'log',
  xTitle: 'Frequency',
  yTitle: 'Level (dB)',
  rightTitle: 'Phase (°)',
  yMin: -12,
  yMax: 12,
  yStep: 3,
  series: [
    {
      label: 'Measured',
      colour: 1,
      points: [
        { x: 20, y: 0 },
        { x: 20000, y: -3 },
      ],
    },
    {
      label: 'Target',
      colour: 2,
      dashed: true,
      points: [
        { x: 20, y: 0 },
        { x: 20000, y: 0 },
      ],
    },
    {
      label: 'Phase',
      colour: 3,
      axis: 'right',
      points: [
        { x: 20, y: 10 },
        { x: 20000, y: -90 },
      ],
    },
  ],
  summary: 'Measured response within 3 dB of the target from 20 Hz to 20 kHz.',
};

describe('ChartView', () => {
  let fixture: ComponentFixture<Host>;
  const drawn: string[] = [];
  let original: typeof HTMLCanvasElement.prototype.getContext;

  beforeEach(() => {
    drawn.length = 0;
    // Nor does jsdom watch sizes; chart.js only needs to be able to start and stop watching.
    vi.stubGlobal(
      'ResizeObserver',
      class {
        observe(): void {}
        unobserve(): void {}
        disconnect(): void {}
      },
    );
    original = HTMLCanvasElement.prototype.getContext;
    HTMLCanvasElement.prototype.getContext = function (this: HTMLCanvasElement) {
      return fakeContext(this, drawn);
    } as unknown as typeof HTMLCanvasElement.prototype.getContext;
    fixture = TestBed.createComponent(Host);
  });

  afterEach(() => {
    vi.unstubAllGlobals();
    HTMLCanvasElement.prototype.getContext = original;
  });

  function render(spec: ChartSpec) {
    fixture.componentInstance.spec.set(spec);
    fixture.detectChanges();
    const canvas = fixture.nativeElement.querySelector('canvas') as HTMLCanvasElement;
    return { canvas, chart: Chart.getChart(canvas)! };
  }

  it('labels the canvas with the summary for screen readers', () => {
    const { canvas } = render(response);
    expect(canvas.getAttribute('role')).toBe('img');
    expect(canvas.getAttribute('aria-label')).toBe(response.summary);
  });

  it('draws frequency on a log axis labelled in Hz steps, with the level bounds and a phase axis', () => {
    const { chart } = render(response);
    const scales = chart.options.scales as Record<string, Record<string, unknown>>;
    expect(scales['x']['type']).toBe('logarithmic');
    expect((scales['x']['title'] as { text: string }).text).toBe('Frequency');
    expect(scales['y']).toMatchObject({ min: -12, max: 12 });
    expect((scales['y']['ticks'] as { stepSize: number }).stepSize).toBe(3);
    expect(scales['right']).toMatchObject({ min: -180, max: 180, position: 'right' });
    const tick = (scales['x']['ticks'] as { callback: (value: number) => string }).callback;
    expect(tick(1000)).toBe('1k');
    const datasets = chart.data.datasets as unknown as Array<Record<string, unknown>>;
    expect(datasets.map((d) => d['label'])).toEqual(['Measured', 'Target', 'Phase']);
    expect(datasets[1]['borderDash']).toEqual([6, 4]);
    expect(datasets[0]['borderDash']).toBeUndefined();
    expect(datasets[2]['yAxisID']).toBe('right');
  });

  it('gives each series its own colour and the outline series the muted one', () => {
    const { chart } = render({
      ...response,
      series: [
        { label: 'Walls', colour: 0, points: [{ x: 20, y: 0 }] },
        { label: 'A', colour: 1, points: [{ x: 20, y: 0 }] },
        { label: 'B', colour: 2, points: [{ x: 20, y: 0 }] },
      ],
    });
    const colours = (chart.data.datasets as unknown as Array<{ borderColor: string }>).map(
      (d) => d.borderColor,
    );
    expect(new Set(colours).size).toBe(3);
  });

  it('draws bar charts from zero with whole-number ticks, horizontally when asked', () => {
    const { chart } = render({
      kind: 'bar',
      xScale: 'category',
      horizontal: true,
      labels: ['GET /v1/rooms', 'POST /v1/eq/fit'],
      series: [{ label: 'Calls', colour: 1, values: [12, 3] }],
      summary: 'Calls per route.',
    });
    expect(chart.options.indexAxis).toBe('y');
    const scales = chart.options.scales as Record<string, Record<string, unknown>>;
    expect(scales['x']['beginAtZero']).toBe(true);
    expect((scales['x']['ticks'] as { precision: number }).precision).toBe(0);
    expect(scales['y']['type']).toBe('category');
  });

  it('replaces the chart when the spec changes and destroys it with the page', () => {
    const first = render(response);
    const second = render({ ...response, yMin: -24 });
    expect(second.canvas).toBe(first.canvas);
    expect(second.chart).not.toBe(first.chart);
    expect((second.chart.options.scales as Record<string, { min: number }>)['y'].min).toBe(-24);
    fixture.destroy();
    expect(Chart.getChart(second.canvas)).toBeUndefined();
  });
});
