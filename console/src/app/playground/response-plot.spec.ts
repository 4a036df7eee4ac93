import Fili from 'fili';
import type { Sos } from '../../../../shared/dsp/sos';
import { curvesFromResult, magnitudeChart, magnitudeRange, phaseChart } from './response-plot';

// References: a Linkwitz-Riley crossover (two cascaded Butterworth filters of the same order) sums to
// an all-pass, flat in magnitude, and each output is −6.02 dB at the crossover (Linkwitz, "Active
// crossover networks for noncoincident drivers", JAES 1976). A 2nd-order LR sums flat only with the
// high-pass inverted; with both in phase it cancels at the crossover. Sections come from fili.
const fs = 48000;
const fc = 80;

function butterworth2(kind: 'lowpass' | 'highpass'): Sos {
  const [c] = new Fili.CalcCascades()[kind]({
    order: 1,
    characteristic: 'butterworth',
    Fs: fs,
    Fc: fc,
  }) as Array<{
    a: number[];
    b: number[];
  }>;
  return { b0: c.b[0], b1: c.b[1], b2: c.b[2], a1: c.a[0], a2: c.a[1] };
}

function firstOrder(kind: 'lowPass' | 'highPass'): Sos {
  // Bilinear transform of s/(s+ω) and ω/(s+ω), pre-warped: K = tan(π·fc/fs).
  const k = Math.tan((Math.PI * fc) / fs);
  const a1 = (k - 1) / (k + 1);
  return kind === 'lowPass'
    ? { b0: k / (1 + k), b1: k / (1 + k), b2: 0, a1, a2: 0 }
    : { b0: 1 / (1 + k), b1: -1 / (1 + k), b2: 0, a1, a2: 0 };
}

describe('curvesFromResult with reported responses', () => {
  const dense = Array.from({ length: 60 }, (_, i) => 20 * 2 ** (i / 6));

  it('takes a dense reported response as the API computed it', () => {
    const body = {
      sampleRateHz: fs,
      sections: [{ b0: 1, b1: 0, b2: 0, a1: 0, a2: 0 }],
      response: { frequenciesHz: dense, magnitudeDb: dense.map(() => -1), phaseDeg: dense.map(() => 10) },
    };
    const curves = curvesFromResult(body);
    expect(curves).toHaveLength(1);
    expect(curves[0]).toMatchObject({ label: 'response', source: 'reported', isSum: false });
    expect(curves[0].magnitudeDb[0]).toBe(-1);
  });

  it('redraws a response reported at a few spot frequencies from its sections, densely', () => {
    const body = {
      sampleRateHz: fs,
      sections: [butterworth2('lowpass')],
      response: { frequenciesHz: [40, 80], magnitudeDb: [0, -3], phaseDeg: [0, -90] },
    };
    const [curve] = curvesFromResult(body);
    expect(curve.source).toBe('computed');
    expect(curve.frequenciesHz.length).toBeGreaterThan(200);
    expect(curve.magnitudeDb[curve.frequenciesHz.findIndex((f) => Math.abs(f - fc) < 1e-9)]).toBeCloseTo(
      -3.0103,
      3,
    );
  });

  it('names crossover outputs and marks the sum, sharing the grid of the parent object', () => {
    const body = {
      response: {
        frequenciesHz: [40, 80, 160],
        lowPass: { magnitudeDb: [-0.3, -6.02, -24] },
        highPass: { magnitudeDb: [-24, -6.02, -0.3] },
        sum: { magnitudeDb: [0, 0, 0], phaseDeg: [-40, -180, 140] },
      },
    };
    const curves = curvesFromResult(body);
    expect(curves.map((curve) => [curve.label, curve.isSum, curve.frequenciesHz])).toEqual([
      ['lowPass', false, [40, 80, 160]],
      ['highPass', false, [40, 80, 160]],
      ['sum', true, [40, 80, 160]],
    ]);
  });

  it('skips magnitude arrays whose length does not match the grid', () => {
    expect(curvesFromResult({ frequenciesHz: [1, 2, 3], magnitudeDb: [0, 0] })).toEqual([]);
  });
});

describe('curvesFromResult computing from returned sections', () => {
  const lr4 = {
    family: 'linkwitzRiley',
    order: 4,
    frequencyHz: fc,
    lowPass: { sections: [butterworth2('lowpass'), butterworth2('lowpass')] },
    highPass: { sections: [butterworth2('highpass'), butterworth2('highpass')] },
    highPassPolarity: 'normal',
  };

  it('draws a 4th-order Linkwitz-Riley crossover whose sum is flat and whose outputs are −6.02 dB at fc', () => {
    const curves = curvesFromResult(lr4, { sampleRateHz: fs });
    expect(curves.map((curve) => curve.label)).toEqual(['lowPass', 'highPass', 'sum']);
    const sum = curves[2];
    expect(sum.isSum).toBe(true);
    expect(Math.max(...sum.magnitudeDb.map(Math.abs))).toBeLessThan(1e-9);
    const [lowPass, highPass] = curves;
    const index = lowPass.frequenciesHz.findIndex((f) => Math.abs(f - fc) < 1e-9);
    expect(index).toBeGreaterThan(0);
    expect(lowPass.magnitudeDb[index]).toBeCloseTo(-6.0206, 3);
    expect(highPass.magnitudeDb[index]).toBeCloseTo(-6.0206, 3);
  });

  it('applies the high-pass polarity: a 2nd-order Linkwitz-Riley sums flat only when inverted', () => {
    const lr2 = (highPassPolarity: string) => ({
      lowPass: { sections: [firstOrder('lowPass'), firstOrder('lowPass')] },
      highPass: { sections: [firstOrder('highPass'), firstOrder('highPass')] },
      highPassPolarity,
      sampleRateHz: fs,
    });
    const inverted = curvesFromResult(lr2('inverted'))[2];
    expect(Math.max(...inverted.magnitudeDb.map(Math.abs))).toBeLessThan(1e-9);
    const normal = curvesFromResult(lr2('normal'))[2];
    const index = normal.frequenciesHz.findIndex((f) => Math.abs(f - fc) < 1e-9);
    expect(normal.magnitudeDb[index]).toBeLessThan(-100);
  });

  it('draws identical channel high-passes once, the subwoofer low-pass, and their flat LR4 sum', () => {
    const highPass = { sections: [butterworth2('highpass'), butterworth2('highpass')], polarity: 'normal' };
    const body = {
      channels: [
        { id: 'M+030', highPass },
        { id: 'M-030', highPass },
        { id: 'LFE1', role: 'lfe' },
        { id: 'M+110', highPass: { sections: [butterworth2('highpass')] } },
      ],
      subwoofer: { lowPass: { sections: [butterworth2('lowpass'), butterworth2('lowpass')] } },
    };
    const curves = curvesFromResult(body, { crossover: { sampleRateHz: fs } });
    expect(curves.map((curve) => curve.label)).toEqual([
      'highPass: M+030, M-030',
      'channels · M+110 · highPass',
      'subwoofer · lowPass',
      'sum: managed channel + subwoofer',
    ]);
    expect(Math.max(...curves[3].magnitudeDb.map(Math.abs))).toBeLessThan(1e-9);
  });

  it('draws nothing when no sample rate is known or nothing is plottable', () => {
    expect(curvesFromResult({ sections: [butterworth2('lowpass')] })).toEqual([]);
    expect(curvesFromResult({ delayMs: 3 }, { sampleRateHz: fs })).toEqual([]);
    expect(curvesFromResult(null)).toEqual([]);
  });
});

describe('magnitudeRange', () => {
  const curve = (magnitudeDb: number[]) => ({
    label: 'x',
    frequenciesHz: magnitudeDb.map((_, i) => i + 1),
    magnitudeDb,
    source: 'reported' as const,
    isSum: false,
  });

  it('keeps at least 12 dB of view around a small EQ move, in 3 dB steps', () => {
    expect(magnitudeRange([curve([0, -4.5, 0])])).toEqual({ min: -9, max: 3, step: 3 });
  });

  it('shows at most 60 dB below the top so a stop band does not flatten the pass band', () => {
    expect(magnitudeRange([curve([0, -300])])).toEqual({ min: -50, max: 10, step: 10 });
  });
});

describe('charts', () => {
  it('puts frequencies on a log axis and draws sums dashed, with a readable summary', () => {
    const curves = curvesFromResult({
      response: {
        frequenciesHz: [40, 80],
        lowPass: { magnitudeDb: [0, -6], phaseDeg: [0, -90] },
        sum: { magnitudeDb: [0, 0] },
      },
    });
    const magnitude = magnitudeChart(curves);
    expect(magnitude.xScale).toBe('log');
    expect(magnitude.series.map((series) => series.dashed)).toEqual([false, true]);
    expect(magnitude.series[0].points).toEqual([
      { x: 40, y: 0 },
      { x: 80, y: -6 },
    ]);
    expect(magnitude.summary).toContain('lowPass: highest 0.0 dB at 40 Hz');
    const wrapped = curvesFromResult({
      response: {
        frequenciesHz: [40, 60, 80, 100],
        sum: { magnitudeDb: [0, 0, 0, 0], phaseDeg: [-120, -170, 175, 120] },
      },
    });
    expect(phaseChart(wrapped)?.series[0].points).toEqual([
      { x: 40, y: -120 },
      { x: 60, y: -170 },
      { x: 80, y: null },
      { x: 80, y: 175 },
      { x: 100, y: 120 },
    ]);
    const phase = phaseChart(curves);
    expect(phase?.series.map((series) => series.label)).toEqual(['lowPass']);
    expect(phaseChart([])).toBeNull();
  });
});
