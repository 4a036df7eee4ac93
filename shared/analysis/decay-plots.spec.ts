import { cumulativeSpectralDecay, decayPlotsOf, spectrogram, type DecayPlotRequest } from './decay-plots';

const FS = 48000;
const T60 = 0.2;
/** A 1 kHz sine decaying exponentially by 60 dB in T60 (the definition of the reverberation time, ISO 3382-1). */
const decayingSine = (length: number, at: number): Float64Array =>
  Float64Array.from({ length }, (_, i) =>
    i < at
      ? 0
      : Math.exp((-3 * Math.LN10 * (i - at)) / (T60 * FS)) * Math.sin((2 * Math.PI * 1000 * (i - at)) / FS),
  );
const request = (over: Partial<DecayPlotRequest> = {}): DecayPlotRequest => ({
  slices: 7,
  bins: 64,
  fromHz: 100,
  toHz: 10000,
  spanMs: 150,
  windowMs: 500,
  ...over,
});

describe('cumulativeSpectralDecay', () => {
  it('shows an exponentially decaying 1 kHz tone losing 60 dB per T60 from slice to slice (within 0.5 dB)', () => {
    const arrival = 480;
    const plot = cumulativeSpectralDecay(decayingSine(FS, arrival), FS, arrival, request());
    expect(plot.timesMs).toEqual([0, 25, 50, 75, 100, 125, 150]);
    expect(plot.window).toEqual({ name: 'rectangular start, half-Hann end', lengthMs: 500, taperMs: 100 });
    expect(plot.frequenciesHz).toHaveLength(64);
    expect(plot.frequenciesHz[0]).toBe(100);
    expect(plot.frequenciesHz[63]).toBe(10000);
    const bin = plot.frequenciesHz.reduce(
      (best, f, i, all) => (Math.abs(Math.log(f / 1000)) < Math.abs(Math.log(all[best] / 1000)) ? i : best),
      0,
    );
    // Berman & Fincham's slices start later on the same decay: the tone's line falls by 60·t/T60 dB.
    plot.timesMs.forEach((t, k) => {
      const drop = plot.levelDb[k][bin] - plot.levelDb[0][bin];
      expect(Math.abs(drop + (60 * t) / 1000 / T60)).toBeLessThan(0.5);
    });
    // Its top is the first slice's 1 kHz line.
    expect(plot.levelDb[0][bin]).toBe(0);
    expect(Math.max(...plot.levelDb.flat())).toBe(0);
  });

  it('refuses a span that reaches the fixed end, and a top frequency above Nyquist, naming the fields', () => {
    const h = decayingSine(FS, 0);
    expect(() => cumulativeSpectralDecay(h, FS, 0, request({ spanMs: 500 }))).toThrow(
      expect.objectContaining({ field: '/decaySpanMs' }),
    );
    expect(() => cumulativeSpectralDecay(h, FS, 0, request({ toHz: 30000 }))).toThrow(
      expect.objectContaining({ field: '/decayToHz' }),
    );
  });
});

describe('spectrogram', () => {
  it('follows a tone that changes from 2 kHz to 500 Hz at 100 ms, through a Hann window it names', () => {
    const h = Float64Array.from({ length: Math.round(0.3 * FS) }, (_, i) =>
      Math.sin((2 * Math.PI * (i < 0.1 * FS ? 2000 : 500) * i) / FS),
    );
    const plot = spectrogram(h, FS, 0, request({ slices: 5, spanMs: 200, windowMs: 40 }));
    expect(plot.window).toEqual({ name: 'hann', lengthMs: 40, taperMs: 20 });
    expect(plot.timesMs).toEqual([0, 50, 100, 150, 200]);
    expect(plot.resolutionHz).toBe(25);
    const near = (hz: number) =>
      plot.frequenciesHz.reduce(
        (best, f, i, all) => (Math.abs(Math.log(f / hz)) < Math.abs(Math.log(all[best] / hz)) ? i : best),
        0,
      );
    const [at2k, at500] = [near(2000), near(500)];
    // At 50 ms only the 2 kHz tone is in the window, at 150 ms only the 500 Hz one: each line stands more
    // than 60 dB above where its tone is absent (a Hann window's side lobes start at −31 dB and fall
    // 18 dB per octave, Harris 1978), and each slice's top is its own tone.
    expect(plot.levelDb[1][at2k] - plot.levelDb[3][at2k]).toBeGreaterThan(60);
    expect(plot.levelDb[3][at500] - plot.levelDb[1][at500]).toBeGreaterThan(60);
    expect(plot.levelDb[1].indexOf(Math.max(...plot.levelDb[1]))).toBe(at2k);
    expect(plot.levelDb[3].indexOf(Math.max(...plot.levelDb[3]))).toBe(at500);
  });
});

describe('decayPlotsOf', () => {
  const fields = {
    decaySlices: 10,
    decayBins: 32,
    decayFromHz: 20,
    decayToHz: 20000,
    decaySpanMs: 300,
    waterfallWindowMs: 500,
    spectrogramWindowMs: 50,
  };
  it('asks for the plots the fields name, each with its own window', () => {
    expect(decayPlotsOf(fields)).toBeUndefined();
    expect(decayPlotsOf({ ...fields, spectrogram: true })).toEqual({
      spectrogram: { slices: 10, bins: 32, fromHz: 20, toHz: 20000, spanMs: 300, windowMs: 50 },
    });
    expect(decayPlotsOf({ ...fields, waterfall: true, spectrogram: false })?.waterfall?.windowMs).toBe(500);
  });
});
