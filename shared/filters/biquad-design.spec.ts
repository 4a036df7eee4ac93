import { designBiquad, designBiquads, FILTER_TYPES, FilterSpec, FilterType } from './biquad-design';
import { isStable } from '../dsp/sos';
import { CalculationInputError } from '../errors';
import {
  catchInputError,
  expectWithin,
  logSweep,
  polesOf,
  referenceDb,
  referenceResponse,
} from './test-helpers';
import { WebAudioBiquadType, WebAudioJob, webAudioResponses } from '../../tests/reference/web-audio';

const SAMPLE_RATES = [44100, 48000, 96000];
const BUTTERWORTH_Q = Math.SQRT1_2;
/** 20·log10(1/√2): the gain of a Q = 1/√2 low/high-pass at f0. */
const MINUS_3_DB = 20 * Math.log10(Math.SQRT1_2);
/** Double-precision property checks: the formulas are exact, so only rounding remains. */
const EXACT_DB = 1e-9;

describe('designBiquad — Audio EQ Cookbook properties (W3C Working Group Note, 8 June 2021)', () => {
  const corners = [31.5, 80, 1000, 8000, 15000];

  it.each(SAMPLE_RATES)(
    'lowPass and highPass gain at f0 equals Q, −3.0103 dB for Q = 1/√2 (fs %d Hz)',
    (fs) => {
      for (const f0 of corners) {
        for (const q of [0.5, BUTTERWORTH_Q, 1, 2.563, 10]) {
          for (const type of ['lowPass', 'highPass'] as const) {
            const s = designBiquad({ type, frequencyHz: f0, q }, fs);
            expectWithin(referenceDb([s], f0, fs), 20 * Math.log10(q), EXACT_DB, `${type} ${f0} Hz Q ${q}`);
          }
        }
        const lp = designBiquad({ type: 'lowPass', frequencyHz: f0 }, fs);
        expectWithin(referenceDb([lp], f0, fs), -3.0103, 1e-4, 'default Q is Butterworth');
        expectWithin(referenceDb([lp], 0, fs), 0, EXACT_DB, 'lowPass DC gain');
      }
    },
  );

  it.each(SAMPLE_RATES)('peaking gives its gain at f0 and 0 dB at DC and Nyquist (fs %d Hz)', (fs) => {
    for (const f0 of corners) {
      for (const gainDb of [-24, -6, -0.5, 3, 12]) {
        for (const q of [0.3, 1.41, 8]) {
          const s = designBiquad({ type: 'peaking', frequencyHz: f0, gainDb, q }, fs);
          expectWithin(referenceDb([s], f0, fs), gainDb, EXACT_DB, `peak at f0 ${f0} ${gainDb} dB`);
          expectWithin(referenceDb([s], 0, fs), 0, EXACT_DB, 'DC');
          expectWithin(referenceDb([s], fs / 2, fs), 0, EXACT_DB, 'Nyquist');
        }
      }
    }
  });

  it('a +N dB and a −N dB peaking section with equal f0 and Q multiply to 0 dB everywhere', () => {
    for (const fs of SAMPLE_RATES) {
      for (const n of [1, 6, 18]) {
        const boost = designBiquad({ type: 'peaking', frequencyHz: 250, gainDb: n, q: 2 }, fs);
        const cut = designBiquad({ type: 'peaking', frequencyHz: 250, gainDb: -n, q: 2 }, fs);
        for (const f of logSweep(5, fs / 2, 6))
          expectWithin(referenceDb([boost, cut], f, fs), 0, EXACT_DB, `${f} Hz`);
      }
    }
  });

  it.each(SAMPLE_RATES)(
    'shelves are at half their gain at f0 and reach full gain at the far end (fs %d Hz)',
    (fs) => {
      for (const f0 of [80, 1000, 8000]) {
        for (const gainDb of [-12, -3, 4, 10]) {
          for (const extra of [{}, { shelfSlope: 0.5 }, { q: 0.9 }]) {
            const low = designBiquad({ type: 'lowShelf', frequencyHz: f0, gainDb, ...extra }, fs);
            const high = designBiquad({ type: 'highShelf', frequencyHz: f0, gainDb, ...extra }, fs);
            expectWithin(referenceDb([low], f0, fs), gainDb / 2, EXACT_DB, 'lowShelf at f0');
            expectWithin(referenceDb([high], f0, fs), gainDb / 2, EXACT_DB, 'highShelf at f0');
            expectWithin(referenceDb([low], 0, fs), gainDb, EXACT_DB, 'lowShelf at DC');
            expectWithin(referenceDb([low], fs / 2, fs), 0, EXACT_DB, 'lowShelf at Nyquist');
            expectWithin(referenceDb([high], fs / 2, fs), gainDb, EXACT_DB, 'highShelf at Nyquist');
            expectWithin(referenceDb([high], 0, fs), 0, EXACT_DB, 'highShelf at DC');
          }
        }
      }
    },
  );

  it('the notch has its zeros on the unit circle at f0 and is 0 dB at DC and Nyquist', () => {
    for (const fs of SAMPLE_RATES) {
      for (const f0 of [50, 60, 1000, 12000]) {
        const s = designBiquad({ type: 'notch', frequencyHz: f0, q: 10 }, fs);
        // Zeros of b0 + b1 z^-1 + b2 z^-2, found like poles of a section with a1 = b1/b0, a2 = b2/b0.
        for (const zero of polesOf({ b0: 1, b1: 0, b2: 0, a1: s.b1 / s.b0, a2: s.b2 / s.b0 })) {
          expectWithin(Math.hypot(zero.re, zero.im), 1, 1e-12, 'zero radius');
          expectWithin(
            Math.abs(Math.atan2(zero.im, zero.re)),
            (2 * Math.PI * f0) / fs,
            1e-9,
            'zero angle (rad)',
          );
        }
        // Rounding of ω leaves |H(f0)| near 1e-11 with Q = 10; below 1e-9 is −180 dB.
        const h = referenceResponse([s], f0, fs);
        expect(Math.hypot(h.re, h.im)).toBeLessThan(1e-9);
        expectWithin(referenceDb([s], 0, fs), 0, EXACT_DB, 'DC');
        expectWithin(referenceDb([s], fs / 2, fs), 0, EXACT_DB, 'Nyquist');
      }
    }
  });

  it('the all-pass is 0 dB everywhere and −180° at f0', () => {
    for (const fs of SAMPLE_RATES) {
      const s = designBiquad({ type: 'allPass', frequencyHz: 700, q: 0.8 }, fs);
      for (const f of logSweep(5, fs / 2, 6)) expectWithin(referenceDb([s], f, fs), 0, EXACT_DB, `${f} Hz`);
      const h = referenceResponse([s], 700, fs);
      expectWithin(Math.abs(Math.atan2(h.im, h.re)), Math.PI, 1e-9, 'phase at f0 (rad)');
    }
  });

  it('bandPass is the constant 0 dB peak variant: 0 dB at f0 whatever the Q', () => {
    for (const fs of SAMPLE_RATES) {
      for (const q of [0.2, 1, 30]) {
        const s = designBiquad({ type: 'bandPass', frequencyHz: 2000, q }, fs);
        expectWithin(referenceDb([s], 2000, fs), 0, EXACT_DB, `Q ${q}`);
      }
    }
  });

  // Cookbook: BW is between −3 dB points for BPF and between midpoint (gain/2) points for peaking.
  // The digital bandwidth mapping is an approximation (Audio EQ Cookbook, W3C Note 2021): measured here −0.41 % at
  // f0 = fs/12 and −1.06 % at fs/8 for 1 octave, so 0.5 % and 2 % are the stated tolerances.
  it('bandwidthOctaves matches the measured bandwidth (0.5 % below fs/12, 2 % up to fs/8)', () => {
    const edge = (s: ReturnType<typeof designBiquad>, fs: number, f0: number, level: number, up: boolean) => {
      let inside = f0;
      let outside = up ? fs / 2 : 1e-3;
      for (let i = 0; i < 100; i++) {
        const mid = Math.sqrt(inside * outside);
        if (referenceDb([s], mid, fs) > level) inside = mid;
        else outside = mid;
      }
      return Math.sqrt(inside * outside);
    };
    for (const fs of SAMPLE_RATES) {
      for (const [f0, tolerance] of [
        [100, 0.005],
        [fs / 12, 0.005],
        [fs / 8, 0.02],
      ]) {
        for (const bw of [0.25, 0.5, 1]) {
          const bp = designBiquad({ type: 'bandPass', frequencyHz: f0, bandwidthOctaves: bw }, fs);
          const measuredBp = Math.log2(
            edge(bp, fs, f0, MINUS_3_DB, true) / edge(bp, fs, f0, MINUS_3_DB, false),
          );
          expectWithin(measuredBp, bw, bw * tolerance, `bandPass ${f0} Hz ${bw} oct`);
          const pk = designBiquad({ type: 'peaking', frequencyHz: f0, bandwidthOctaves: bw, gainDb: 9 }, fs);
          const measuredPk = Math.log2(edge(pk, fs, f0, 4.5, true) / edge(pk, fs, f0, 4.5, false));
          expectWithin(measuredPk, bw, bw * tolerance, `peaking ${f0} Hz ${bw} oct`);
        }
      }
    }
  });

  it('every design over a sweep of type, frequency, Q, gain and sample rate has its poles inside the unit circle', () => {
    let checked = 0;
    for (const fs of [8000, ...SAMPLE_RATES, 192000]) {
      for (const type of FILTER_TYPES) {
        for (const f0 of [1, 20, 200, 2000, fs / 4, fs / 2 - 1]) {
          for (const q of [0.025, 0.5, 4, 100]) {
            const gainDb = ['peaking', 'lowShelf', 'highShelf'].includes(type)
              ? -48 + (checked % 73)
              : undefined;
            const s = designBiquad({ type, frequencyHz: f0, q, gainDb }, fs);
            const radii = polesOf(s).map((p) => Math.hypot(p.re, p.im));
            expect(Math.max(...radii)).toBeLessThan(1);
            expect(isStable(s)).toBe(true);
            checked++;
          }
        }
      }
    }
    expect(checked).toBe(5 * 8 * 6 * 4);
  });
});

describe('designBiquad — agreement with independent implementations', () => {
  // Web Audio API (node-web-audio-api 2.x, a Rust implementation): lowpass/highpass Q is in dB,
  // shelves use S = 1, bandpass is the 0 dB-peak variant. Its response is float32: measured worst
  // differences here were 4.2e-5 dB and 8.5e-5° where the response is above −40 dB, so the
  // stated tolerances are 1e-4 dB and 1e-3°; points below −40 dB are skipped (float32 noise).
  const webAudioType: Record<FilterType, WebAudioBiquadType> = {
    peaking: 'peaking',
    lowShelf: 'lowshelf',
    highShelf: 'highshelf',
    lowPass: 'lowpass',
    highPass: 'highpass',
    bandPass: 'bandpass',
    notch: 'notch',
    allPass: 'allpass',
  };

  it('matches BiquadFilterNode.getFrequencyResponse over a sweep of type, f0, Q, gain and sample rate', () => {
    const cases: { spec: FilterSpec; fs: number }[] = [];
    const jobs: WebAudioJob[] = [];
    for (const fs of SAMPLE_RATES) {
      for (const type of FILTER_TYPES) {
        const shelf = type === 'lowShelf' || type === 'highShelf';
        const gained = shelf || type === 'peaking';
        for (const f0 of [31.5, 100, 1000, 8000, 16000]) {
          for (const q of shelf ? [undefined] : [0.5, BUTTERWORTH_Q, 2, 8]) {
            for (const gainDb of gained ? [-12, -3, 6, 15] : [undefined]) {
              cases.push({ spec: { type, frequencyHz: f0, q, gainDb }, fs });
              const qForNode =
                q === undefined ? 1 : type === 'lowPass' || type === 'highPass' ? 20 * Math.log10(q) : q;
              jobs.push({
                sampleRateHz: fs,
                frequenciesHz: logSweep(10, fs / 2 - 1, 24),
                biquad: { type: webAudioType[type], frequency: f0, Q: qForNode, gain: gainDb ?? 0 },
              });
            }
          }
        }
      }
    }
    const answers = webAudioResponses(jobs);
    let compared = 0;
    cases.forEach(({ spec, fs }, k) => {
      const ours = designBiquad(spec, fs);
      const { frequenciesHz, magnitude, phaseRad } = answers[k];
      frequenciesHz.forEach((f, i) => {
        const refDb = 20 * Math.log10(magnitude[i]);
        if (refDb < -40) return;
        const what = `${spec.type} ${spec.frequencyHz} Hz Q ${spec.q} ${spec.gainDb} dB fs ${fs} at ${f} Hz`;
        const h = referenceResponse([ours], f, fs);
        expectWithin(20 * Math.log10(Math.hypot(h.re, h.im)), refDb, 1e-4, `${what} (dB)`);
        const phaseDiff = ((Math.atan2(h.im, h.re) - phaseRad[i]) * 180) / Math.PI;
        expectWithin(phaseDiff - 360 * Math.round(phaseDiff / 360), 0, 1e-3, `${what} (degrees)`);
        compared++;
      });
    });
    expect(compared).toBeGreaterThan(50000);
  });

  // fili 2.x implements the same cookbook table in double precision (its `a` array uses the same
  // +a1, +a2 sign; `bandstop` is the notch, `peak` the peaking EQ), so coefficients agree to rounding.
  it('matches fili coefficients to 1e-12 over a sweep of type, frequency, Q, gain and sample rate', () => {
    const filiName: Partial<Record<FilterType, string>> = {
      peaking: 'peak',
      lowShelf: 'lowshelf',
      highShelf: 'highshelf',
      lowPass: 'lowpass',
      highPass: 'highpass',
      bandPass: 'bandpass',
      notch: 'bandstop',
      allPass: 'allpass',
    };
    let compared = 0;
    for (const fs of SAMPLE_RATES) {
      for (const type of FILTER_TYPES) {
        for (const f0 of [40, 315, 2500, 12500]) {
          for (const q of [0.4, 1, 3.3]) {
            for (const gainDb of [-9, 5]) {
              const gained = ['peaking', 'lowShelf', 'highShelf'].includes(type);
              const ours = designBiquad(
                { type, frequencyHz: f0, q, gainDb: gained ? gainDb : undefined },
                fs,
              );
              const stage = filiStage(filiName[type]!, { Fs: fs, Fc: f0, Q: q, gain: gainDb });
              expectWithin(ours.b0, stage.b[0], 1e-12, `${type} b0`);
              expectWithin(ours.b1, stage.b[1], 1e-12, `${type} b1`);
              expectWithin(ours.b2, stage.b[2], 1e-12, `${type} b2`);
              expectWithin(ours.a1, stage.a[0], 1e-12, `${type} a1`);
              expectWithin(ours.a2, stage.a[1], 1e-12, `${type} a2`);
              compared++;
            }
          }
        }
      }
    }
    expect(compared).toBe(3 * 8 * 4 * 3 * 2);
  });

  it('matches fili for bandwidth-specified bandPass and notch (BW in octaves)', () => {
    for (const fs of SAMPLE_RATES) {
      for (const bw of [0.3, 1, 2]) {
        for (const [type, name] of [
          ['bandPass', 'bandpass'],
          ['notch', 'bandstop'],
        ] as const) {
          const ours = designBiquad({ type, frequencyHz: 1000, bandwidthOctaves: bw }, fs);
          const ref = filiStage(name, { Fs: fs, Fc: 1000, Q: 1, BW: bw });
          expectWithin(ours.b0, ref.b[0], 1e-12, 'b0');
          expectWithin(ours.b2, ref.b[2], 1e-12, 'b2');
          expectWithin(ours.a1, ref.a[0], 1e-12, 'a1');
          expectWithin(ours.a2, ref.a[1], 1e-12, 'a2');
        }
      }
    }
  });
});

describe('designBiquad — input checks', () => {
  const fs = 48000;
  it.each([
    ['frequency 0', { type: 'lowPass', frequencyHz: 0 }, '/frequencyHz'],
    ['a negative frequency', { type: 'lowPass', frequencyHz: -100 }, '/frequencyHz'],
    ['a frequency below 1 Hz', { type: 'peaking', frequencyHz: 0.5, gainDb: 3 }, '/frequencyHz'],
    ['a frequency at Nyquist', { type: 'lowPass', frequencyHz: 24000 }, '/frequencyHz'],
    ['a frequency above Nyquist', { type: 'highPass', frequencyHz: 30000 }, '/frequencyHz'],
    ['a NaN frequency', { type: 'lowPass', frequencyHz: NaN }, '/frequencyHz'],
    ['an infinite frequency', { type: 'lowPass', frequencyHz: Infinity }, '/frequencyHz'],
    ['peaking without gain', { type: 'peaking', frequencyHz: 1000 }, '/gainDb'],
    ['gain on a low-pass', { type: 'lowPass', frequencyHz: 1000, gainDb: 3 }, '/gainDb'],
    ['gain above +24 dB', { type: 'peaking', frequencyHz: 1000, gainDb: 24.5 }, '/gainDb'],
    ['gain below −48 dB', { type: 'lowShelf', frequencyHz: 1000, gainDb: -60 }, '/gainDb'],
    ['Q of 0', { type: 'notch', frequencyHz: 1000, q: 0 }, '/q'],
    ['Q below 0.025', { type: 'notch', frequencyHz: 1000, q: 0.01 }, '/q'],
    ['Q above 100', { type: 'bandPass', frequencyHz: 1000, q: 101 }, '/q'],
    [
      'both Q and bandwidth',
      { type: 'bandPass', frequencyHz: 1000, q: 1, bandwidthOctaves: 1 },
      '/bandwidthOctaves',
    ],
    [
      'bandwidth on a low-pass',
      { type: 'lowPass', frequencyHz: 1000, bandwidthOctaves: 1 },
      '/bandwidthOctaves',
    ],
    [
      'bandwidth below 0.01 octave',
      { type: 'notch', frequencyHz: 1000, bandwidthOctaves: 0.001 },
      '/bandwidthOctaves',
    ],
    [
      'bandwidth above 8 octaves',
      { type: 'notch', frequencyHz: 1000, bandwidthOctaves: 9 },
      '/bandwidthOctaves',
    ],
    [
      'a too-wide bandwidth near Nyquist',
      { type: 'notch', frequencyHz: 23999.99, bandwidthOctaves: 8 },
      '/bandwidthOctaves',
    ],
    [
      'shelf slope on a peaking filter',
      { type: 'peaking', frequencyHz: 1000, gainDb: 3, shelfSlope: 1 },
      '/shelfSlope',
    ],
    [
      'shelf slope above 1',
      { type: 'lowShelf', frequencyHz: 1000, gainDb: 3, shelfSlope: 1.5 },
      '/shelfSlope',
    ],
    ['shelf slope of 0', { type: 'highShelf', frequencyHz: 1000, gainDb: 3, shelfSlope: 0 }, '/shelfSlope'],
    ['an unknown type', { type: 'comb', frequencyHz: 1000 }, '/type'],
  ])('refuses %s, naming the field', (_label, spec, field) => {
    const error = catchInputError(() => designBiquad(spec as FilterSpec, fs));
    expect(error.field).toBe(field);
    expect(error.message).toMatch(/received|only|required|give|too wide|must be/);
  });

  it('names the valid range and the value received', () => {
    expect(catchInputError(() => designBiquad({ type: 'lowPass', frequencyHz: 30000 }, fs)).message).toBe(
      'frequencyHz must be at least 1 Hz and below 24000 Hz; received 30000 Hz',
    );
  });

  // The sample-rate range is the contract's to check (tests/api); the core refuses only what cannot exist.
  it.each([0, NaN, 200])('refuses a filter at or above Nyquist (sample rate %d Hz)', (rate) => {
    expect(catchInputError(() => designBiquad({ type: 'lowPass', frequencyHz: 100 }, rate)).field).toBe(
      '/frequencyHz',
    );
  });

  it('designBiquads names the item in a list', () => {
    const error = catchInputError(() =>
      designBiquads(
        [
          { type: 'peaking', frequencyHz: 100, gainDb: -3 },
          { type: 'peaking', frequencyHz: 100, gainDb: -3, q: 500 },
        ],
        fs,
      ),
    );
    expect(error.field).toBe('/filters/1/q');
  });
});

interface FiliStage {
  a: number[];
  b: number[];
}

/**
 * One fili cookbook stage with an explicit Q. Its cascade helper derives Q from the Butterworth
 * formula, so the stage designer (fili/src/iirCoeffs, plain CommonJS without types) is called directly.
 */
function filiStage(
  name: string,
  params: { Fs: number; Fc: number; Q: number; gain?: number; BW?: number },
): FiliStage {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const IirCoeffs = require('fili/src/iirCoeffs');
  return new IirCoeffs()[name]({ ...params });
}

describe('designBiquad — bandwidth near Nyquist', () => {
  // Audio EQ Cookbook (W3C Note, 2021): alpha = sin(w0)·sinh(ln2/2·BW·w0/sin(w0)) grows without bound as
  // w0 → π. A design either comes out stable (poles inside the unit circle) or is refused on the field.
  it.each(['notch', 'bandPass', 'peaking'] as const)(
    '%s: stable or refused naming /bandwidthOctaves',
    (type) => {
      const fs = 328405;
      let refused = 0;
      for (const ratio of [0.3, 0.4, 0.45, 0.47, 0.4705, 0.49, 0.499]) {
        for (const bw of [1, 2, 4, 6, 7.16, 8]) {
          const spec: FilterSpec = {
            type,
            frequencyHz: ratio * fs,
            bandwidthOctaves: bw,
            gainDb: type === 'peaking' ? 6 : undefined,
          };
          try {
            expect(isStable(designBiquad(spec, fs))).toBe(true);
          } catch (error) {
            if (!(error instanceof CalculationInputError)) throw error;
            expect(error.field).toBe('/bandwidthOctaves');
            refused += 1;
          }
        }
      }
      // The case found by the property test (154,508 Hz, 7.16 octaves at 328,405 Hz) is among the refused.
      expect(refused).toBeGreaterThan(0);
    },
  );
});
