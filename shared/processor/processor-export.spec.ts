import fc from 'fast-check';
import { webAudioResponses } from '../../tests/reference/web-audio';
import { designBiquad } from '../filters/biquad-design';
import { designCrossover } from '../filters/crossover';
import type { TuningSettings } from '../plan/tuning';
import { processorExportToCsv } from './export-csv';
import {
  EXACT_LAYOUT,
  exportForProcessor,
  roundFrequency,
  roundToStep,
  type ExportProfile,
} from './processor-export';

const profile = (
  over: Partial<ExportProfile> = {},
  coefficients: Partial<ExportProfile['coefficients']> = {},
) => ({
  delay: { unit: 'ms' as const, min: 0, max: 75, step: 0.01 },
  trimDb: { min: -12, max: 12, step: 0.1 },
  eq: {
    frequencyHz: { min: 20, max: 20000, step: 1 },
    frequencyStepUnit: 'hz' as const,
    gainDb: { min: -12, max: 6, step: 0.1 },
    q: { min: 0.3, max: 10, step: 0.01 },
  },
  ...over,
  coefficients: {
    order: ['b0', 'b1', 'b2', 'a1', 'a2'] as ExportProfile['coefficients']['order'],
    feedbackSign: 'plus' as const,
    numberFormat: 'decimal' as const,
    decimalPlaces: 9,
    ...coefficients,
  },
});

const STAGE3ISH: TuningSettings = {
  sampleRateHz: 48000,
  channels: [
    {
      id: 'M+030',
      name: 'Left',
      delayMs: 1.5636,
      trimDb: -1.6000000000000014,
      polarity: 'normal',
      eq: [
        { type: 'peaking', frequencyHz: 209.7, gainDb: -3.54, q: 2.304 },
        { type: 'peaking', frequencyHz: 1234.5, gainDb: -2.2, bandwidthOctaves: 0.7 },
      ],
      highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
      bassManaged: true,
    },
    {
      id: 'LFE1',
      delayMs: 4.18,
      trimDb: -1.2,
      polarity: 'inverted',
      eq: [{ type: 'peaking', frequencyHz: 42.37, gainDb: -7.81, q: 4.44 }],
      highPass: null,
      bassManaged: false,
    },
  ],
  subwoofer: {
    channel: 'LFE1',
    lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
    lfeGainDb: 10,
  },
};

describe('rounding to a processor’s steps', () => {
  it('removes float noise and rounds half away from the grid point as Math.round does', () => {
    expect(roundToStep(-1.6000000000000014, 0.1)).toBe(-1.6);
    expect(roundToStep(-1.66, 0.1)).toBe(-1.7);
    expect(roundToStep(1.5636, 0.01)).toBe(1.56);
    expect(roundToStep(3.3, 0)).toBe(3.3);
    // 1/6-octave steps from 1 kHz (ISO 266 reference): 1000·2^(-13/6) = 222.72 Hz is the nearest to 209.7 Hz? No:
    // log2(209.7/1000)·6 = −13.52 → −14 → 1000·2^(−14/6) = 198.43 Hz.
    expect(roundFrequency(209.7, 1 / 6, 'octave')).toBeCloseTo(1000 * Math.pow(2, -14 / 6), 9);
  });

  it('delay in ms and in samples come from one quantised value, whatever the unit (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 75, noNaN: true }),
        fc.constantFrom(44100, 48000, 96000),
        fc.constantFrom<['ms' | 'samples', number]>(
          ['ms', 0.01],
          ['ms', 0.02],
          ['samples', 1],
          ['samples', 0.5],
        ),
        (delayMs, fs, [unit, step]) => {
          const settings: TuningSettings = {
            sampleRateHz: fs,
            channels: [{ ...STAGE3ISH.channels[1], delayMs, eq: [] }],
            subwoofer: null,
          };
          const p = profile({ delay: { unit, step, min: 0, max: 1e6 } });
          const [c] = exportForProcessor(settings, fs, p).channels;
          expect(c.delaySamples).toBeCloseTo((c.delayMs * fs) / 1000, 9);
          const inUnit = unit === 'ms' ? c.delayMs : c.delaySamples;
          expect(Math.abs(inUnit / step - Math.round(inUnit / step))).toBeLessThan(1e-9);
          expect(Math.abs(c.delayMs - delayMs)).toBeLessThanOrEqual(
            (unit === 'ms' ? step : (step * 1000) / fs) / 2 + 1e-9,
          );
        },
      ),
      { seed: 20261202, numRuns: 200 },
    );
  });

  it('EQ parameters on the steps, coefficients designed from them and written in the profile’s layout', () => {
    const p = profile(
      {},
      { order: ['a0', 'b0', 'b1', 'b2', 'a1', 'a2'], feedbackSign: 'minus', decimalPlaces: 6 },
    );
    const [left] = exportForProcessor(STAGE3ISH, 48000, p).channels;
    expect(left.trimDb).toBe(-1.6);
    expect(left.delayMs).toBe(1.56);
    const [band] = left.eq;
    expect(band).toMatchObject({ type: 'peaking', frequencyHz: 210, gainDb: -3.5, q: 2.3 });
    // Audio EQ Cookbook design of the rounded parameters, a0 written as 1, feedback negated, 6 decimals.
    const s = designBiquad({ type: 'peaking', frequencyHz: 210, gainDb: -3.5, q: 2.3 }, 48000);
    const six = (v: number) => Number(v.toFixed(6));
    expect(band.coefficients).toEqual([1, six(s.b0), six(s.b1), six(s.b2), -six(s.a1), -six(s.a2)]);
    // A band stored with a bandwidth is written with its equivalent Q: 1/Q = 2·sinh(ln2/2·BW·w0/sin w0).
    const w0 = (2 * Math.PI * 1234.5) / 48000;
    expect(left.eq[1].q).toBeCloseTo(
      Number((1 / (2 * Math.sinh(((Math.LN2 / 2) * 0.7 * w0) / Math.sin(w0)))).toFixed(2)),
      12,
    );
    // The high-pass: the LR4 at the rounded frequency, as designCrossover gives it.
    const hp = designCrossover({ family: 'linkwitzRiley', order: 4, frequencyHz: 80 }, 48000).highPass
      .sections;
    expect(left.highPass?.sections[0]).toEqual([
      1,
      six(hp[0].b0),
      six(hp[0].b1),
      six(hp[0].b2),
      -six(hp[0].a1),
      -six(hp[0].a2),
    ]);
  });

  it('float32: every coefficient is the nearest IEEE 754 single of the designed double', () => {
    const p = profile({}, { numberFormat: 'float32', decimalPlaces: undefined });
    const [, lfe] = exportForProcessor(STAGE3ISH, 48000, p).channels;
    const s = designBiquad({ type: 'peaking', frequencyHz: 42, gainDb: -7.8, q: 4.44 }, 48000);
    expect(lfe.eq[0].coefficients).toEqual([s.b0, s.b1, s.b2, s.a1, s.a2].map(Math.fround));
  });

  it('bass management: every managed channel routed to the subwoofer at 0 dB, the LFE at +10 dB, its delay and polarity', () => {
    const out = exportForProcessor(STAGE3ISH, 48000, profile());
    expect(out.bassManagement).toMatchObject({
      subwoofer: 'LFE1',
      lfeGainDb: 10,
      delayMs: 4.18,
      delaySamples: 4.18 * 48,
      polarity: 'inverted',
      lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
      routing: [
        { from: 'M+030', to: 'LFE1', gainDb: 0, via: 'lowPass' },
        { from: 'LFE1', to: 'LFE1', gainDb: 10, via: 'direct' },
      ],
    });
  });

  it('without a profile: whole samples, coefficients exactly as POST /v1/biquads designs them, no rounding cost', () => {
    const [left] = exportForProcessor(STAGE3ISH, 96000, EXACT_LAYOUT).channels;
    expect(left.delaySamples).toBe(Math.round(1.5636 * 96));
    expect(left.delayMs).toBe((left.delaySamples * 1000) / 96000);
    const s = designBiquad(STAGE3ISH.channels[0].eq[0], 96000);
    expect(left.eq[0].coefficients).toEqual([s.b0, s.b1, s.b2, s.a1, s.a2]);
    expect(left.eqRounding.maxDeviationDb).toBeLessThan(1e-9);
  });
});

describe('what rounding cost, against an independent evaluation (node-web-audio-api)', () => {
  // Reference: the exported coefficients, read back in the profile's layout (sign restored), run through
  // node-web-audio-api's IIRFilterNode; the designed EQ from the stored parameters through its
  // BiquadFilterNode (peaking, the cookbook with Q). Both responses are float32, so 0.01 dB.
  it.each([
    [
      'coarse steps: 1/6 octave, 0.5 dB, Q 0.1, 4 decimals',
      profile(
        {
          eq: {
            frequencyHz: { min: 20, max: 20000, step: 1 / 6 },
            frequencyStepUnit: 'octave',
            gainDb: { min: -12, max: 6, step: 0.5 },
            q: { min: 0.3, max: 10, step: 0.1 },
          },
        },
        { decimalPlaces: 4, feedbackSign: 'minus', order: ['b0', 'b1', 'b2', 'a0', 'a1', 'a2'] },
      ),
    ],
    ['fine steps and float32', profile({}, { numberFormat: 'float32', decimalPlaces: undefined })],
  ])('%s', (_name, p) => {
    const settings: TuningSettings = {
      sampleRateHz: 48000,
      channels: [
        {
          ...STAGE3ISH.channels[1],
          eq: [
            { type: 'peaking', frequencyHz: 42.37, gainDb: -7.81, q: 4.44 },
            { type: 'peaking', frequencyHz: 71.2, gainDb: -4.27, q: 3.06 },
            { type: 'peaking', frequencyHz: 118.9, gainDb: -2.63, q: 1.87 },
          ],
        },
      ],
      subwoofer: null,
    };
    const fs = 48000;
    const [c] = exportForProcessor(settings, fs, p).channels;
    const top = Math.min(20000, 0.45 * fs);
    const steps = Math.round(Math.log2(top / 20) * 48);
    const grid = [
      ...Array.from({ length: steps + 1 }, (_, k) => 20 * Math.pow(top / 20, k / steps)),
      ...settings.channels[0].eq.map((b) => b.frequencyHz),
      ...c.eq.map((b) => b.frequencyHz),
    ];
    const order = p.coefficients.order;
    const sign = p.coefficients.feedbackSign === 'minus' ? -1 : 1;
    const jobs = [
      ...c.eq.map((band) => {
        const at = (name: string) => band.coefficients[order.indexOf(name as never)];
        return {
          sampleRateHz: fs,
          frequenciesHz: grid,
          iir: {
            feedforward: [at('b0'), at('b1'), at('b2')],
            feedback: [1, sign * at('a1'), sign * at('a2')],
          },
        };
      }),
      ...settings.channels[0].eq.map((b) => ({
        sampleRateHz: fs,
        frequenciesHz: grid,
        biquad: {
          type: 'peaking' as const,
          frequency: b.frequencyHz,
          Q: b.q ?? Math.SQRT1_2,
          gain: b.gainDb ?? 0,
        },
      })),
    ];
    const answers = webAudioResponses(jobs);
    const n = c.eq.length;
    const db = (from: number, to: number) =>
      grid.map((_, i) =>
        answers.slice(from, to).reduce((sum, a) => sum + 20 * Math.log10(a.magnitude[i]), 0),
      );
    const rounded = db(0, n);
    const designed = db(n, 2 * n);
    const reference = Math.max(...grid.map((_, i) => Math.abs(rounded[i] - designed[i])));
    expect(Math.abs(c.eqRounding.maxDeviationDb - reference)).toBeLessThan(0.01);
    expect(c.eqRounding.maxDeviationDb).toBeGreaterThan(0);
  });
});

describe('CSV export', () => {
  it('a header block (stale first), a parameters table and a coefficients table; formula text made inert', () => {
    const settings: TuningSettings = {
      ...STAGE3ISH,
      channels: [{ ...STAGE3ISH.channels[0], id: '=HYPERLINK("x")' }, STAGE3ISH.channels[1]],
    };
    const out = exportForProcessor(settings, 48000, profile({}, { feedbackSign: 'minus' }));
    const csv = processorExportToCsv(
      {
        stale: { since: '2026-12-02T10:00:00.000Z', reasons: ['listener moved 0.80 m'] },
        tuningId: 'tun_1',
        version: 2,
        name: 'Demo',
        roomId: 'room_1',
        roomName: 'Stage 3',
        sampleRateHz: 48000,
        profile: { id: 'prof_1', name: 'Generic' },
        createdAt: '2026-12-02T09:00:00.000Z',
        isochronVersion: '0.1.0',
        convention: 'x',
        cautions: [{ code: 'boost', message: '+3 dB' }],
      },
      out,
    );
    const [head, parameters, coefficients] = csv.split('\r\n\r\n');
    expect(head.split('\r\n').slice(0, 2)).toEqual([
      'field,value',
      'stale,since 2026-12-02T10:00:00.000Z: listener moved 0.80 m',
    ]);
    expect(head).toContain('caution,boost: +3 dB');
    expect(parameters.split('\r\n')[0]).toBe(
      'channel,name,stage,band,type,frequencyHz,gainDb,q,order,delayMs,delaySamples,trimDb,polarity,routeTo,routeGainDb',
    );
    expect(parameters).toContain(`"'=HYPERLINK(""x"")",Left,output,,,,,,,1.56,74.88,-1.6,normal,,`);
    expect(parameters).not.toMatch(/(^|\r\n)=HYPERLINK/);
    expect(coefficients.split('\r\n')[0]).toBe('channel,stage,section,b0,b1,b2,a1,a2');
    const lfeRow = coefficients.split('\r\n').find((l) => l.startsWith('LFE1,eq,0,'));
    expect(lfeRow?.split(',').slice(3).map(Number)).toEqual(out.channels[1].eq[0].coefficients);
  });

  it('quotes a name that needs it (RFC 4180); negative trims and coefficients stay numbers', () => {
    const settings: TuningSettings = {
      ...STAGE3ISH,
      channels: [{ ...STAGE3ISH.channels[0], id: 'Sub, "left"' }, STAGE3ISH.channels[1]],
    };
    const out = exportForProcessor(settings, 48000, EXACT_LAYOUT);
    const header = {
      stale: null,
      tuningId: 't',
      version: 1,
      name: 'n',
      roomId: 'r',
      roomName: 'r',
      sampleRateHz: 48000,
      profile: null,
      createdAt: 'c',
      isochronVersion: 'v',
      convention: 'c',
      cautions: [],
    };
    const csv = processorExportToCsv(header, out);
    expect(csv.endsWith('\r\n')).toBe(true);
    const [, parameters, coefficients] = csv.split('\r\n\r\n');
    expect(parameters.split('\r\n')[1].startsWith('"Sub, ""left""",Left,output,')).toBe(true);
    // Parameters as answers present them (dB to 2 decimals), not −1.6000000000000014.
    expect(parameters).toContain(',-1.6,normal,');
    expect(parameters).not.toMatch(/,'-/);
    // JavaScript's shortest round-trip form: parsing gives back the exact doubles.
    const row = coefficients.split('\r\n').find((l) => l.includes(',eq,0,'));
    expect(row?.split(',').slice(-5).map(Number)).toEqual(out.channels[0].eq[0].coefficients);
  });
});
