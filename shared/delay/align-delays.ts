import { resolveSpeedOfSound } from '../acoustics/speed-of-sound';
import { requireChannelList } from '../channel-list';
import { CalculationInputError, requireInRange } from '../errors';
import { LIMITS } from '../limits';
import type { CalculationWarning } from '../notices';
import { parseDistanceM, type DistanceInput } from '../units/distance';
import { DEFAULT_SAMPLE_RATE_HZ } from '../units/sample-rate';
import { presentMs } from '../present';

/** Longest measured arrival accepted, in ms (about 340 m of travel). */
export const ARRIVAL_MAX_MS = LIMITS.arrivalMs.maximum;
/** ITU-R BS.2051-3, Table 1 note 1: loudspeakers should arrive together within 100 µs. */
export const ALIGNMENT_TOLERANCE_US = 100;

export interface DelayChannelInput {
  /** ITU-R BS.2051 label or another name of the feed; unique within the request. */
  id: string;
  /** Distance from the loudspeaker to the listening position (metres, or a string with a unit). */
  distance?: DistanceInput;
  /** Measured arrival time at the listening position in ms. */
  arrivalMs?: number;
}

export interface DelayInput {
  channels: DelayChannelInput[];
  temperatureC?: number;
  speedOfSoundMps?: number;
  /** Processor sample rate in hertz; 48000 when absent. */
  sampleRateHz?: number;
  limits?: { delayMaxMs?: number };
}

export interface DelayChannelResult {
  id: string;
  /** The distance in metres, when the channel gave one. */
  distanceM?: number;
  /** Arrival at the listening position in ms: measured, or distance / speed of sound. */
  arrivalMs: number;
  /** Delay to apply in ms, exact (after clamping to limits.delayMaxMs). */
  delayMs: number;
  /** delayMs rounded to the nearest whole sample at sampleRateHz (rounded down when clamped). */
  delaySamples: number;
  /** delaySamples as time minus delayMs, in µs; at most half a sample unless clamped. */
  quantizationErrorUs: number;
  clamped: boolean;
}

export interface DelayPlan {
  speedOfSoundMps: number;
  sampleRateHz: number;
  /** The channel that arrives last; it gets no delay. */
  referenceChannel: string;
  channels: DelayChannelResult[];
  warnings: CalculationWarning[];
}

/**
 * Delays that make every loudspeaker arrive at the listening position together. The latest arrival
 * is the reference: `delay_i = max(arrival) − arrival_i`, with `arrival = distance / c` for channels
 * given by distance (c from `speedOfSoundMps`, or `temperatureC`, or 20 °C; see speed-of-sound.ts)
 * and the measured `arrivalMs` otherwise. Each delay is also given in whole samples at
 * `sampleRateHz`, with what the rounding left in µs. A delay beyond `limits.delayMaxMs` is clamped
 * and warned, since that channel will then arrive early.
 * @returns a new plan; the input is not modified.
 * @throws CalculationInputError naming the field (`/channels/2/distance`, ...).
 */
export function alignDelays(input: DelayInput): DelayPlan {
  const channels = requireChannelList(input.channels);
  const speed = resolveSpeedOfSound(input);
  const fs = input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
  const delayMaxMs =
    input.limits?.delayMaxMs === undefined
      ? undefined
      : requireInRange(input.limits.delayMaxMs, { min: 0, unit: 'ms' }, 'delayMaxMs', '/limits/delayMaxMs');

  const arrivals = channels.map((channel, i) => arrivalOf(channel, i, speed));
  const latest = arrivals.reduce((best, a, i) => (a.arrivalMs > arrivals[best].arrivalMs ? i : best), 0);
  const warnings: CalculationWarning[] = [];
  if (arrivals.some((a) => a.distanceM === undefined) && arrivals.some((a) => a.distanceM !== undefined)) {
    warnings.push({
      code: 'mixedArrivalSources',
      message:
        'Measured arrivals and arrivals computed from distance are compared as pure acoustic travel time; ' +
        'a measured arrival that includes converter or processing latency will be misaligned by that latency.',
    });
  }

  const results = channels.map((channel, i): DelayChannelResult => {
    const { arrivalMs, distanceM } = arrivals[i];
    const idealMs = arrivals[latest].arrivalMs - arrivalMs;
    const clamped = delayMaxMs !== undefined && idealMs > delayMaxMs;
    const delayMs = clamped ? delayMaxMs : idealMs;
    const delaySamples = clamped ? Math.floor((delayMs * fs) / 1000) : Math.round((delayMs * fs) / 1000);
    if (clamped) {
      warnings.push({
        code: 'delayClamped',
        channel: channel.id,
        message:
          `${channel.id} needs ${round(idealMs, 3)} ms of delay but the processor allows at most ${presentMs(delayMaxMs)} ms; ` +
          `it will arrive ${round(idealMs - delayMs, 3)} ms early (alignment within ${ALIGNMENT_TOLERANCE_US} µs is ` +
          'recommended by ITU-R BS.2051-3).',
      });
    }
    return {
      id: channel.id,
      ...(distanceM === undefined ? {} : { distanceM }),
      arrivalMs,
      delayMs,
      delaySamples,
      quantizationErrorUs: ((delaySamples / fs) * 1000 - delayMs) * 1000,
      clamped,
    };
  });
  return {
    speedOfSoundMps: speed,
    sampleRateHz: fs,
    referenceChannel: channels[latest].id,
    channels: results,
    warnings,
  };
}

function arrivalOf(
  channel: DelayChannelInput,
  i: number,
  speed: number,
): { arrivalMs: number; distanceM?: number } {
  const hasDistance = channel.distance !== undefined;
  const hasArrival = channel.arrivalMs !== undefined;
  if (hasDistance === hasArrival) {
    throw new CalculationInputError(
      'give exactly one of distance or arrivalMs for each channel',
      `/channels/${i}/${hasDistance ? 'arrivalMs' : 'distance'}`,
    );
  }
  if (hasArrival) {
    return {
      arrivalMs: requireInRange(
        channel.arrivalMs,
        { min: 0, max: ARRIVAL_MAX_MS, unit: 'ms' },
        'arrivalMs',
        `/channels/${i}/arrivalMs`,
      ),
    };
  }
  const distanceM = parseDistanceM(channel.distance as DistanceInput, `/channels/${i}/distance`);
  return { distanceM, arrivalMs: (distanceM / speed) * 1000 };
}

function round(value: number, digits: number): number {
  const scale = Math.pow(10, digits);
  return Math.round(value * scale) / scale;
}
