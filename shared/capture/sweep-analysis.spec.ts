import { webAudioRender, webAudioResponses } from '../../tests/reference/web-audio';
import { deconvolve, prepareSweep } from './deconvolve';
import { exponentialSweep, harmonicAdvanceS, sweepRateS, type SweepSpec } from './sweep';
import { analyzeSweepRecording } from './sweep-analysis';

const FS = 48000;
const SWEEP: SweepSpec = {
  sampleRateHz: FS,
  startHz: 20,
  endHz: 20000,
  durationS: 2,
  fadeInS: 0.05,
  fadeOutS: 0.01,
  levelDbfs: -6,
  silenceAfterS: 0,
};
const sweep = exponentialSweep(SWEEP);
/** The usual 10 s sweep: long enough for the 2nd harmonic (1 s ahead) to leave room for the low end's ringing. */
const SWEEP10: SweepSpec = { ...SWEEP, durationS: 10 };
const sweep10 = exponentialSweep(SWEEP10);

/** The sweep through `shape`, started `delay` samples into a recording that lasts 1 s longer than the sweep. */
function record(delay: number, shape: (x: number) => number = (x) => x, source = sweep): Float64Array {
  const out = new Float64Array(source.length + FS);
  for (let i = 0; i < source.length; i++) out[i + delay] = shape(source[i]);
  return out;
}

function peakIndex(x: ArrayLike<number>, from = 0, to = x.length): number {
  let at = from;
  for (let i = from; i < to; i++) if (Math.abs(x[i]) > Math.abs(x[at])) at = i;
  return at;
}

describe('exponential sweep (Farina, AES 108th Convention, 2000, preprint 5093)', () => {
  const plain = exponentialSweep({ ...SWEEP, fadeInS: 0, fadeOutS: 0 });
  const L = SWEEP.durationS / Math.log(SWEEP.endHz / SWEEP.startHz);

  it('is A·sin(2π·f1·L·(e^(t/L) − 1)) with A the sine peak', () => {
    const A = Math.pow(10, -6 / 20);
    for (const i of [0, 1, 1000, 47999, 60000, 95999]) {
      const t = i / FS;
      expect(plain[i]).toBeCloseTo(A * Math.sin(2 * Math.PI * SWEEP.startHz * L * (Math.exp(t / L) - 1)), 9);
    }
    expect(sweepRateS(SWEEP)).toBeCloseTo(L, 12);
  });

  it('has the instantaneous frequency f1·e^(t/L): zero crossings counted up to t match 2·f1·L·(e^(t/L) − 1) within one', () => {
    let crossings = 0;
    for (let i = 1; i < plain.length; i++) {
      if (Math.sign(plain[i]) !== Math.sign(plain[i - 1]) && plain[i] !== 0) crossings++;
      const t = i / FS;
      if (i % 12000 === 0)
        expect(Math.abs(crossings - 2 * SWEEP.startHz * L * (Math.exp(t / L) - 1))).toBeLessThanOrEqual(1.5);
    }
  });

  it('fades in and out over half-Hann windows and ends in the requested silence', () => {
    const withSilence = exponentialSweep({ ...SWEEP, silenceAfterS: 0.5 });
    expect(withSilence.length).toBe(2 * FS + 0.5 * FS);
    expect(withSilence[0]).toBe(0);
    expect(withSilence.subarray(2 * FS).every((v) => v === 0)).toBe(true);
  });

  it('refuses f2 above Nyquist, less than an octave, and fades longer than half the sweep', () => {
    expect(() => exponentialSweep({ ...SWEEP, endHz: 24001 })).toThrow(
      expect.objectContaining({ field: '/endHz' }),
    );
    expect(() => exponentialSweep({ ...SWEEP, startHz: 1000, endHz: 1900 })).toThrow(
      expect.objectContaining({ field: '/endHz' }),
    );
    expect(() => exponentialSweep({ ...SWEEP, fadeInS: 0.6, fadeOutS: 0.5 })).toThrow(
      expect.objectContaining({ field: '/fadeInS' }),
    );
  });
});

describe('deconvolution of a recorded sweep', () => {
  it.each([
    ['regularizedDivision', SWEEP10.startHz, 0.1],
    // Farina's inverse filter does not undo the sweep's fades, so it is checked from 2·f1.
    ['inverseFilter', 2 * SWEEP10.startHz, 0.1],
  ] as const)(
    '%s recovers a known delay of 1234 samples exactly and a flat response from %d Hz to f2/2 (±%d dB)',
    (method, fromHz, toleranceDb) => {
      const analysis = analyzeSweepRecording(record(1234, undefined, sweep10), SWEEP10, {
        method,
        smoothingOctaves: 1 / 48,
      });
      expect(analysis.arrival.peakSample).toBe(1234);
      const { frequenciesHz, magnitudeDb } = analysis.frequencyResponse;
      const inBand = frequenciesHz
        .map((f, i) => [f, magnitudeDb[i]])
        .filter(([f]) => f >= fromHz && f <= 10000);
      expect(inBand.length).toBeGreaterThan(350);
      for (const [, db] of inBand) expect(Math.abs(db)).toBeLessThan(toleranceDb);
    },
  );

  it('puts the N-th harmonic response T·ln(N)/ln(f2/f1) before the linear one (Farina 2000), within two samples', () => {
    const delay = 2000;
    const recording = record(delay, (x) => x + 0.2 * x * x + 0.2 * x * x * x + 0.1 * x ** 4 + 0.1 * x ** 5);
    const prepared = prepareSweep(SWEEP, recording.length);
    const h = deconvolve(recording, prepared);
    for (const n of [2, 3, 4, 5]) {
      const expected = delay - harmonicAdvanceS(SWEEP, n) * FS;
      const at = prepared.size + expected;
      const found = peakIndex(h, Math.round(at - 200), Math.round(at + 200));
      expect(Math.abs(found - at)).toBeLessThanOrEqual(2);
    }
  });

  // From ten times f1: below, a harmonic response whose phase the sweep rotates (f1·L is not a whole
  // number) has tails longer than its window, and its level reads high.
  it('reads the 2nd and 3rd harmonics of y = x + a2·x² + a3·x³ as the trigonometric identities predict (±0.2 dB from 10·f1 to f2/2N)', () => {
    // A·sin: x² = A²/2·(1 − cos 2ωt), x³ = A³/4·(3 sin ωt − sin 3ωt): harmonics a2·A²/2 and a3·A³/4, and
    // the fundamental grows to A + 3·a3·A³/4 (standard product-to-sum identities).
    const a2 = 0.1;
    const a3 = 0.05;
    const A = Math.pow(10, SWEEP.levelDbfs / 20);
    const fundamental = A + (3 * a3 * A ** 3) / 4;
    const expected: Record<number, number> = {
      2: 20 * Math.log10((a2 * A * A) / 2 / fundamental),
      3: 20 * Math.log10((a3 * A ** 3) / 4 / fundamental),
    };
    const analysis = analyzeSweepRecording(
      record(500, (x) => x + a2 * x * x + a3 * x * x * x),
      SWEEP,
    );
    for (const harmonic of analysis.distortion.harmonics.filter((h) => h.harmonic <= 3)) {
      expect(harmonic.advanceS).toBeCloseTo(harmonicAdvanceS(SWEEP, harmonic.harmonic), 12);
      const inside = harmonic.frequenciesHz
        .map((f, i) => [f, harmonic.levelDb[i]])
        .filter(([f]) => f >= 10 * SWEEP.startHz && f <= SWEEP.endHz / harmonic.harmonic / 2);
      expect(inside.length).toBeGreaterThan(30);
      for (const [, db] of inside) expect(Math.abs(db - expected[harmonic.harmonic])).toBeLessThan(0.2);
    }
    // The 4th and 5th are absent: far below the 3rd.
    for (const harmonic of analysis.distortion.harmonics.filter((h) => h.harmonic >= 4)) {
      const mid = harmonic.levelDb[Math.floor(harmonic.levelDb.length / 2)];
      expect(mid).toBeLessThan(expected[3] - 30);
    }
  });

  it('recovers a cookbook peaking filter rendered by node-web-audio-api (OfflineAudioContext) within ±0.1 dB over f1..f2/2', () => {
    const biquad = { type: 'peaking' as const, frequency: 1000, Q: 0.7, gain: 6 };
    const rendered = webAudioRender({ sampleRateHz: FS, delaySamples: 480, biquad, signal: sweep10 });
    const recording = new Float64Array(sweep10.length + FS);
    recording.set(rendered);
    const analysis = analyzeSweepRecording(recording, SWEEP10, { smoothingOctaves: 1 / 48 });
    expect(analysis.arrival.peakSample).toBe(480);
    const { frequenciesHz, magnitudeDb } = analysis.frequencyResponse;
    // Points whose 1/48-octave window lies inside f1..f2/2.
    const points = frequenciesHz
      .map((f, i) => [f, magnitudeDb[i]])
      .filter(([f]) => f >= SWEEP10.startHz * Math.pow(2, 1 / 96) && f <= SWEEP10.endHz / 2);
    const [reference] = webAudioResponses([
      { sampleRateHz: FS, frequenciesHz: points.map(([f]) => f), biquad },
    ]);
    points.forEach(([, db], i) => {
      expect(Math.abs(db - 20 * Math.log10(reference.magnitude[i]))).toBeLessThan(0.1);
    });
    expect(points.length).toBeGreaterThan(400);
  });

  it('measures the arrival from a timing-reference channel, so the interface latency drops out (within one sample)', () => {
    const latency = 317;
    const flight = 517; // 3.66 m at 343 m/s, 48 kHz
    const analysis = analyzeSweepRecording(record(latency + flight), SWEEP, { reference: record(latency) });
    expect(analysis.timing).toBeDefined();
    expect(analysis.timing!.referencePeakSample).toBe(latency);
    expect(Math.abs(analysis.timing!.arrivalFromReferenceSamples - flight)).toBeLessThanOrEqual(1);
    expect(analysis.timing!.peakFromReferenceSamples).toBe(flight);
    expect(analysis.timing!.arrivalFromReferenceMs).toBeCloseTo(
      (analysis.timing!.arrivalFromReferenceSamples / FS) * 1000,
      9,
    );
  });

  it('refuses a recording shorter than the sweep and a silent reference channel', () => {
    expect(() => analyzeSweepRecording(sweep.slice(0, FS), SWEEP)).toThrow(
      expect.objectContaining({ code: 'tooShort' }),
    );
    expect(() =>
      analyzeSweepRecording(record(10), SWEEP, { reference: new Float64Array(sweep.length + FS) }),
    ).toThrow(expect.objectContaining({ code: 'silent', field: '/referenceChannel' }));
  });
});
