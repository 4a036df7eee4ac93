/** Decay times of one impulse response (broadband or one band), seconds; null where the range was too short. */
export interface DecayTimes {
  edtS: number | null;
  t20S: number | null;
  t30S: number | null;
}

export interface DecayAnalysis extends DecayTimes {
  /** Level of the decay's regression line at its start minus the background noise, dB. */
  impulseToNoiseDb: number;
  /** Where the decay meets the background noise (Lundeby crossing), seconds after the start. */
  truncationS: number;
  /** Evaluations skipped for lack of dynamic range, e.g. `t30S`. */
  insufficientRange: Array<keyof DecayTimes>;
}

interface Evaluation {
  key: keyof DecayTimes;
  topDb: number;
  bottomDb: number;
  /** Impulse-to-noise ratio needed: the noise must lie 10 dB below the bottom of the range. */
  requiredDb: number;
}

/** Evaluation ranges of ISO 3382-1 [lib]: EDT 0..−10 dB, T20 −5..−25 dB, T30 −5..−35 dB, each ×60/range. */
const EVALUATIONS: Evaluation[] = [
  { key: 'edtS', topDb: 0, bottomDb: -10, requiredDb: 20 },
  { key: 't20S', topDb: -5, bottomDb: -25, requiredDb: 35 },
  { key: 't30S', topDb: -5, bottomDb: -35, requiredDb: 45 },
];

interface Line {
  slope: number;
  intercept: number;
}

function fitLine(xs: ArrayLike<number>, ys: ArrayLike<number>, from: number, to: number): Line | null {
  const count = to - from;
  if (count < 2) return null;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (let i = from; i < to; i++) {
    sx += xs[i];
    sy += ys[i];
    sxx += xs[i] * xs[i];
    sxy += xs[i] * ys[i];
  }
  const denominator = count * sxx - sx * sx;
  if (denominator === 0) return null;
  const slope = (count * sxy - sx * sy) / denominator;
  return { slope, intercept: (sy - slope * sx) / count };
}

/**
 * Block means of the energy, as (centre sample, dB) pairs. `remaining[i]` is the energy from sample i to the
 * end: summed from the end, it keeps late, quiet blocks exact where a forward sum would cancel.
 */
function blockLevels(remaining: Float64Array, blockLength: number): { t: Float64Array; db: Float64Array } {
  const count = Math.floor((remaining.length - 1) / blockLength);
  const t = new Float64Array(count);
  const db = new Float64Array(count);
  for (let b = 0; b < count; b++) {
    const sum = remaining[b * blockLength] - remaining[(b + 1) * blockLength];
    t[b] = (b + 0.5) * blockLength;
    db[b] = 10 * Math.log10(Math.max(sum, 0) / blockLength + 1e-300);
  }
  return { t, db };
}

/** Mean energy from `from` to the end, in dB, over at least the last tenth of the signal. */
function meanEnergyDb(remaining: Float64Array, from: number): number {
  const n = remaining.length - 1;
  const start = Math.min(Math.max(0, Math.floor(from)), Math.floor(n * 0.9));
  return 10 * Math.log10(remaining[start] / (n - start) + 1e-300);
}

/** Fits the decay between `upperDb` and `lowerDb` on block levels (from the loudest block onward). */
function fitDecay(
  levels: { t: Float64Array; db: Float64Array },
  upperDb: number,
  lowerDb: number,
): Line | null {
  let loudest = 0;
  for (let b = 1; b < levels.db.length; b++) if (levels.db[b] > levels.db[loudest]) loudest = b;
  let first = loudest;
  while (first < levels.db.length && levels.db[first] > upperDb) first++;
  let last = first;
  while (last < levels.db.length && levels.db[last] >= lowerDb) last++;
  const line = fitLine(levels.t, levels.db, first, last);
  return line && line.slope < 0 ? line : null;
}

interface Crossing {
  crossingSample: number;
  noiseDb: number;
  line: Line;
}

/**
 * Where the decay meets the background noise, after Lundeby, Vigran, Bietz & Vorländer, "Uncertainties of
 * measurements in room acoustics", Acustica 81 (1995) [memory]: noise from the last tenth, a regression of
 * the block-averaged decay down to 10 dB above the noise, then up to five refinements with blocks sized to
 * about five per 10 dB of decay, the noise read from 10 dB of decay past the crossing, and the decay fitted
 * over the 20 dB ending 5 dB above the noise.
 */
function lundebyCrossing(remaining: Float64Array, sampleRateHz: number): Crossing | null {
  const n = remaining.length - 1;
  let blockLength = Math.max(1, Math.round(0.01 * sampleRateHz));
  let noiseDb = meanEnergyDb(remaining, n * 0.9);
  let line = fitDecay(blockLevels(remaining, blockLength), Infinity, noiseDb + 10);
  if (!line) return null;
  let crossing = (noiseDb - line.intercept) / line.slope;
  for (let iteration = 0; iteration < 5; iteration++) {
    const samplesPer10Db = 10 / -line.slope;
    blockLength = Math.round(
      Math.min(0.05 * sampleRateHz, Math.max(0.001 * sampleRateHz, samplesPer10Db / 5)),
    );
    noiseDb = meanEnergyDb(remaining, crossing + samplesPer10Db);
    const refined = fitDecay(blockLevels(remaining, blockLength), noiseDb + 25, noiseDb + 5);
    if (!refined) break;
    const next = (noiseDb - refined.intercept) / refined.slope;
    line = refined;
    const converged = Math.abs(next - crossing) < blockLength;
    crossing = next;
    if (converged) break;
  }
  return { crossingSample: Math.min(n, Math.max(1, Math.round(crossing))), noiseDb, line };
}

/**
 * Decay times EDT, T20 and T30 from Schroeder backward integration of the squared impulse response (ISO
 * 3382-1/-2 [lib]; M. R. Schroeder, JASA 37, 1965). The integral runs from the decay start to where the
 * decay meets the background noise (Lundeby crossing), plus the energy the fitted exponential would carry
 * past that point; each time is the least-squares slope over its range, extrapolated to −60 dB. A time is
 * null when the impulse-to-noise ratio is less than the range's bottom plus 10 dB (EDT 20 dB, T20 35 dB,
 * T30 45 dB), the margin ISO 3382-1 asks for [memory].
 *
 * @param samples the impulse response (broadband or band-filtered), full scale ±1.
 * @param sampleRateHz sample rate, hertz.
 * @param startSample first sample of the decay (normally the detected arrival).
 */
export function decayTimes(
  samples: ArrayLike<number>,
  sampleRateHz: number,
  startSample: number,
): DecayAnalysis {
  const n = Math.max(0, samples.length - startSample);
  // Energy from each sample to the end, summed from the end so late, quiet stretches stay exact.
  const remaining = new Float64Array(n + 1);
  for (let i = n - 1; i >= 0; i--) {
    const v = samples[startSample + i];
    remaining[i] = remaining[i + 1] + v * v;
  }
  const empty: DecayAnalysis = {
    edtS: null,
    t20S: null,
    t30S: null,
    impulseToNoiseDb: 0,
    truncationS: n / sampleRateHz,
    insufficientRange: EVALUATIONS.map((e) => e.key),
  };
  const crossing = n >= 16 ? lundebyCrossing(remaining, sampleRateHz) : null;
  if (!crossing) return empty;

  const { crossingSample, noiseDb, line } = crossing;
  const tailEnergy =
    crossingSample < n
      ? Math.pow(10, (line.slope * crossingSample + line.intercept) / 10) /
        (1 - Math.pow(10, line.slope / 10))
      : 0;
  // Schroeder's integral to the crossing, plus the fitted decay's energy beyond it.
  const schroeder = new Float64Array(crossingSample);
  const beyond = remaining[crossingSample] - tailEnergy;
  for (let i = 0; i < crossingSample; i++) schroeder[i] = remaining[i] - beyond;
  const total = schroeder[0];
  if (!(total > 0)) return empty;

  const impulseToNoiseDb = line.intercept - noiseDb;
  const result: DecayAnalysis = {
    edtS: null,
    t20S: null,
    t30S: null,
    impulseToNoiseDb,
    truncationS: crossingSample / sampleRateHz,
    insufficientRange: [],
  };
  for (const evaluation of EVALUATIONS) {
    const range = evaluationRange(schroeder, total, evaluation);
    const fitted =
      impulseToNoiseDb >= evaluation.requiredDb && range
        ? fitDecayCurve(schroeder, total, range[0], range[1])
        : null;
    if (fitted && fitted.slope < 0) result[evaluation.key] = -60 / fitted.slope / sampleRateHz;
    else result.insufficientRange.push(evaluation.key);
  }
  return result;
}

/**
 * Sample range [first, last) where the decay curve 10·log10(E/total) lies between the evaluation's top and
 * bottom. E never rises, so both ends are found by bisection on the energies themselves.
 */
function evaluationRange(
  energy: Float64Array,
  total: number,
  { topDb, bottomDb }: Evaluation,
): [number, number] | null {
  const firstAtOrBelow = (level: number, strict: boolean): number => {
    let lo = 0;
    let hi = energy.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (strict ? energy[mid] < level : energy[mid] <= level) hi = mid;
      else lo = mid + 1;
    }
    return lo;
  };
  const first = firstAtOrBelow(total * Math.pow(10, topDb / 10), false);
  const last = firstAtOrBelow(total * Math.pow(10, bottomDb / 10), true);
  return last < energy.length && last - first >= 2 ? [first, last] : null;
}

/** Points per regression: the Schroeder curve is smooth, so a strided fit loses nothing and bounds the work. */
const MAX_FIT_POINTS = 4096;

/** Least-squares line through (i, 10·log10(energy[i]/total)) for i in [from, to). */
function fitDecayCurve(energy: Float64Array, total: number, from: number, to: number): Line | null {
  const stride = Math.max(1, Math.floor((to - from) / MAX_FIT_POINTS));
  let n = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (let i = from; i < to; i += stride) {
    const y = 10 * Math.log10(energy[i] / total);
    n++;
    sx += i;
    sy += y;
    sxx += i * i;
    sxy += i * y;
  }
  const denominator = n * sxx - sx * sx;
  if (n < 2 || denominator === 0) return null;
  const slope = (n * sxy - sx * sy) / denominator;
  return { slope, intercept: (sy - slope * sx) / n };
}
