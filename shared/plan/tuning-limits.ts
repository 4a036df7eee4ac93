import type { FilterSpec } from '../filters/biquad-design';
import { eqExtremes } from '../filters/eq-extremes';
import { equivalentQ } from '../filters/equivalent-q';
import type { ProcessorProfileSettings } from '../processor/profile';
import type { TuningSettings } from './tuning';

/** What a stored room says its processor can do (every field optional: absent means no limit). */
export interface RoomLimits {
  delayMaxMs?: number;
  trimMinDb?: number;
  trimMaxDb?: number;
  eqBandsPerChannel?: number;
  /** Largest boost of a channel's EQ, dB: of each band and of the bands together. */
  eqMaxBoostDb?: number;
  /** Largest cut of one EQ band, dB (positive). */
  eqMaxCutDb?: number;
  /** Lowest and highest frequency of any filter (EQ band or crossover), Hz. */
  frequencyMinHz?: number;
  frequencyMaxHz?: number;
}

/** One setting outside a limit. */
export interface LimitViolation {
  /** JSON pointer into the tuning settings: `/channels/3/trimDb`, `/channels/0/eq/2/gainDb`, `/sampleRateHz`. */
  setting: string;
  limit: {
    /** The limit's name as stored: `trimMaxDb`, `eqMaxBoostDb`, `delay.max`, `eq.filterTypes`, ... */
    name: string;
    value: number | string | Array<number | string>;
    source: 'room' | 'profile';
  };
  message: string;
}

/**
 * Slack for the summed-response checks, dB: a single +3 dB peak is +3.0000000001 dB when evaluated, and
 * must still be accepted by a +3 dB limit. Far below any processor's gain step (common practice 0.1 dB).
 */
const SUMMED_SLACK_DB = 1e-6;

const fmt = (value: number): string => String(Math.round(value * 10000) / 10000);

interface Check {
  setting: string;
  name: string;
  value: number;
  limit: number;
  source: 'room' | 'profile';
  what: string;
  unit: string;
  above: boolean;
}

/**
 * Every setting of a tuning that lies outside the room's limits or its processor profile's, in the
 * order of the settings (none: the tuning fits). Nothing is clamped: the caller refuses the write.
 * Checked: delay range, trim range, EQ band count, each band's boost and cut and the boost of the bands
 * together (designed response, see eqExtremes), the frequency range of EQ bands and
 * crossovers; from a profile also its sample rates, delay range (ms or samples), trim range, filter
 * types, gain range per band and Q range. Delays in samples are converted at the tuning's sample rate.
 * Pure; the settings must already have passed checkTuningSettings (every filter designable).
 */
export function findLimitViolations(
  settings: TuningSettings,
  room: RoomLimits | null | undefined,
  profile?: ProcessorProfileSettings | null,
): LimitViolation[] {
  const found: LimitViolation[] = [];
  const fs = settings.sampleRateHz;
  const outside = (c: Check): void => {
    if (c.above ? c.value <= c.limit : c.value >= c.limit) return;
    found.push({
      setting: c.setting,
      limit: { name: c.name, value: c.limit, source: c.source },
      message: `${c.what} is ${fmt(c.value)}${c.unit}; the ${c.source === 'room' ? "room's" : "processor profile's"} ${c.name} is ${fmt(c.limit)}${c.unit}`,
    });
  };
  const max = (
    setting: string,
    value: number,
    name: string,
    limit: number | undefined,
    what: string,
    unit: string,
    source: 'room' | 'profile' = 'room',
  ) => {
    if (limit !== undefined) outside({ setting, name, value, limit, source, what, unit, above: true });
  };
  const min = (
    setting: string,
    value: number,
    name: string,
    limit: number | undefined,
    what: string,
    unit: string,
    source: 'room' | 'profile' = 'room',
  ) => {
    if (limit !== undefined) outside({ setting, name, value, limit, source, what, unit, above: false });
  };

  if (profile && !profile.sampleRatesHz.includes(fs)) {
    found.push({
      setting: '/sampleRateHz',
      limit: { name: 'sampleRatesHz', value: [...profile.sampleRatesHz], source: 'profile' },
      message: `the sample rate is ${fs} Hz; the processor profile's sampleRatesHz are ${profile.sampleRatesHz.join(', ')} Hz`,
    });
  }
  const frequency = (setting: string, hz: number, what: string) => {
    min(setting, hz, 'frequencyMinHz', room?.frequencyMinHz, what, ' Hz');
    max(setting, hz, 'frequencyMaxHz', room?.frequencyMaxHz, what, ' Hz');
    if (profile) {
      min(setting, hz, 'eq.frequencyHz.min', profile.eq.frequencyHz.min, what, ' Hz', 'profile');
      max(setting, hz, 'eq.frequencyHz.max', profile.eq.frequencyHz.max, what, ' Hz', 'profile');
    }
  };

  settings.channels.forEach((channel, i) => {
    const at = `/channels/${i}`;
    const who = channel.id;
    max(`${at}/delayMs`, channel.delayMs, 'delayMaxMs', room?.delayMaxMs, `${who}'s delay`, ' ms');
    min(`${at}/trimDb`, channel.trimDb, 'trimMinDb', room?.trimMinDb, `${who}'s trim`, ' dB');
    max(`${at}/trimDb`, channel.trimDb, 'trimMaxDb', room?.trimMaxDb, `${who}'s trim`, ' dB');
    if (profile) {
      const d = profile.delay;
      // Samples from ms carry float noise (75 ms at 48 kHz is 3600.0000000000005 samples); 1e-9 of a sample is not a setting.
      const delay = d.unit === 'ms' ? channel.delayMs : Math.round(channel.delayMs * fs * 1e6) / 1e9;
      const unit = d.unit === 'ms' ? ' ms' : ' samples';
      min(`${at}/delayMs`, delay, 'delay.min', d.min, `${who}'s delay`, unit, 'profile');
      max(`${at}/delayMs`, delay, 'delay.max', d.max, `${who}'s delay`, unit, 'profile');
      min(
        `${at}/trimDb`,
        channel.trimDb,
        'trimDb.min',
        profile.trimDb.min,
        `${who}'s trim`,
        ' dB',
        'profile',
      );
      max(
        `${at}/trimDb`,
        channel.trimDb,
        'trimDb.max',
        profile.trimDb.max,
        `${who}'s trim`,
        ' dB',
        'profile',
      );
    }
    const bands = channel.eq.length;
    max(`${at}/eq`, bands, 'eqBandsPerChannel', room?.eqBandsPerChannel, `${who}'s number of EQ bands`, '');
    if (profile) {
      max(
        `${at}/eq`,
        bands,
        'eq.bandsPerChannel',
        profile.eq.bandsPerChannel,
        `${who}'s number of EQ bands`,
        '',
        'profile',
      );
    }
    const bandOver = { boost: false };
    channel.eq.forEach((band: FilterSpec, j) => {
      const b = `${at}/eq/${j}`;
      const what = `${who}'s EQ band ${j}`;
      frequency(`${b}/frequencyHz`, band.frequencyHz, `${what} frequency`);
      if (profile && !profile.eq.filterTypes.includes(band.type)) {
        found.push({
          setting: `${b}/type`,
          limit: { name: 'eq.filterTypes', value: [...profile.eq.filterTypes], source: 'profile' },
          message: `${what} is a ${band.type} filter; the processor profile's eq.filterTypes are ${profile.eq.filterTypes.join(', ')}`,
        });
      }
      if (band.gainDb !== undefined) {
        const before = found.length;
        max(`${b}/gainDb`, band.gainDb, 'eqMaxBoostDb', room?.eqMaxBoostDb, `${what} boost`, ' dB');
        bandOver.boost ||= found.length > before;
        max(`${b}/gainDb`, -band.gainDb, 'eqMaxCutDb', room?.eqMaxCutDb, `${what} cut`, ' dB');
        if (profile) {
          min(
            `${b}/gainDb`,
            band.gainDb,
            'eq.gainDb.min',
            profile.eq.gainDb.min,
            `${what} gain`,
            ' dB',
            'profile',
          );
          max(
            `${b}/gainDb`,
            band.gainDb,
            'eq.gainDb.max',
            profile.eq.gainDb.max,
            `${what} gain`,
            ' dB',
            'profile',
          );
        }
      }
      if (profile) {
        const q = equivalentQ(band, fs);
        const qAt =
          band.q !== undefined
            ? 'q'
            : band.bandwidthOctaves !== undefined
              ? 'bandwidthOctaves'
              : band.shelfSlope !== undefined
                ? 'shelfSlope'
                : 'q';
        min(`${b}/${qAt}`, q, 'eq.q.min', profile.eq.q.min, `${what} Q`, '', 'profile');
        max(`${b}/${qAt}`, q, 'eq.q.max', profile.eq.q.max, `${what} Q`, '', 'profile');
      }
    });
    if (channel.highPass)
      frequency(`${at}/highPass/frequencyHz`, channel.highPass.frequencyHz, `${who}'s high-pass frequency`);
    // Bands each inside the boost limit can still add up beyond it where they overlap, and a boost is
    // what overdrives amplifiers and drivers, so the summed response is held to it too. A cut limit is
    // the processor's range for one band's gain; deep summed cuts (a room mode tamed by two bands) are
    // safe and stay allowed.
    const boostLimit = room?.eqMaxBoostDb;
    if (boostLimit !== undefined && !bandOver.boost) {
      const x = eqExtremes(channel.eq, fs);
      if (x.maxBoostDb > boostLimit + SUMMED_SLACK_DB) {
        found.push({
          setting: `${at}/eq`,
          limit: { name: 'eqMaxBoostDb', value: boostLimit, source: 'room' },
          message: `${who}'s EQ bands together boost ${fmt(x.maxBoostDb)} dB at ${fmt(x.maxBoostHz ?? 0)} Hz; the room's eqMaxBoostDb is ${fmt(boostLimit)} dB`,
        });
      }
    }
  });
  const lowPass = settings.subwoofer?.lowPass;
  if (lowPass)
    frequency('/subwoofer/lowPass/frequencyHz', lowPass.frequencyHz, "the subwoofer's low-pass frequency");
  return found;
}
