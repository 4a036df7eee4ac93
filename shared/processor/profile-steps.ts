import { equivalentQ } from '../filters/equivalent-q';
import type { TuningSettings } from '../plan/tuning';
import { presentDb, presentHz, presentMs, presentSamples, roundTo } from '../present';
import { roundFrequency, roundToStep } from './processor-export';
import type { ProcessorProfileSettings } from './profile';

/** One setting the processor cannot take as stored: the export gives it the nearest value on its step. */
export interface StepRounding {
  /** JSON pointer into the tuning settings: `/channels/2/delayMs`, `/channels/0/eq/1/q`. */
  setting: string;
  value: number;
  rounded: number;
  /** Unit of value and rounded: `ms`, `samples`, `dB`, `Hz`, or '' for Q. */
  unit: 'ms' | 'samples' | 'dB' | 'Hz' | '';
  message: string;
}

const show = {
  ms: presentMs,
  samples: presentSamples,
  dB: presentDb,
  Hz: presentHz,
  '': (q: number) => roundTo(q, 4),
} as const;

/**
 * What a processor profile's steps do to a tuning (the export rounds exactly so, processor-export.ts):
 * every delay, trim, EQ frequency, gain and Q and crossover frequency that is not on the profile's step, with the value it
 * becomes and by how much; and with a profile that takes delay in ms, every delay that is not a whole
 * number of samples at the tuning's rate (a processor delaying by whole samples will round it; the
 * message gives the nearest whole sample and what that is in ms). Settings on their steps give nothing.
 * Pure; range checks are findLimitViolations's.
 */
export function profileStepRounding(
  settings: TuningSettings,
  profile: ProcessorProfileSettings,
): StepRounding[] {
  const fs = settings.sampleRateHz;
  const found: StepRounding[] = [];
  const note = (
    setting: string,
    what: string,
    value: number,
    rounded: number,
    unit: StepRounding['unit'],
    step: string,
  ) => {
    // A change an answer cannot show (float noise, a hundredth of a step) is no rounding to report.
    const by = show[unit](rounded - value);
    if (by === 0) return;
    const u = unit === '' ? '' : ` ${unit}`;
    found.push({
      setting,
      value,
      rounded,
      unit,
      message: `${what} ${show[unit](value)}${u} is not on the processor's ${step}; it is exported as ${show[unit](rounded)}${u} (${by > 0 ? '+' : ''}${by}${u})`,
    });
  };
  const fStep =
    profile.eq.frequencyStepUnit === 'hz'
      ? `${profile.eq.frequencyHz.step} Hz frequency step`
      : `1/${presentHz(1 / profile.eq.frequencyHz.step)}-octave frequency step`;
  const crossover = (setting: string, what: string, hz: number) =>
    note(
      setting,
      what,
      hz,
      roundFrequency(hz, profile.eq.frequencyHz.step, profile.eq.frequencyStepUnit),
      'Hz',
      fStep,
    );
  settings.channels.forEach((channel, i) => {
    const at = `/channels/${i}`;
    const who = channel.id;
    const d = profile.delay;
    if (d.unit === 'samples') {
      const samples = (channel.delayMs * fs) / 1000;
      note(
        `${at}/delayMs`,
        `${who}'s delay of`,
        samples,
        roundToStep(samples, d.step),
        'samples',
        `${d.step}-sample delay step`,
      );
    } else {
      const ms = roundToStep(channel.delayMs, d.step);
      note(`${at}/delayMs`, `${who}'s delay of`, channel.delayMs, ms, 'ms', `${d.step} ms delay step`);
      const samples = (ms * fs) / 1000;
      const whole = Math.round(samples);
      // Float noise (75 ms at 48 kHz is 3600.0000000000005 samples) is a whole number of samples.
      if (presentSamples(samples - whole) !== 0) {
        found.push({
          setting: `${at}/delayMs`,
          value: samples,
          rounded: whole,
          unit: 'samples',
          message: `${who}'s delay of ${presentMs(ms)} ms is ${presentSamples(samples)} samples at ${fs} Hz; a processor that delays by whole samples gives ${whole} (${presentMs((whole * 1000) / fs)} ms, ${presentMs(((whole - samples) * 1000) / fs)} ms off)`,
        });
      }
    }
    note(
      `${at}/trimDb`,
      `${who}'s trim of`,
      channel.trimDb,
      roundToStep(channel.trimDb, profile.trimDb.step),
      'dB',
      `${profile.trimDb.step} dB trim step`,
    );
    channel.eq.forEach((band, j) => {
      const b = `${at}/eq/${j}`;
      const what = `${who}'s EQ band ${j}`;
      note(
        `${b}/frequencyHz`,
        `${what} at`,
        band.frequencyHz,
        roundFrequency(band.frequencyHz, profile.eq.frequencyHz.step, profile.eq.frequencyStepUnit),
        'Hz',
        fStep,
      );
      if (band.gainDb !== undefined) {
        note(
          `${b}/gainDb`,
          `${what} gain of`,
          band.gainDb,
          roundToStep(band.gainDb, profile.eq.gainDb.step),
          'dB',
          `${profile.eq.gainDb.step} dB gain step`,
        );
      }
      const q = equivalentQ(band, fs);
      const qAt =
        band.q !== undefined
          ? 'q'
          : band.bandwidthOctaves !== undefined
            ? 'bandwidthOctaves'
            : band.shelfSlope !== undefined
              ? 'shelfSlope'
              : 'q';
      note(
        `${b}/${qAt}`,
        `${what} Q of`,
        q,
        roundToStep(q, profile.eq.q.step),
        '',
        `Q step of ${profile.eq.q.step}`,
      );
    });
    if (channel.highPass)
      crossover(`${at}/highPass/frequencyHz`, `${who}'s high-pass at`, channel.highPass.frequencyHz);
  });
  const lowPass = settings.subwoofer?.lowPass;
  if (lowPass)
    crossover('/subwoofer/lowPass/frequencyHz', "the subwoofer's low-pass at", lowPass.frequencyHz);
  return found;
}
