import fc from 'fast-check';
import { designBiquad } from '../filters/biquad-design';
import { catchInputError, expectWithin, logSweep, polesOf, referenceResponse } from '../filters/test-helpers';
import { cascadeResponse, parallelResponse, sosfreqz, sosMagnitudeDb, unitCircle } from './response';
import { isStable, type Sos } from './sos';
import { webAudioResponses } from '../../tests/reference/web-audio';

function wrappedDifferenceDeg(a: number, b: number): number {
  const d = a - b;
  return d - 360 * Math.round(d / 360);
}

/** A mixed cascade: what an EQ of a studio channel might hold. */
function sampleCascade(fs: number): Sos[] {
  return [
    designBiquad({ type: 'highPass', frequencyHz: 25, q: 0.6 }, fs),
    designBiquad({ type: 'peaking', frequencyHz: 63, gainDb: -7.5, q: 4 }, fs),
    designBiquad({ type: 'lowShelf', frequencyHz: 120, gainDb: 2 }, fs),
    designBiquad({ type: 'peaking', frequencyHz: 2400, gainDb: -2, bandwidthOctaves: 0.7 }, fs),
    designBiquad({ type: 'highShelf', frequencyHz: 9000, gainDb: -1.5, shelfSlope: 0.7 }, fs),
    designBiquad({ type: 'allPass', frequencyHz: 300, q: 0.9 }, fs),
  ];
}

describe('cascadeResponse', () => {
  const SAMPLE_RATES = [44100, 48000, 96000];

  it('agrees with a direct complex evaluation (1e-9 dB, 1e-9°)', () => {
    for (const fs of SAMPLE_RATES) {
      const sections = sampleCascade(fs);
      const frequencies = [...logSweep(5, fs / 2, 12), fs / 2];
      const r = cascadeResponse(sections, frequencies, fs);
      frequencies.forEach((f, i) => {
        const h = referenceResponse(sections, f, fs);
        expectWithin(r.magnitudeDb[i], 20 * Math.log10(Math.hypot(h.re, h.im)), 1e-9, `${f} Hz dB`);
        expectWithin(
          wrappedDifferenceDeg(r.phaseDeg[i], (Math.atan2(h.im, h.re) * 180) / Math.PI),
          0,
          1e-9,
          `${f} Hz °`,
        );
      });
    }
  });

  // node-web-audio-api IIRFilterNode (float32 output), one section per node: a float32 polynomial of
  // the whole 8th-order cascade was measured here to be off by up to 0.014 dB at low frequencies, so
  // the cascade itself is checked against the double-precision evaluation above instead. Per section
  // the stated tolerances are 1e-4 dB and 1e-3° above −40 dB, as for BiquadFilterNode.
  it('evaluates each section as Web Audio IIRFilterNode.getFrequencyResponse does', () => {
    const cases = SAMPLE_RATES.flatMap((fs) =>
      sampleCascade(fs).map((section) => ({
        fs,
        section,
        job: {
          sampleRateHz: fs,
          frequenciesHz: logSweep(20, fs / 2 - 1, 12),
          iir: { feedforward: [section.b0, section.b1, section.b2], feedback: [1, section.a1, section.a2] },
        },
      })),
    );
    const answers = webAudioResponses(cases.map((c) => c.job));
    let compared = 0;
    cases.forEach(({ fs, section }, k) => {
      const { frequenciesHz, magnitude, phaseRad } = answers[k];
      const r = cascadeResponse([section], frequenciesHz, fs);
      frequenciesHz.forEach((f, i) => {
        const refDb = 20 * Math.log10(magnitude[i]);
        if (refDb < -40) return;
        const what = `${section.type} at ${f} Hz, fs ${fs} Hz`;
        expectWithin(r.magnitudeDb[i], refDb, 1e-4, `${what} (dB)`);
        expectWithin(
          wrappedDifferenceDeg(r.phaseDeg[i], (phaseRad[i] * 180) / Math.PI),
          0,
          1e-3,
          `${what} (°)`,
        );
        compared++;
      });
    });
    expect(compared).toBeGreaterThan(1500);
  });

  // Group delay is −dφ/dω; a central difference of the directly evaluated phase with h = 1e-6 rad
  // has truncation error O(h²·φ''') far below the stated 1e-5 relative + 1e-6 ms tolerance.
  it('group delay matches the numerical derivative of the phase', () => {
    for (const fs of SAMPLE_RATES) {
      const sections = sampleCascade(fs);
      const frequencies = logSweep(10, fs / 2 - 10, 6);
      const r = cascadeResponse(sections, frequencies, fs);
      const h = 1e-6;
      frequencies.forEach((f, i) => {
        const w = (2 * Math.PI * f) / fs;
        const phaseAt = (omega: number) => {
          const c = referenceResponse(sections, (omega * fs) / (2 * Math.PI), fs);
          return Math.atan2(c.im, c.re);
        };
        let dPhi = phaseAt(w + h) - phaseAt(w - h);
        dPhi -= 2 * Math.PI * Math.round(dPhi / (2 * Math.PI));
        const expectedMs = (-dPhi / (2 * h) / fs) * 1000;
        expectWithin(
          r.groupDelayMs[i],
          expectedMs,
          1e-5 * Math.abs(expectedMs) + 1e-6,
          `${f} Hz group delay`,
        );
      });
    }
  });

  it('a pure one- and two-sample delay has a group delay of exactly 1 and 2 samples', () => {
    const fs = 48000;
    const oneSample = { b0: 0, b1: 1, b2: 0, a1: 0, a2: 0 };
    const twoSamples = { b0: 0, b1: 0, b2: 1, a1: 0, a2: 0 };
    const r = cascadeResponse([oneSample, twoSamples], [0, 100, 10000, 24000], fs);
    for (const delayMs of r.groupDelayMs)
      expectWithin(delayMs, (3 / fs) * 1000, 1e-12, 'three samples in ms');
    for (const db of r.magnitudeDb) expectWithin(db, 0, 1e-12, 'delay is 0 dB');
  });

  it('reports a true zero as −300 dB with finite phase and group delay', () => {
    const fs = 48000;
    const notch = designBiquad({ type: 'notch', frequencyHz: 12000, q: 5 }, fs);
    const hp = designBiquad({ type: 'highPass', frequencyHz: 80 }, fs);
    const r = cascadeResponse([notch, hp], [0, 12000], fs);
    expect(r.magnitudeDb[0]).toBe(-300);
    expect(r.magnitudeDb[1]).toBeLessThan(-200);
    for (const v of [...r.phaseDeg, ...r.groupDelayMs]) expect(Number.isFinite(v)).toBe(true);
  });

  it('wraps phase to (−180°, 180°]', () => {
    const fs = 48000;
    const allPasses = [100, 200, 400, 800].map((f) => designBiquad({ type: 'allPass', frequencyHz: f }, fs));
    const r = cascadeResponse(allPasses, logSweep(20, 20000, 24), fs);
    expect(Math.min(...r.phaseDeg)).toBeGreaterThan(-180);
    expect(Math.max(...r.phaseDeg)).toBeLessThanOrEqual(180);
  });

  it.each([
    [[-1], '/frequenciesHz/0'],
    [[100, 24000.5], '/frequenciesHz/1'],
    [[100, NaN], '/frequenciesHz/1'],
  ])('refuses frequencies %p outside 0..Nyquist', (frequencies, field) => {
    expect(catchInputError(() => cascadeResponse([], frequencies, 48000)).field).toBe(field);
  });

  it('refuses a section with a non-finite coefficient', () => {
    const bad = { b0: 1, b1: 0, b2: 0, a1: Infinity, a2: 0 };
    expect(catchInputError(() => cascadeResponse([bad], [100], 48000)).field).toBe('/sections/0/a1');
  });
});

describe('parallelResponse', () => {
  const fs = 48000;
  const frequencies = logSweep(20, 20000, 6);

  it('one branch at unity gain equals the cascade response', () => {
    const sections = [designBiquad({ type: 'peaking', frequencyHz: 500, gainDb: 6, q: 2 }, fs)];
    const single = parallelResponse([{ sections, gain: 1 }], frequencies, fs);
    const cascade = cascadeResponse(sections, frequencies, fs);
    frequencies.forEach((f, i) => {
      expectWithin(single.magnitudeDb[i], cascade.magnitudeDb[i], 1e-9, `${f} Hz dB`);
      expectWithin(wrappedDifferenceDeg(single.phaseDeg[i], cascade.phaseDeg[i]), 0, 1e-9, `${f} Hz °`);
      expectWithin(single.groupDelayMs[i], cascade.groupDelayMs[i], 1e-9, `${f} Hz ms`);
    });
  });

  it('a branch minus itself is a null: −300 dB and group delay 0', () => {
    const sections = [designBiquad({ type: 'lowPass', frequencyHz: 80 }, fs)];
    const r = parallelResponse(
      [
        { sections, gain: 1 },
        { sections, gain: -1 },
      ],
      frequencies,
      fs,
    );
    expect(r.magnitudeDb.every((db) => db === -300)).toBe(true);
    expect(r.groupDelayMs.every((ms) => ms === 0)).toBe(true);
  });

  it('a gain of 2 adds 20·log10(2) = 6.0206 dB', () => {
    const sections = [designBiquad({ type: 'highShelf', frequencyHz: 4000, gainDb: -3 }, fs)];
    const doubled = parallelResponse([{ sections, gain: 2 }], frequencies, fs);
    const cascade = cascadeResponse(sections, frequencies, fs);
    frequencies.forEach((f, i) =>
      expectWithin(doubled.magnitudeDb[i] - cascade.magnitudeDb[i], 6.0206, 1e-4, `${f} Hz`),
    );
  });
});

describe('isStable', () => {
  it('is true for designed sections and false for poles on or outside the unit circle', () => {
    expect(isStable(designBiquad({ type: 'lowPass', frequencyHz: 20, q: 100 }, 192000))).toBe(true);
    expect(isStable({ b0: 1, b1: 0, b2: 0, a1: -0.99, a2: 0 })).toBe(true);
    expect(isStable({ b0: 1, b1: 0, b2: 0, a1: -1, a2: 0 })).toBe(false);
    expect(isStable({ b0: 1, b1: 0, b2: 0, a1: 0, a2: 1 })).toBe(false);
    expect(isStable({ b0: 1, b1: 0, b2: 0, a1: 0, a2: -1.01 })).toBe(false);
    expect(isStable({ b0: 1, b1: 0, b2: 0, a1: 1.95, a2: 0.9 })).toBe(false);
    expect(isStable({ b0: 1, b1: 0, b2: 0, a1: NaN, a2: 0 })).toBe(false);
  });

  it('agrees with the pole radii from the quadratic formula for random denominators', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -3, max: 3, noNaN: true }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        (a1, a2) => {
          const section = { b0: 1, b1: 0, b2: 0, a1, a2 };
          const radius = Math.max(...polesOf(section).map((p) => Math.hypot(p.re, p.im)));
          fc.pre(Math.abs(radius - 1) > 1e-9);
          return isStable(section) === radius < 1;
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe('sosfreqz and sosMagnitudeDb', () => {
  const fs = 48000;
  const sections = sampleCascade(fs);
  const frequencies = logSweep(10, 23990, 12);

  it('sosfreqz is the complex H of a direct evaluation (1e-12 relative)', () => {
    const h = sosfreqz(sections, frequencies, fs);
    frequencies.forEach((f, i) => {
      const ref = referenceResponse(sections, f, fs);
      const size = Math.hypot(ref.re, ref.im);
      expectWithin(h.re[i], ref.re, 1e-12 * size, `${f} Hz re`);
      expectWithin(h.im[i], ref.im, 1e-12 * size, `${f} Hz im`);
    });
  });

  it('sosMagnitudeDb equals the magnitude of cascadeResponse (1e-9 dB)', () => {
    const fast = sosMagnitudeDb(sections, unitCircle(frequencies, fs));
    const full = cascadeResponse(sections, frequencies, fs);
    frequencies.forEach((f, i) => expectWithin(fast[i], full.magnitudeDb[i], 1e-9, `${f} Hz`));
    expect(Array.from(sosMagnitudeDb([], unitCircle(frequencies, fs)))).toEqual(frequencies.map(() => 0));
  });

  // The notch numerator 1 − 2cos(w0)·z⁻¹ + z⁻² is a symmetric FIR, so it has linear phase with a delay of
  // exactly one sample (Oppenheim & Schafer, generalised linear phase); at its zero the phase jumps and
  // group delay is undefined, reported as 0 (scipy.signal.group_delay's convention).
  it('a notch numerator alone delays by exactly one sample, and 0 is reported at its zero', () => {
    const notch = designBiquad({ type: 'notch', frequencyHz: 1000, q: 2 }, fs);
    const numerator = { b0: 1, b1: notch.b1 / notch.b0, b2: 1, a1: 0, a2: 0 };
    const r = cascadeResponse([numerator], [100, 500, 999, 1001, 5000, 1000], fs);
    r.groupDelayMs.slice(0, 5).forEach((ms) => expectWithin(ms, 1000 / fs, 1e-9, 'one sample'));
    expect(r.groupDelayMs[5]).toBe(0);
    expect(r.magnitudeDb[5]).toBeLessThan(-200);
  });
});
