import {
  type DecayPlotData,
  cellText,
  decayFormFields,
  decayRequestProblems,
  decaySummary,
  frequencyTicks,
  heatMapImage,
  levelColour,
  levelTicks,
  relativeLuminance,
  scaleColour,
  sliceLines,
  timeTicks,
  DEFAULT_DECAY_REQUEST,
} from './decay-scale';

/** A plot of 3 slices × 4 bins: 100 Hz rings on, 1 kHz dies fast. */
const plot: DecayPlotData = {
  window: { name: 'hann', lengthMs: 50, taperMs: 25 },
  timesMs: [0, 50, 100],
  frequenciesHz: [100, 316.2, 1000, 3162],
  levelDb: [
    [0, -3, -6, -40],
    [-2, -12, -30, -60],
    [-4, -20, -54, -150],
  ],
  binWidthOctaves: 1.66,
  resolutionHz: 20,
};

describe('the level scale', () => {
  it('gets lighter with every step up (WCAG relative luminance strictly rising over 64 steps)', () => {
    const luminance = Array.from({ length: 64 }, (_, i) => relativeLuminance(scaleColour(i / 63)));
    for (let i = 1; i < luminance.length; i++) expect(luminance[i]).toBeGreaterThan(luminance[i - 1]);
    // From a dark end (under 5 % luminance) to a light end (over 75 %): a wide, readable spread.
    expect(luminance[0]).toBeLessThan(0.05);
    expect(luminance[63]).toBeGreaterThan(0.75);
  });

  it('turns from a violet-blue bottom to a yellowish top, in 8-bit sRGB', () => {
    const [r0, g0, b0] = scaleColour(0);
    expect(b0).toBeGreaterThan(r0);
    expect(b0).toBeGreaterThan(g0);
    const [r1, g1, b1] = scaleColour(1);
    expect(Math.min(r1, g1)).toBeGreaterThan(b1);
    for (const c of [scaleColour(0), scaleColour(0.5), scaleColour(1)])
      for (const v of c) expect(Number.isInteger(v) && v >= 0 && v <= 255).toBe(true);
  });

  it('maps dB re the top onto the chosen range, holding anything below it at the bottom', () => {
    expect(levelColour(0, 60)).toEqual(scaleColour(1));
    expect(levelColour(-30, 60)).toEqual(scaleColour(0.5));
    expect(levelColour(-60, 60)).toEqual(scaleColour(0));
    expect(levelColour(-150, 60)).toEqual(scaleColour(0));
    expect(levelColour(Number.NaN, 60)).toEqual(scaleColour(0));
  });
});

describe('heatMapImage', () => {
  it('writes a 24-bit BMP one pixel per cell, the first slice on the top row', () => {
    const url = heatMapImage(plot, 60);
    expect(url.startsWith('data:image/bmp;base64,')).toBe(true);
    const bytes = Uint8Array.from(atob(url.slice(22)), (c) => c.charCodeAt(0));
    const view = new DataView(bytes.buffer);
    expect(String.fromCharCode(bytes[0], bytes[1])).toBe('BM');
    expect(view.getInt32(18, true)).toBe(4);
    expect(view.getInt32(22, true)).toBe(3);
    expect(view.getUint16(28, true)).toBe(24);
    // Rows are 12 bytes (4 px × 3, already a multiple of 4); bottom-up, so slice 0 is the last row.
    const pixel = (slice: number, bin: number) => {
      const at = 54 + (2 - slice) * 12 + bin * 3;
      return [bytes[at + 2], bytes[at + 1], bytes[at]];
    };
    expect(pixel(0, 0)).toEqual([...levelColour(0, 60)]);
    expect(pixel(1, 2)).toEqual([...levelColour(-30, 60)]);
    expect(pixel(2, 3)).toEqual([...scaleColour(0)]);
    expect(bytes.length).toBe(54 + 12 * 3);
  });

  it('pads rows to whole 4-byte words', () => {
    const odd = { ...plot, frequenciesHz: [100, 200, 400], levelDb: plot.levelDb.map((r) => r.slice(0, 3)) };
    const bytes = atob(heatMapImage(odd, 60).slice(22));
    expect(bytes.length).toBe(54 + 12 * 3);
  });
});

describe('axis ticks', () => {
  it('labels a log frequency axis at 1-2-5 steps, placed by log position', () => {
    const ticks = frequencyTicks(20, 20000);
    expect(ticks.map((t) => t.label)).toEqual([
      '20',
      '50',
      '100',
      '200',
      '500',
      '1k',
      '2k',
      '5k',
      '10k',
      '20k',
    ]);
    expect(ticks[0].at).toBeCloseTo(0, 9);
    expect(ticks.at(-1)!.at).toBeCloseTo(1, 9);
    // 632 Hz is the log midpoint of 20 Hz–20 kHz; 1 kHz sits at log(50)/log(1000).
    expect(ticks.find((t) => t.value === 1000)!.at).toBeCloseTo(Math.log(50) / Math.log(1000), 9);
  });

  it('falls back to the two ends when fewer than two 1-2-5 steps fit', () => {
    expect(frequencyTicks(210, 480).map((t) => [t.label, t.at])).toEqual([
      ['210', 0],
      ['480', 1],
    ]);
  });

  it('steps time at 1-2-5 multiples and the scale bar every 10 dB (20 dB over 60 dB)', () => {
    expect(timeTicks(0, 300).map((t) => t.value)).toEqual([0, 50, 100, 150, 200, 250, 300]);
    expect(timeTicks(0, 7).map((t) => t.value)).toEqual([0, 2, 4, 6]);
    expect(timeTicks(5, 5)).toEqual([{ value: 5, label: '5', at: 0 }]);
    expect(levelTicks(40).map((t) => t.label)).toEqual(['0', '−10', '−20', '−30', '−40']);
    expect(levelTicks(100).map((t) => [t.value, t.at])).toEqual([
      [0, 0],
      [-20, 0.2],
      [-40, 0.4],
      [-60, 0.6],
      [-80, 0.8],
      [-100, 1],
    ]);
  });
});

describe('sliceLines', () => {
  it('draws back to front, each later slice further right and up, levels held to the range', () => {
    const lines = sliceLines(plot, 60, { width: 400, height: 300, depthX: 100, depthY: 100 });
    expect(lines.map((l) => l.timeMs)).toEqual([100, 50, 0]);
    const front = lines[2].line.split(' ').map((p) => p.split(',').map(Number));
    // Front slice: x from 0 to 300, 0 dB at the face's top (y 100), −40 dB two thirds down (60 dB range).
    expect(front[0]).toEqual([0, 100]);
    expect(front[3]).toEqual([300, 233.3]); // 100 + 40/60 × 200, to 0.1 px
    const back = lines[0].line.split(' ').map((p) => p.split(',').map(Number));
    expect(back[0]).toEqual([100, 13.3]); // 4/60 × 200
    // −150 dB sits on the base of its slice (y 200 for the last slice).
    expect(back[3]).toEqual([400, 200]);
    expect(lines[0].area.startsWith('100,200 ')).toBe(true);
    expect(lines[0].area.endsWith(' 400,200')).toBe(true);
  });
});

describe('text for people who do not see the plot', () => {
  it('reads one cell with its units', () => {
    expect(cellText(plot, 1, 2)).toBe('1.00\u00a0kHz at 50.0\u00a0ms: \u221230.0\u00a0dB');
    expect(cellText(plot, 0, 0)).toBe('100\u00a0Hz at 0.0\u00a0ms: 0.0\u00a0dB');
  });

  it('names the coverage, the window and where it rings longest and dies fastest', () => {
    const text = decaySummary(plot, 'Spectrogram of M+030');
    expect(text).toContain('Spectrogram of M+030: 3 slices from 0\u00a0ms to 100\u00a0ms after the arrival');
    expect(text).toContain('4 frequencies from 100\u00a0Hz to 3.16\u00a0kHz');
    expect(text).toContain('hann window of 50.0\u00a0ms, finest detail 20.0\u00a0Hz');
    // 3162 Hz starts 40 dB down, so it is left out; of the rest 100 Hz falls least, 1 kHz most.
    expect(text).toContain('Longest ringing near 100\u00a0Hz: it falls 4.0\u00a0dB by 100\u00a0ms.');
    expect(text).toContain('Fastest decay near 1.00\u00a0kHz: 48.0\u00a0dB by 100\u00a0ms.');
  });

  it('names the mode that rings longest, not the bin beside it that fell less', () => {
    // A mode at 63 Hz: it starts at the top and is still 20 dB down at 300 ms. Its neighbour at 59.4 Hz
    // is off the resonance at first (10 dB down) but late on holds the mode's leaked energy, so it falls
    // only 14 dB; the bins further out die away.
    const mode: DecayPlotData = {
      window: { name: 'hann', lengthMs: 300, taperMs: 150 },
      timesMs: [0, 150, 300],
      frequenciesHz: [50, 56.1, 59.4, 63, 66.7, 74.8],
      levelDb: [
        [-8, -6, -10, 0, -7, -5],
        [-30, -26, -19, -10, -24, -32],
        [-52, -44, -24, -20, -38, -58],
      ],
      binWidthOctaves: 1 / 12,
      resolutionHz: 3.3,
    };
    const text = decaySummary(mode, 'Waterfall of LFE1');
    expect(text).toContain('Longest ringing near 63.0\u00a0Hz: it falls 20.0\u00a0dB by 300\u00a0ms.');
    expect(text).not.toContain('59.4');
    expect(text).toContain('Fastest decay near 74.8\u00a0Hz: 53.0\u00a0dB by 300\u00a0ms.');
  });
});

describe('asking for plots', () => {
  it('sends nothing when no plot is asked for, and the fields the API names otherwise', () => {
    expect(decayFormFields(DEFAULT_DECAY_REQUEST)).toEqual([]);
    expect(decayFormFields({ waterfall: true, spectrogram: false, slices: 24, bins: 64 })).toEqual([
      ['waterfall', 'true'],
      ['decaySlices', '24'],
      ['decayBins', '64'],
    ]);
    expect(decayFormFields({ waterfall: true, spectrogram: true, slices: 2, bins: 16 })[1]).toEqual([
      'spectrogram',
      'true',
    ]);
  });

  it('holds slices and bins to the contract limits (2–128, 16–256), whole numbers only', () => {
    const asked = { waterfall: true, spectrogram: false };
    expect(decayRequestProblems({ ...asked, slices: 128, bins: 256 })).toEqual({});
    expect(decayRequestProblems({ ...asked, slices: 129, bins: 15 })).toEqual({
      slices: 'Give 2 to 128 slices.',
      bins: 'Give 16 to 256 frequencies.',
    });
    expect(decayRequestProblems({ ...asked, slices: 2.5, bins: 96 }).slices).toBeDefined();
    // Nothing asked for: nothing to check.
    expect(decayRequestProblems({ waterfall: false, spectrogram: false, slices: 1, bins: 1 })).toEqual({});
  });
});
