import { logFrequencyGrid } from '../dsp/grid';
import { sosMagnitudeDb, unitCircle } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { designBiquad, type FilterType } from '../filters/biquad-design';
import { designCrossover, type CrossoverFamily, type Polarity } from '../filters/crossover';
import { equivalentQ } from '../filters/equivalent-q';
import { withFieldPrefix } from '../errors';
import type { TuningSettings } from '../plan/tuning';
import type { CoefficientName, ProcessorProfileSettings } from './profile';

/**
 * How coefficients are written when no profile is chosen: the API's own convention, every digit kept.
 * Delays are still whole samples (what every processor runs), trims and filter parameters as stored.
 */
export const EXACT_LAYOUT: ExportProfile = {
  delay: { unit: 'samples', min: 0, max: Infinity, step: 1 },
  trimDb: { min: -Infinity, max: Infinity, step: 0 },
  eq: {
    frequencyHz: { min: 0, max: Infinity, step: 0 },
    frequencyStepUnit: 'hz',
    gainDb: { min: -Infinity, max: Infinity, step: 0 },
    q: { min: 0, max: Infinity, step: 0 },
  },
  coefficients: { order: ['b0', 'b1', 'b2', 'a1', 'a2'], feedbackSign: 'plus', numberFormat: 'full' },
};

/** The parts of a profile the export uses; `full` keeps every digit of a double. */
export type ExportProfile = Pick<ProcessorProfileSettings, 'delay' | 'trimDb'> & {
  eq: Pick<ProcessorProfileSettings['eq'], 'frequencyHz' | 'frequencyStepUnit' | 'gainDb' | 'q'>;
  coefficients: Omit<ProcessorProfileSettings['coefficients'], 'numberFormat'> & {
    numberFormat: ProcessorProfileSettings['coefficients']['numberFormat'] | 'full';
  };
};

export interface ExportedBand {
  type: FilterType;
  frequencyHz: number;
  gainDb: number | null;
  q: number;
  /** The section's coefficients in the profile's order and sign, rounded to its number format. */
  coefficients: number[];
}

export interface ExportedCrossover {
  family: CrossoverFamily;
  order: number;
  frequencyHz: number;
  sections: number[][];
}

export interface ExportedChannel {
  id: string;
  name?: string;
  /** Both from one quantised value: the profile's delay unit and step. */
  delayMs: number;
  delaySamples: number;
  trimDb: number;
  polarity: Polarity;
  bassManaged: boolean;
  eq: ExportedBand[];
  highPass: ExportedCrossover | null;
  lowPass: ExportedCrossover | null;
  /**
   * What rounding cost: the largest |rounded − designed| of the channel's EQ magnitude, dB, and where
   * (null when the channel has no EQ). "Designed" is the stored parameters at full precision; "rounded"
   * is the exported coefficients as written (parameters on the profile's steps, numbers in its format).
   */
  eqRounding: { maxDeviationDb: number; atHz: number | null };
}

export interface ExportedRoute {
  from: string;
  to: string;
  gainDb: number;
  /** `lowPass`: summed, then through the subwoofer's low-pass; `direct`: the LFE, band-limited at the source. */
  via: 'lowPass' | 'direct';
}

export interface ProcessorExport {
  sampleRateHz: number;
  coefficientLayout: ExportProfile['coefficients'];
  channels: ExportedChannel[];
  bassManagement: {
    subwoofer: string;
    lfeGainDb: number;
    delayMs: number;
    delaySamples: number;
    polarity: Polarity;
    lowPass: ExportedCrossover | null;
    routing: ExportedRoute[];
  } | null;
}

/** Decimals of a step as written (0.01 → 2), so a rounded value carries no float noise (1.6000000000000001). */
function decimalsOf(step: number): number {
  const text = String(step);
  if (text.includes('e-')) return Math.min(15, Number(text.split('e-')[1]) + 1);
  return Math.min(15, text.split('.')[1]?.length ?? 0);
}

/** A value on a step of 0 (any value) stays as it is; otherwise the nearest multiple of the step. */
export function roundToStep(value: number, step: number): number {
  if (step === 0) return value;
  return Number((Math.round(value / step) * step).toFixed(decimalsOf(step)));
}

/** A frequency on a step in hertz, or in fractions of an octave from 1 kHz (the ISO 266 reference). */
export function roundFrequency(hz: number, step: number, unit: 'hz' | 'octave'): number {
  if (step === 0) return hz;
  if (unit === 'hz') return roundToStep(hz, step);
  return 1000 * Math.pow(2, Math.round(Math.log2(hz / 1000) / step) * step);
}

/** One coefficient as the processor wants the number: float32, or rounded to decimal places, or as is. */
function formatNumber(value: number, layout: ExportProfile['coefficients']): number {
  if (layout.numberFormat === 'float32') return Math.fround(value);
  if (layout.numberFormat === 'decimal') return Number(value.toFixed(layout.decimalPlaces ?? 17));
  return value;
}

/** A section's coefficients rounded to the number format, still in the API's own +a1, +a2 convention. */
function roundSection(s: Sos, layout: ExportProfile['coefficients']): Sos {
  return {
    b0: formatNumber(s.b0, layout),
    b1: formatNumber(s.b1, layout),
    b2: formatNumber(s.b2, layout),
    a1: formatNumber(s.a1, layout),
    a2: formatNumber(s.a2, layout),
  };
}

/** A rounded section written in the profile's order and feedback sign (a0 = 1 where listed). */
function writeSection(s: Sos, layout: ExportProfile['coefficients']): number[] {
  const sign = layout.feedbackSign === 'minus' ? -1 : 1;
  const value: Record<CoefficientName, number> = {
    b0: s.b0,
    b1: s.b1,
    b2: s.b2,
    a0: 1,
    // 0 rather than −0 when a first-order section's a2 is negated.
    a1: sign * s.a1 + 0,
    a2: sign * s.a2 + 0,
  };
  return layout.order.map((name) => value[name]);
}

/** The channel's EQ magnitude, designed against rounded, on a 1/48-octave grid and at every band's frequency. */
function eqRoundingCost(designed: Sos[], rounded: Sos[], bandsHz: number[], fs: number) {
  if (designed.length === 0) return { maxDeviationDb: 0, atHz: null };
  const top = Math.min(20000, 0.45 * fs);
  const grid = [...logFrequencyGrid(20, top, 48), ...bandsHz.filter((f) => f >= 20 && f <= top)].sort(
    (a, b) => a - b,
  );
  const at = unitCircle(grid, fs);
  const a = sosMagnitudeDb(designed, at);
  const b = sosMagnitudeDb(rounded, at);
  let worst = 0;
  for (let i = 1; i < grid.length; i++) if (Math.abs(b[i] - a[i]) > Math.abs(b[worst] - a[worst])) worst = i;
  return { maxDeviationDb: Math.abs(b[worst] - a[worst]), atHz: grid[worst] };
}

/**
 * A tuning as one processor takes it, at `sampleRateHz`: every value on the profile's steps; delay in
 * ms and in samples from the same quantised value (quantised in the profile's unit); EQ as parameters
 * (type, frequency, gain, Q — Q also for filters stored with a bandwidth or a shelf slope, see
 * equivalentQ) and as coefficients designed from those rounded parameters (Audio EQ Cookbook) and
 * written in the profile's layout; the high-passes and the subwoofer low-pass (Linkwitz-Riley or
 * Butterworth sections); the routing of every bass-managed channel and the LFE into the subwoofer with
 * gains; the subwoofer's delay and polarity; and per channel what the rounding cost the EQ.
 * The settings must lie within the profile (findLimitViolations) — nothing here clamps.
 * @throws CalculationInputError when a rounded filter cannot be designed at this rate (`/channels/i/eq/j/...`).
 */
export function exportForProcessor(
  settings: TuningSettings,
  sampleRateHz: number,
  profile: ExportProfile = EXACT_LAYOUT,
): ProcessorExport {
  const fs = sampleRateHz;
  const layout = profile.coefficients;
  const delay = (ms: number) => {
    if (profile.delay.unit === 'ms') {
      const delayMs = roundToStep(ms, profile.delay.step);
      return { delayMs, delaySamples: (delayMs * fs) / 1000 };
    }
    const delaySamples = roundToStep((ms * fs) / 1000, profile.delay.step);
    return { delayMs: (delaySamples * 1000) / fs, delaySamples };
  };
  const trim = (db: number) => roundToStep(db, profile.trimDb.step);
  const frequency = (hz: number) =>
    roundFrequency(hz, profile.eq.frequencyHz.step, profile.eq.frequencyStepUnit);
  const crossover = (
    spec: { family: CrossoverFamily; order: number; frequencyHz: number },
    side: 'highPass' | 'lowPass',
    field: string,
  ): ExportedCrossover => {
    const rounded = { ...spec, frequencyHz: frequency(spec.frequencyHz) };
    const sections = withFieldPrefix(field, () => designCrossover(rounded, fs))[side].sections;
    return { ...rounded, sections: sections.map((s) => writeSection(roundSection(s, layout), layout)) };
  };
  const sub = settings.subwoofer;

  const channels = settings.channels.map((channel, i): ExportedChannel => {
    const designed: Sos[] = [];
    const rounded: Sos[] = [];
    const eq = channel.eq.map((band, j): ExportedBand => {
      designed.push(withFieldPrefix(`/channels/${i}/eq/${j}`, () => designBiquad(band, fs)));
      const parameters = {
        type: band.type,
        frequencyHz: frequency(band.frequencyHz),
        ...(band.gainDb !== undefined && { gainDb: roundToStep(band.gainDb, profile.eq.gainDb.step) }),
        q: roundToStep(equivalentQ(band, fs), profile.eq.q.step),
      };
      // A processor that takes any Q gets the band's own width (q, bandwidth or slope) unchanged, so an
      // export without steps designs exactly what POST /v1/biquads does.
      const spec =
        profile.eq.q.step === 0
          ? {
              ...band,
              frequencyHz: parameters.frequencyHz,
              ...(band.gainDb !== undefined && { gainDb: parameters.gainDb }),
            }
          : parameters;
      const section = roundSection(
        withFieldPrefix(`/channels/${i}/eq/${j}`, () => designBiquad(spec, fs)),
        layout,
      );
      rounded.push(section);
      return {
        ...parameters,
        gainDb: parameters.gainDb ?? null,
        coefficients: writeSection(section, layout),
      };
    });
    const isSub = sub !== null && sub.channel === channel.id;
    return {
      id: channel.id,
      ...(channel.name !== undefined && { name: channel.name }),
      ...delay(channel.delayMs),
      trimDb: trim(channel.trimDb),
      polarity: channel.polarity,
      bassManaged: channel.bassManaged,
      eq,
      highPass: channel.highPass ? crossover(channel.highPass, 'highPass', `/channels/${i}/highPass`) : null,
      lowPass: isSub && sub.lowPass ? crossover(sub.lowPass, 'lowPass', '/subwoofer/lowPass') : null,
      eqRounding: eqRoundingCost(
        designed,
        rounded,
        [...channel.eq.map((b) => b.frequencyHz), ...eq.map((b) => b.frequencyHz)],
        fs,
      ),
    };
  });

  const subChannel = sub ? channels.find((c) => c.id === sub.channel) : undefined;
  const bassManagement =
    sub && subChannel
      ? {
          subwoofer: sub.channel,
          lfeGainDb: trim(sub.lfeGainDb),
          delayMs: subChannel.delayMs,
          delaySamples: subChannel.delaySamples,
          polarity: subChannel.polarity,
          lowPass: subChannel.lowPass,
          routing: [
            // Common practice: each managed channel's low end joins the subwoofer feed at unity gain,
            // and the LFE (carried on the subwoofer output's own input) with its in-band +10 dB.
            ...settings.channels
              .filter((c) => c.bassManaged)
              .map((c): ExportedRoute => ({ from: c.id, to: sub.channel, gainDb: 0, via: 'lowPass' })),
            { from: sub.channel, to: sub.channel, gainDb: trim(sub.lfeGainDb), via: 'direct' as const },
          ],
        }
      : null;
  return { sampleRateHz: fs, coefficientLayout: layout, channels, bassManagement };
}
