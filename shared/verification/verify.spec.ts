import { STAGE3_ROOM, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { responseGrid } from '../dsp/grid';
import { cascadeResponse, sosfreqz } from '../dsp/response';
import { designBiquads, type FilterSpec } from '../filters/biquad-design';
import { planStoredRoom, planToTuningSettings, designTuning, type StoredMeasurement } from '../plan';
import { promiseOfPlan } from './promise';
import { judge, verifyTuning } from './verify';

const fs = 48000;
/** Speed of sound at 21 °C, 343.2·sqrt((t + 273.15)/293.15) (ISO 9613-1 form, as in the pyfar library). */
const c21 = 343.2 * Math.sqrt(294.15 / 293.15);
const LATENCY_MS = 3.2;
const distance = (id: string) => {
  const s = STAGE3_ROOM.loudspeakers.find((l) => l.id === id) as { x: number; y: number; z: number };
  const l = STAGE3_ROOM.listener;
  return Math.hypot(s.x - l.x, s.y - l.y, s.z - l.z);
};

let serial = 0;
const id = () => `meas_${String(++serial).padStart(6, '0')}`;
const ir = (channel: string, arrivalMs: number, stage: 'before' | 'after'): StoredMeasurement => ({
  id: id(),
  channel,
  micPosition: 'MLP',
  kind: 'impulseResponse',
  stage,
  result: { arrival: { arrivalMs }, timingReference: { arrivalMs: 1.5 } },
});
const spl = (channel: string, splDb: number, stage: 'before' | 'after'): StoredMeasurement => ({
  id: id(),
  channel,
  micPosition: 'MLP',
  kind: 'spl',
  stage,
  result: { splDb, weighting: 'C' },
});
const fr = (
  channel: string,
  r: { frequenciesHz: number[]; magnitudeDb: number[] },
  stage: 'before' | 'after',
) => ({
  id: id(),
  channel,
  micPosition: 'MLP',
  kind: 'frequencyResponse' as const,
  stage,
  result: { frequenciesHz: r.frequenciesHz, magnitudeDb: r.magnitudeDb },
});

/**
 * Responses before tuning: room modes as peaks on a flat loudspeaker (invented), 1/12 octave 20 Hz–20 kHz —
 * what a cut-first EQ can correct, so the tuning can keep its promise.
 */
const MODES: Record<string, FilterSpec[]> = {
  'M+030': [
    { type: 'peaking', frequencyHz: 190, gainDb: 5, q: 3 },
    { type: 'peaking', frequencyHz: 1200, gainDb: 2, q: 2 },
  ],
  'M-030': [{ type: 'peaking', frequencyHz: 118, gainDb: 4, q: 3 }],
  'M+000': [{ type: 'peaking', frequencyHz: 150, gainDb: 3.5, q: 2 }],
  LFE1: [
    { type: 'peaking', frequencyHz: 42, gainDb: 7, q: 5 },
    { type: 'peaking', frequencyHz: 95, gainDb: 4, q: 4 },
  ],
};
const grid = responseGrid({ fromHz: 20, toHz: 20000, pointsPerOctave: 12 }, fs);
const responses: Record<string, { frequenciesHz: number[]; magnitudeDb: number[] }> = Object.fromEntries(
  Object.entries(MODES).map(([ch, modes]) => [
    ch,
    { frequenciesHz: grid, magnitudeDb: cascadeResponse(designBiquads(modes, fs), grid, fs).magnitudeDb },
  ]),
);

/** The room before tuning: arrivals (time of flight + a common latency, loopback at 1.5 ms), SPL, responses. */
const before: StoredMeasurement[] = STAGE3_ROOM.loudspeakers.flatMap(({ id: ch }) => [
  ir(ch, (distance(ch) / c21) * 1000 + LATENCY_MS + 1.5, 'before'),
  spl(ch, STAGE3_SPL_DB[ch], 'before'),
  ...(responses[ch] ? [fr(ch, responses[ch], 'before')] : []),
]);
const room = {
  layoutId: STAGE3_ROOM.layout,
  dimensions: STAGE3_ROOM.dimensions,
  listener: STAGE3_ROOM.listener,
  loudspeakers: STAGE3_ROOM.loudspeakers,
  limits: STAGE3_ROOM.limits,
  sampleRateHz: fs,
};
const plan = planStoredRoom(room, before, {
  targets: { referenceDb: 79, crossoverHz: 80 },
  temperatureC: 21,
});
const settings = planToTuningSettings(plan);
const promise = promiseOfPlan(plan, null);
const designed = designTuning(settings, fs);

/**
 * "After" measurements made from the tuning, as a processor loaded with it would give them: every level is
 * the reading before plus the trim (a gain adds in dB); every arrival the arrival before plus the delay in
 * whole samples; every response the response before times the channel's EQ and crossover filter, and a
 * bass-managed channel's response the complex sum with the subwoofer's low-passed path (both taken as
 * minimum-phase-free, time-aligned paths at equal passband level, which the tuning aligned them to).
 */
function afterSet(): StoredMeasurement[] {
  const sub = designed.channels.find((c) => c.id === 'LFE1');
  return designed.channels.flatMap((c) => {
    const beforeSpl = STAGE3_SPL_DB[c.id];
    const out: StoredMeasurement[] = [spl(c.id, beforeSpl + c.trimDb, 'after')];
    if (!c.id.startsWith('LFE')) {
      out.push(
        ir(c.id, (distance(c.id) / c21) * 1000 + LATENCY_MS + 1.5 + (c.delaySamples / fs) * 1000, 'after'),
      );
    }
    const r = responses[c.id];
    if (r) {
      const own = sosfreqz(c.sections, r.frequenciesHz, fs);
      const subPath =
        c.sections.some((s) => s.stage === 'highPass') && sub
          ? sosfreqz(sub.sections, r.frequenciesHz, fs)
          : null;
      const subShape = responses.LFE1;
      const magnitudeDb = r.frequenciesHz.map((f, i) => {
        const g = 10 ** (r.magnitudeDb[i] / 20);
        let re = g * own.re[i];
        let im = g * own.im[i];
        if (subPath) {
          const k = subShape.frequenciesHz.indexOf(f);
          const gs = 10 ** ((k >= 0 ? subShape.magnitudeDb[k] : 0) / 20);
          re += gs * subPath.re[i];
          im += gs * subPath.im[i];
        }
        // A measurement never reads below its noise floor (−120 dB here), far outside the pass band.
        return 10 * Math.log10(Math.max(re * re + im * im, 1e-12));
      });
      out.push(fr(c.id, { frequenciesHz: r.frequenciesHz, magnitudeDb }, 'after'));
    }
    return out;
  });
}

describe('verifyTuning', () => {
  it('passes a synthetic "after" set made from the tuning', () => {
    const result = verifyTuning({ settings, promise, after: afterSet() });
    const failing = result.channels.flatMap((c) =>
      (['arrival', 'level', 'response', 'crossoverSum'] as const)
        .filter((k) => c[k].status === 'fail')
        .map((k) => `${c.id} ${k} ${JSON.stringify(c[k])}`),
    );
    expect(failing).toEqual([]);
    expect(result.verdict === 'pass' || result.verdict === 'warn').toBe(true);
    expect(result.referenceFrom).toBe('promise');
    expect(result.micPosition).toBe('MLP');
    // Arrivals: aligned to the half sample the delays were rounded to (10.4 µs at 48 kHz).
    expect(result.arrivalSpread.spreadMs).toBeLessThanOrEqual(1000 / fs);
    expect(result.arrivalSpread.timingReference).toBe(true);
    // Levels: reading + trim = the promised level, exactly (the trims were not clamped).
    for (const c of result.channels) expect(Math.abs(c.level.deviationDb as number)).toBeLessThan(1e-9);
    const left = result.channels.find((c) => c.id === 'M+030');
    expect(left?.response.status).not.toBe('notMeasured');
    expect(left?.crossoverSum.status).not.toBe('notMeasured');
    expect(result.channels.find((c) => c.id === 'LFE1')?.arrival.status).toBe('notMeasured');
  });

  it('fails a set with a 1 dB level error, naming the channel', () => {
    const after = afterSet().map((m) =>
      m.kind === 'spl' && m.channel === 'M-090'
        ? { ...m, result: { ...m.result, splDb: (m.result.splDb as number) + 1 } }
        : m,
    );
    const result = verifyTuning({ settings, promise, after });
    expect(result.verdict).toBe('fail');
    const side = result.channels.find((c) => c.id === 'M-090');
    expect(side?.level.status).toBe('fail');
    expect(side?.level.deviationDb).toBeCloseTo(1, 9);
    expect(result.channels.filter((c) => c.level.status === 'fail').map((c) => c.id)).toEqual(['M-090']);
  });

  it('fails an arrival 0.2 ms late (BS.2051-3: within 100 µs), passes it with the tolerance raised to 0.3 ms', () => {
    const after = afterSet().map((m) =>
      m.kind === 'impulseResponse' && m.channel === 'U-135'
        ? {
            ...m,
            result: {
              ...m.result,
              arrival: { arrivalMs: (m.result.arrival as { arrivalMs: number }).arrivalMs + 0.2 },
            },
          }
        : m,
    );
    const strict = verifyTuning({ settings, promise, after });
    expect(strict.channels.find((c) => c.id === 'U-135')?.arrival.status).toBe('fail');
    expect(strict.arrivalSpread.status).toBe('fail');
    const relaxed = verifyTuning({ settings, promise, after, tolerances: { arrivalMs: 0.3 } });
    expect(relaxed.channels.find((c) => c.id === 'U-135')?.arrival.status).not.toBe('fail');
    expect(relaxed.tolerances.find((t) => t.name === 'arrivalMs')).toMatchObject({
      value: 0.3,
      default: 0.1,
      setByCaller: true,
      basis: 'published',
    });
  });

  it('says incomplete when nothing was measured, and checks matching against the median without a promise', () => {
    expect(verifyTuning({ settings, promise, after: [] }).verdict).toBe('incomplete');
    const levels = ['M+030', 'M-030', 'M+000'].map((ch, i) => spl(ch, 80 + [0, 0.2, 1.1][i], 'after'));
    const result = verifyTuning({ settings, promise: null, after: levels });
    expect(result.referenceFrom).toBe('medianOfMeasured');
    expect(result.referenceDb).toBe(80.2);
    expect(result.channels.find((c) => c.id === 'M+000')?.level.status).toBe('fail');
    expect(result.channels.find((c) => c.id === 'M+030')?.level.status).toBe('pass');
  });

  it('judges pass, warn (past 80 % of the tolerance) and fail', () => {
    expect(judge(0.39, 0.5)).toBe('pass');
    expect(judge(-0.45, 0.5)).toBe('warn');
    expect(judge(0.5, 0.5)).toBe('warn');
    expect(judge(0.51, 0.5)).toBe('fail');
  });
});
