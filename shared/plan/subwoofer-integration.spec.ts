import { logFrequencyGrid } from '../dsp/grid';
import { designCrossover } from '../filters/crossover';
import { referenceResponse } from '../filters/test-helpers';
import { integrateSubwoofer, unwrapDegrees, type ComplexResponse } from './subwoofer-integration';

const fs = 48000;
const grid = logFrequencyGrid(10, 1000, 96);

/** A loudspeaker that is a pure delay of `ms` (and a gain, and a polarity): flat magnitude, phase −360·f·t. */
function pureDelay(ms: number, gainDb = 0, inverted = false): ComplexResponse {
  return {
    frequenciesHz: grid,
    magnitudeDb: grid.map(() => gainDb),
    phaseDeg: grid.map((f) => {
      const p = -360 * f * (ms / 1000) + (inverted ? 180 : 0);
      return p - 360 * Math.round(p / 360); // wrapped, as a measurement tool writes it
    }),
  };
}

/*
 * Linkwitz-Riley sum properties (S. H. Linkwitz, "Active Crossover Networks for Noncoincident Drivers",
 * JAES 24(1), 1976, from memory): LR4's low-pass and high-pass are in phase at every frequency and sum to an
 * all-pass (|LP + HP| = 1); LR2's outputs are 180° apart, so LP − HP is the all-pass. So when the
 * subwoofer and a main are pure delays, their sum through the crossover is flat at 0 dB exactly when both
 * paths arrive together with the right polarity — a known extra delay or inversion of the subwoofer path
 * must be undone by the chosen setting.
 */
describe('integrateSubwoofer (synthetic responses, Linkwitz-Riley sum properties)', () => {
  const lr4 = designCrossover({ family: 'linkwitzRiley', order: 4, frequencyHz: 80 }, fs);
  // Mains: left at 9.070 ms and a rear at 7.425 ms, delayed so both arrive at 20 ms.
  const mains = [
    { id: 'M+030', response: pureDelay(9.07), delayMs: 20 - 9.07, gainDb: 0, polarity: 'normal' as const },
    { id: 'M-135', response: pureDelay(7.425), delayMs: 20 - 7.425, gainDb: 0, polarity: 'normal' as const },
  ];
  // The subwoofer's time of flight is 10.634 ms and its own path adds a known 2.5 ms (its DSP, say).
  const extraMs = 2.5;
  const subArrivalMs = 10.634 + extraMs;
  const expectedDelayMs = 20 - subArrivalMs; // 6.866 ms = 329.57 samples

  it.each([
    ['normal', false],
    ['inverted', true],
  ] as const)(
    'recovers the extra delay within one sample and the polarity (%s sub)',
    (polarity, inverted) => {
      const result = integrateSubwoofer({
        sub: { response: pureDelay(subArrivalMs, 0, inverted), gainDb: 0 },
        mains,
        lowPass: lr4.lowPass.sections,
        highPass: lr4.highPass.sections,
        crossoverHz: 80,
        sampleRateHz: fs,
        delayMaxMs: 75,
      });
      expect(Math.abs(result.chosen.delaySamples - (expectedDelayMs * fs) / 1000)).toBeLessThanOrEqual(1);
      expect(result.chosen.polarity).toBe(polarity);
      expect(result.band).toEqual({ fromHz: 40, toHz: 160 });
      // All-pass sum: flat at 0 dB over the band, to the error of a 0.43-sample offset (< 0.01 dB here).
      for (const s of result.summed) for (const db of s.magnitudeDb) expect(Math.abs(db)).toBeLessThan(0.01);
      // In phase everywhere: the sum reaches |LP·sub| + |HP·main| (summation 0 dB).
      expect(result.chosen.summationDb).toBeGreaterThan(-0.01);
      // Runners-up are real alternatives: worse, distinct, and at least a few milliseconds away or the other polarity.
      expect(result.runnersUp.length).toBeGreaterThanOrEqual(2);
      expect(result.runnersUp.length).toBeLessThanOrEqual(3);
      for (const r of result.runnersUp) {
        expect(r.scoreDb).toBeLessThan(result.chosen.scoreDb);
        expect(r.polarity !== result.chosen.polarity || Math.abs(r.delayMs - result.chosen.delayMs) > 2).toBe(
          true,
        );
      }
    },
  );

  it('LR2: the mains high-pass inverted, the subwoofer normal, still recovers the delay', () => {
    const lr2 = designCrossover({ family: 'linkwitzRiley', order: 2, frequencyHz: 80 }, fs);
    const result = integrateSubwoofer({
      sub: { response: pureDelay(subArrivalMs), gainDb: 0 },
      mains: mains.map((m) => ({ ...m, polarity: lr2.highPassPolarity })),
      lowPass: lr2.lowPass.sections,
      highPass: lr2.highPass.sections,
      crossoverHz: 80,
      sampleRateHz: fs,
      delayMaxMs: 75,
    });
    expect(lr2.highPassPolarity).toBe('inverted');
    expect(Math.abs(result.chosen.delaySamples - (expectedDelayMs * fs) / 1000)).toBeLessThanOrEqual(1);
    expect(result.chosen.polarity).toBe('normal');
  });

  it('the summed response equals an independent evaluation of LP·sub + HP·main at the chosen setting', () => {
    const result = integrateSubwoofer({
      sub: { response: pureDelay(subArrivalMs, -3), gainDb: 1.5 },
      mains: [mains[0]],
      lowPass: lr4.lowPass.sections,
      highPass: lr4.highPass.sections,
      crossoverHz: 80,
      sampleRateHz: fs,
      delayMaxMs: 40,
    });
    const d = result.chosen.delayMs / 1000;
    const sign = result.chosen.polarity === 'inverted' ? -1 : 1;
    result.summed[0].frequenciesHz.forEach((f, i) => {
      const lp = referenceResponse(lr4.lowPass.sections, f, fs);
      const hp = referenceResponse(lr4.highPass.sections, f, fs);
      const w = 2 * Math.PI * f;
      const sub = { a: sign * 10 ** (-1.5 / 20), p: -w * (subArrivalMs / 1000 + d) };
      const main = { a: 1, p: -w * (9.07 / 1000 + mains[0].delayMs / 1000) };
      const re =
        sub.a * (lp.re * Math.cos(sub.p) - lp.im * Math.sin(sub.p)) +
        main.a * (hp.re * Math.cos(main.p) - hp.im * Math.sin(main.p));
      const im =
        sub.a * (lp.re * Math.sin(sub.p) + lp.im * Math.cos(sub.p)) +
        main.a * (hp.re * Math.sin(main.p) + hp.im * Math.cos(main.p));
      expect(result.summed[0].magnitudeDb[i]).toBeCloseTo(10 * Math.log10(re * re + im * im), 6);
    });
  });

  it('keeps the delay within the limit, and refuses a response that misses the band', () => {
    const limited = integrateSubwoofer({
      sub: { response: pureDelay(subArrivalMs), gainDb: 0 },
      mains,
      lowPass: lr4.lowPass.sections,
      highPass: lr4.highPass.sections,
      crossoverHz: 80,
      sampleRateHz: fs,
      delayMaxMs: 3,
    });
    expect(limited.chosen.delayMs).toBeLessThanOrEqual(3);
    const short = { ...pureDelay(10), frequenciesHz: grid.map((f) => f + 100) };
    expect(() =>
      integrateSubwoofer({
        sub: { response: short, gainDb: 0 },
        mains,
        lowPass: lr4.lowPass.sections,
        highPass: lr4.highPass.sections,
        crossoverHz: 80,
        sampleRateHz: fs,
        delayMaxMs: 75,
      }),
    ).toThrow(expect.objectContaining({ field: '/sub' }));
  });

  it('unwraps phase like numpy.unwrap (degrees)', () => {
    expect(unwrapDegrees([170, -170, -10, 170])).toEqual([170, 190, 350, 530]);
  });
});
