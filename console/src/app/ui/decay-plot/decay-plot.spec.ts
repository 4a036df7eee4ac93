import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { DecayPlotView, type DecaySource } from './decay-plot';
import { type DecayPlotData, heatMapImage } from './decay-scale';

const plot = (name: string, first: number): DecayPlotData => ({
  window: { name, lengthMs: 50, taperMs: 25 },
  timesMs: [0, 100, 200, 300],
  frequenciesHz: [20, 200, 2000, 20000],
  levelDb: [
    [first, -3, -6, -20],
    [-6, -12, -30, -60],
    [-9, -20, -54, -90],
    [-12, -30, -70, -150],
  ],
  binWidthOctaves: 3.3,
  resolutionHz: 20,
});

@Component({
  selector: 'iso-decay-host',
  imports: [DecayPlotView],
  template: `<iso-decay-plot [source]="source()" label="M+030 at MLP" />`,
})
class Host {
  readonly source = signal<DecaySource>({ waterfall: plot('rectangular start, half-Hann end', 0) });
}

async function setUp(source?: DecaySource) {
  const fixture = TestBed.createComponent(Host);
  if (source) fixture.componentInstance.source.set(source);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const element = fixture.nativeElement as HTMLElement;
  const query = (testId: string) => element.querySelector(`[data-testid="${testId}"]`);
  return { fixture, loader, element, query };
}

describe('DecayPlotView', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  it('draws the heat map with labelled axes, a dB scale bar and a summary tied to the drawing', async () => {
    const { query, element } = await setUp();
    const svg = query('decay-svg') as SVGSVGElement;
    expect(svg.getAttribute('role')).toBe('img');
    const [titleId, descId] = svg.getAttribute('aria-labelledby')!.split(' ');
    expect(element.querySelector(`#${titleId}`)!.textContent).toBe(
      'Cumulative spectral decay (waterfall) of M+030 at MLP, heat map',
    );
    expect(element.querySelector(`#${descId}`)!.textContent).toContain(
      '4 slices from 0\u00a0ms to 300\u00a0ms',
    );
    expect(query('decay-heat-map')!.getAttribute('href')).toBe(heatMapImage(plot('x', 0), 60));
    const texts = Array.from(svg.querySelectorAll('text'), (t) => t.textContent!.trim());
    expect(texts).toEqual(
      expect.arrayContaining([
        'Time after the arrival (ms)',
        'Level (dB re top)',
        'Frequency (Hz)',
        '20k',
        '−60',
        '300',
      ]),
    );
    expect(query('decay-scale-bar')).not.toBeNull();
    expect(query('decay-summary')!.textContent).toContain(
      'Longest ringing near 20.0\u00a0Hz: it falls 12.0\u00a0dB by 300\u00a0ms',
    );
    // Only one plot: no choice between plots is offered.
    expect(query('decay-kind')).toBeNull();
  });

  it('moves a cursor with the arrow keys and reads the level out', async () => {
    const { query, fixture } = await setUp();
    const area = query('decay-plot-area') as HTMLElement;
    expect(area.tabIndex).toBe(0);
    const readout = query('decay-readout')!;
    expect(readout.getAttribute('aria-live')).toBe('polite');
    const key = async (name: string, shiftKey = false) => {
      area.dispatchEvent(
        new KeyboardEvent('keydown', { key: name, shiftKey, bubbles: true, cancelable: true }),
      );
      await fixture.whenStable();
    };
    await key('ArrowRight');
    expect(readout.textContent).toBe('20.0\u00a0Hz at 0.0\u00a0ms: 0.0\u00a0dB');
    await key('ArrowRight');
    await key('ArrowDown');
    expect(readout.textContent).toBe('200\u00a0Hz at 100.0\u00a0ms: \u221212.0\u00a0dB');
    await key('End');
    await key('ArrowDown', true);
    expect(readout.textContent).toBe('20.00\u00a0kHz at 300.0\u00a0ms: \u2212150.0\u00a0dB');
    await key('Home');
    await key('ArrowUp');
    await key('ArrowLeft');
    expect(readout.textContent).toBe('20.0\u00a0Hz at 200.0\u00a0ms: \u22129.0\u00a0dB');
    expect(query('decay-svg')!.querySelector('rect.cursor')).not.toBeNull();
    // Other keys pass through.
    const tab = new KeyboardEvent('keydown', { key: 'Tab', bubbles: true, cancelable: true });
    area.dispatchEvent(tab);
    expect(tab.defaultPrevented).toBe(false);
  });

  it('switches between waterfall and spectrogram, heat map and slices, and the range shown', async () => {
    const { loader, query, fixture } = await setUp({
      waterfall: plot('rectangular start, half-Hann end', 0),
      spectrogram: plot('hann', -1),
    });
    const kinds = await loader.getAllHarnesses(MatButtonToggleHarness);
    expect(await Promise.all(kinds.map((k) => k.getText()))).toEqual([
      'Waterfall',
      'Spectrogram',
      'Heat map',
      'Slices',
    ]);
    await kinds[1].check();
    expect(query('decay-summary')!.textContent).toMatch(/^Spectrogram of M\+030 at MLP/);
    await kinds[3].check();
    await fixture.whenStable();
    const svg = query('decay-svg')!;
    expect(svg.getAttribute('data-drawing')).toBe('slices');
    expect(query('decay-heat-map')).toBeNull();
    // One line per slice, the first slice drawn last (in front) and marked.
    const lines = svg.querySelectorAll('polyline.slice-line');
    expect(lines.length).toBe(4);
    expect(lines[3].classList.contains('front')).toBe(true);
    const texts = Array.from(svg.querySelectorAll('text'), (t) => t.textContent!.trim());
    expect(texts).toEqual(
      expect.arrayContaining(['0 ms', '300 ms', 'Time (ms)', 'Level (dB re top)', 'Frequency (Hz)']),
    );
    (query('decay-plot-area') as HTMLElement).dispatchEvent(
      new KeyboardEvent('keydown', { key: 'ArrowDown', bubbles: true }),
    );
    await fixture.whenStable();
    expect(svg.querySelector('circle.cursor-point')).not.toBeNull();

    const range = await loader.getHarness(MatSelectHarness);
    expect(await range.getValueText()).toBe('60 dB');
    await range.open();
    await range.clickOptions({ text: '100 dB' });
    await fixture.whenStable();
    const labels = Array.from(svg.querySelectorAll('text.tick-label'), (t) => t.textContent!.trim());
    expect(labels).toContain('−100');
    expect(labels).not.toContain('−10');
  });

  it('reads the cell under the pointer on the heat map', async () => {
    const { query, fixture } = await setUp();
    const svg = query('decay-svg') as SVGSVGElement;
    svg.getBoundingClientRect = () => ({
      left: 0,
      top: 0,
      right: 640,
      bottom: 400,
      width: 640,
      height: 400,
      x: 0,
      y: 0,
      toJSON: () => ({}),
    });
    // Plot area starts at (58, 14); 640 px wide: 498 px across the 4 bins, 249 px high over the 4 slices.
    const event = new MouseEvent('pointermove', { clientX: 58 + 498, clientY: 14 + 249, bubbles: true });
    svg.dispatchEvent(event);
    await fixture.whenStable();
    expect(query('decay-readout')!.textContent).toBe('20.00\u00a0kHz at 300.0\u00a0ms: \u2212150.0\u00a0dB');
    svg.dispatchEvent(new MouseEvent('pointermove', { clientX: 10, clientY: 10, bubbles: true }));
    await fixture.whenStable();
    expect(query('decay-readout')!.textContent).toContain('20.00\u00a0kHz');
  });

  it('draws nothing for an analysis without decay plots', async () => {
    const { element } = await setUp({});
    expect(element.querySelector('svg')).toBeNull();
  });
});
