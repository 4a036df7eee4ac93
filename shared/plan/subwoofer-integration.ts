import { CalculationInputError } from '../errors';
import { logFrequencyGrid } from '../dsp/grid';
import { sosfreqz } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import type { Polarity } from '../filters/crossover';

/** A measured complex response: magnitude in dB and phase in degrees (wrapped or not) per frequency. */
export interface ComplexResponse {
  frequenciesHz: readonly number[];
  magnitudeDb: readonly number[];
  phaseDeg: readonly number[];
}

export interface IntegrationMain {
  id: string;
  /** Its response at the listening position as measured, without the crossover (the raw loudspeaker). */
  response: ComplexResponse;
  /** Delay, trim and polarity the plan gives this channel. */
  delayMs: number;
  gainDb: number;
  polarity: Polarity;
}

export interface SubwooferIntegrationInput {
  /** The subwoofer's response at the listening position as measured, without the low-pass. */
  sub: { response: ComplexResponse; gainDb: number };
  /** Bass-managed channels measured at the same position with the same timing reference. */
  mains: readonly IntegrationMain[];
  lowPass: readonly Sos[];
  /** The mains' high-pass, as designed; its output polarity is in each main's `polarity`. */
  highPass: readonly Sos[];
  crossoverHz: number;
  sampleRateHz: number;
  /** Largest subwoofer delay the processor allows, ms (candidates are 0..this in whole samples). */
  delayMaxMs: number;
}

export interface IntegrationCandidate {
  delayMs: number;
  delaySamples: number;
  polarity: Polarity;
  /** Mean level of the summed response over the band (mean over the mains), dB. */
  meanDb: number;
  /** RMS deviation of the summed response from its own mean over the band (mean over the mains), dB. */
  deviationDb: number;
  /** Deepest point of the summed response below its mean (worst over the mains), dB (≤ 0). */
  deepestDipDb: number;
  /**
   * Mean of 20·log10(|S + M| / (|S| + |M|)) over the band: 0 dB when the subwoofer and the mains add in
   * phase everywhere, more negative the more they cancel (mean over the mains).
   */
  summationDb: number;
  /** meanDb − deviationDb: louder and smoother is better (equal weight) [product choice]. */
  scoreDb: number;
}

export interface SubwooferIntegration {
  band: { fromHz: number; toHz: number };
  chosen: IntegrationCandidate;
  /** The next best distinct settings (local optima of the score, not neighbouring samples), best first. */
  runnersUp: IntegrationCandidate[];
  /** Each main's sum with the subwoofer at the chosen setting, over the band. */
  summed: Array<{ channel: string; frequenciesHz: number[]; magnitudeDb: number[] }>;
}

/** Band density, points per octave. */
const POINTS_PER_OCTAVE = 48;
/** Runners-up reported. */
const RUNNERS_UP = 3;
/** Scores closer than this count as equal; the smaller delay (then normal polarity) wins, dB. */
const SCORE_TIE_DB = 1e-9;

/**
 * Chooses the subwoofer delay and polarity that make its sum with the bass-managed channels smoothest and
 * loudest over one octave either side of the crossover, with the crossover filters applied: for every
 * delay 0..delayMaxMs in whole samples and both polarities, per main
 * `S(f) = g_m·p_m·M(f)·HP(f)·e^(−jω·d_m) + g_s·p·Sub(f)·LP(f)·e^(−jω·d)`, scored by mean level minus RMS
 * deviation (dB) and averaged over the mains. Responses are interpolated to a 1/48-octave grid in
 * magnitude (dB, log frequency) and unwrapped phase (linear frequency, exact for a pure delay).
 * Runners-up are the best other local optima of the score, so they are real alternatives (another period
 * at the crossover, the other polarity), not the chosen delay ± one sample.
 * @throws CalculationInputError when a response does not cover the band (named `/sub` or `/mains/i`).
 */
export function integrateSubwoofer(input: SubwooferIntegrationInput): SubwooferIntegration {
  const fs = input.sampleRateHz;
  const fromHz = input.crossoverHz / 2;
  const toHz = Math.min(input.crossoverHz * 2, 0.45 * fs);
  const grid = logFrequencyGrid(fromHz, toHz, POINTS_PER_OCTAVE);
  const n = grid.length;
  if (input.mains.length === 0) throw new CalculationInputError('at least one main is needed', '/mains');

  const lp = sosfreqz(input.lowPass, grid, fs);
  const hp = sosfreqz(input.highPass, grid, fs);
  const sub = onGrid(input.sub.response, grid, '/sub');
  const subGain = 10 ** (input.sub.gainDb / 20);
  // The subwoofer path at delay 0 and normal polarity.
  const bRe = new Float64Array(n);
  const bIm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    bRe[i] = subGain * (sub.re[i] * lp.re[i] - sub.im[i] * lp.im[i]);
    bIm[i] = subGain * (sub.re[i] * lp.im[i] + sub.im[i] * lp.re[i]);
  }
  // Each main's path, fixed.
  const mains = input.mains.map((m, k) => {
    const r = onGrid(m.response, grid, `/mains/${k}`);
    const g = 10 ** (m.gainDb / 20) * (m.polarity === 'inverted' ? -1 : 1);
    const re = new Float64Array(n);
    const im = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const w = (-2 * Math.PI * grid[i] * m.delayMs) / 1000;
      const hRe = r.re[i] * hp.re[i] - r.im[i] * hp.im[i];
      const hIm = r.re[i] * hp.im[i] + r.im[i] * hp.re[i];
      re[i] = g * (hRe * Math.cos(w) - hIm * Math.sin(w));
      im[i] = g * (hRe * Math.sin(w) + hIm * Math.cos(w));
    }
    return { id: m.id, re, im };
  });

  /** The subwoofer path delayed by d samples, written into re and im. */
  const subAt = (d: number, re: Float64Array, im: Float64Array): void => {
    for (let i = 0; i < n; i++) {
      const w = (-2 * Math.PI * grid[i] * d) / fs;
      re[i] = bRe[i] * Math.cos(w) - bIm[i] * Math.sin(w);
      im[i] = bRe[i] * Math.sin(w) + bIm[i] * Math.cos(w);
    }
  };
  const maxSamples = Math.floor((input.delayMaxMs * fs) / 1000 + 1e-9);
  const scores: Record<Polarity, Float64Array> = {
    normal: new Float64Array(maxSamples + 1),
    inverted: new Float64Array(maxSamples + 1),
  };
  // Rotating the subwoofer path by one sample per step: e^(−jω/fs) per frequency, no trigonometry per step.
  const stepRe = grid.map((f) => Math.cos((-2 * Math.PI * f) / fs));
  const stepIm = grid.map((f) => Math.sin((-2 * Math.PI * f) / fs));
  const cRe = Float64Array.from(bRe);
  const cIm = Float64Array.from(bIm);
  for (let d = 0; d <= maxSamples; d++) {
    if (d % 1024 === 0) {
      // Exact now and then, so rounding in the rotation never accumulates.
      subAt(d, cRe, cIm);
    } else {
      for (let i = 0; i < n; i++) {
        const re = cRe[i] * stepRe[i] - cIm[i] * stepIm[i];
        cIm[i] = cRe[i] * stepIm[i] + cIm[i] * stepRe[i];
        cRe[i] = re;
      }
    }
    scores.normal[d] = evaluate(mains, cRe, cIm, 1, n).scoreDb;
    scores.inverted[d] = evaluate(mains, cRe, cIm, -1, n).scoreDb;
  }
  const candidate = (d: number, polarity: Polarity): IntegrationCandidate => {
    const re = new Float64Array(n);
    const im = new Float64Array(n);
    subAt(d, re, im);
    return {
      delayMs: (d / fs) * 1000,
      delaySamples: d,
      polarity,
      ...evaluate(mains, re, im, polarity === 'inverted' ? -1 : 1, n),
    };
  };

  const optima: IntegrationCandidate[] = [];
  for (const polarity of ['normal', 'inverted'] as const) {
    const s = scores[polarity];
    for (let d = 0; d <= maxSamples; d++) {
      const left = d === 0 ? -Infinity : s[d - 1];
      const right = d === maxSamples ? -Infinity : s[d + 1];
      if (s[d] >= left && s[d] > right) optima.push(candidate(d, polarity));
    }
  }
  optima.sort((a, b) =>
    Math.abs(a.scoreDb - b.scoreDb) > SCORE_TIE_DB
      ? b.scoreDb - a.scoreDb
      : a.delaySamples !== b.delaySamples
        ? a.delaySamples - b.delaySamples
        : a.polarity === 'normal'
          ? -1
          : 1,
  );
  const [chosen, ...rest] = optima;
  const sign = chosen.polarity === 'inverted' ? -1 : 1;
  const sRe = new Float64Array(n);
  const sIm = new Float64Array(n);
  subAt(chosen.delaySamples, sRe, sIm);
  const summed = mains.map((m) => ({
    channel: m.id,
    frequenciesHz: grid,
    magnitudeDb: grid.map(
      (_, i) =>
        10 * Math.log10(Math.max((m.re[i] + sign * sRe[i]) ** 2 + (m.im[i] + sign * sIm[i]) ** 2, 1e-30)),
    ),
  }));
  return { band: { fromHz, toHz }, chosen, runnersUp: rest.slice(0, RUNNERS_UP), summed };
}

function evaluate(
  mains: ReadonlyArray<{ re: Float64Array; im: Float64Array }>,
  subRe: Float64Array,
  subIm: Float64Array,
  sign: number,
  n: number,
): Omit<IntegrationCandidate, 'delayMs' | 'delaySamples' | 'polarity'> {
  let meanSum = 0;
  let deviationSum = 0;
  let summationSum = 0;
  let deepest = 0;
  const level = new Float64Array(n);
  for (const m of mains) {
    let mean = 0;
    let summation = 0;
    for (let i = 0; i < n; i++) {
      const re = m.re[i] + sign * subRe[i];
      const im = m.im[i] + sign * subIm[i];
      const power = Math.max(re * re + im * im, 1e-30);
      level[i] = 10 * Math.log10(power);
      mean += level[i];
      const ideal =
        Math.sqrt(m.re[i] * m.re[i] + m.im[i] * m.im[i]) +
        Math.sqrt(subRe[i] * subRe[i] + subIm[i] * subIm[i]);
      summation += level[i] - 20 * Math.log10(Math.max(ideal, 1e-15));
    }
    mean /= n;
    let squares = 0;
    for (let i = 0; i < n; i++) {
      squares += (level[i] - mean) ** 2;
      deepest = Math.min(deepest, level[i] - mean);
    }
    meanSum += mean;
    deviationSum += Math.sqrt(squares / n);
    summationSum += summation / n;
  }
  const k = mains.length;
  const meanDb = meanSum / k;
  const deviationDb = deviationSum / k;
  return {
    meanDb,
    deviationDb,
    deepestDipDb: deepest,
    summationDb: summationSum / k,
    scoreDb: meanDb - deviationDb,
  };
}

/**
 * A measured response at the grid's frequencies as complex values: magnitude interpolated in dB over log
 * frequency, phase unwrapped and interpolated over linear frequency.
 */
function onGrid(
  response: ComplexResponse,
  grid: readonly number[],
  field: string,
): { re: Float64Array; im: Float64Array } {
  const f = response.frequenciesHz;
  const count = f.length;
  if (count < 2 || response.magnitudeDb.length !== count || response.phaseDeg.length !== count) {
    throw new CalculationInputError(
      'a complex response needs at least two points with magnitude and phase at every frequency',
      field,
    );
  }
  if (f[0] > grid[0] * (1 + 1e-9) || f[count - 1] < grid[grid.length - 1] * (1 - 1e-9)) {
    throw new CalculationInputError(
      `the response covers ${f[0]}..${f[count - 1]} Hz; the crossover band ${grid[0]}..${grid[grid.length - 1]} Hz is needed`,
      field,
    );
  }
  const unwrapped = unwrapDegrees(response.phaseDeg);
  const re = new Float64Array(grid.length);
  const im = new Float64Array(grid.length);
  let j = 0;
  grid.forEach((x, i) => {
    while (j < count - 2 && f[j + 1] < x) j++;
    const t = Math.min(
      1,
      Math.max(0, (Math.log(x) - Math.log(f[j])) / (Math.log(f[j + 1]) - Math.log(f[j]))),
    );
    const u = Math.min(1, Math.max(0, (x - f[j]) / (f[j + 1] - f[j])));
    const db = response.magnitudeDb[j] + t * (response.magnitudeDb[j + 1] - response.magnitudeDb[j]);
    const phase = ((unwrapped[j] + u * (unwrapped[j + 1] - unwrapped[j])) * Math.PI) / 180;
    const a = 10 ** (db / 20);
    re[i] = a * Math.cos(phase);
    im[i] = a * Math.sin(phase);
  });
  return { re, im };
}

/** Phase without 360° jumps (numpy.unwrap in degrees). */
export function unwrapDegrees(phaseDeg: readonly number[]): number[] {
  const out: number[] = [];
  let offset = 0;
  phaseDeg.forEach((p, i) => {
    if (i > 0) {
      const step = p + offset - out[i - 1];
      // A jump of exactly 180° is left alone, as numpy.unwrap leaves a jump of exactly π.
      if (Math.abs(step) > 180) offset -= 360 * Math.round(step / 360);
    }
    out.push(p + offset);
  });
  return out;
}
