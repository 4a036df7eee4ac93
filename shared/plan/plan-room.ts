import {
  planBassManagement,
  DEFAULT_BASS_CROSSOVER,
  DEFAULT_LFE_GAIN_DB,
} from '../bass-management/bass-management';
import { alignDelays } from '../delay/align-delays';
import {
  EQ_FIT_DEFAULTS,
  fitParametricEq,
  type EqFitResult,
  type PeakingBand,
} from '../eq-fit/fit-parametric-eq';
import type { TargetCurve } from '../eq-fit/target-curve';
import { CalculationInputError, withFieldPrefix } from '../errors';
import type { Sos } from '../dsp/sos';
import { designCrossover, type CrossoverFamily, type Polarity } from '../filters/crossover';
import {
  analyseGeometry,
  requireInsideRoom,
  requireUniqueIds,
  type RoomDimensions,
} from '../geometry/analyse-geometry';
import { toListenerPolar, type RoomPoint } from '../geometry/coordinates';
import { requireLayout } from '../layouts';
import { computeLevelTrims } from '../level/level-trims';
import type { Caution, CalculationWarning } from '../notices';
import type { ProcessorProfileSettings } from '../processor/profile';
import type { DistanceInput } from '../units/distance';
import { DEFAULT_SAMPLE_RATE_HZ } from '../units/sample-rate';
import { planCautions } from './plan-cautions';
import { alignSubwooferAtCrossover } from './subwoofer-alignment';

export interface PlanChannelInput {
  /** Channel label (`M+030`, `LFE1`). */
  id: string;
  /** Loudspeaker position in room coordinates; needs `room` and `listener`. */
  position?: RoomPoint;
  /** Distance to the listening position (metres, or a string with a unit). */
  distance?: DistanceInput;
  /** Measured arrival at the listening position, ms; preferred over position and distance for the delay. */
  arrivalMs?: number;
  /** SPL reading of the reference test signal at the listening position, dB. */
  measuredDb?: number;
  /** Level of this channel relative to the reference, dB (default +10 for LFE channels, 0 otherwise). */
  targetOffsetDb?: number;
  /** Measured magnitude response at the listening position; EQ is fitted only where one is given. */
  measuredResponse?: { frequenciesHz: number[]; magnitudeDb: number[] };
  /** Hand the low end of this channel to the subwoofer. */
  bassManaged?: boolean;
}

export interface PlanInput {
  layout: string;
  room?: RoomDimensions;
  listener?: RoomPoint;
  channels: PlanChannelInput[];
  targets?: {
    /** Reference level every channel is trimmed to, dB; absent: the quietest channel. */
    referenceDb?: number;
    crossoverHz?: number;
    crossoverFamily?: CrossoverFamily;
    crossoverOrder?: number;
    /** Target curve for the EQ fit (default flat). */
    curve?: TargetCurve;
    /** LFE in-band gain into the subwoofer feed, dB (default +10). */
    lfeGainDb?: number;
    /**
     * Largest EQ boost the fit may use, dB (default 0: cuts only, the safe choice); never more than
     * `limits.eqMaxBoostDb`.
     */
    eqMaxBoostDb?: number;
    /** Reverberation time of the room, s, for the EQ's transition frequency 2000·√(T/V) (default 0.3 s). */
    reverberationTimeS?: number;
    /** Upper end of the EQ correction, hertz (default: the room's transition frequency). */
    eqToHz?: number;
  };
  limits?: {
    delayMaxMs?: number;
    trimMinDb?: number;
    trimMaxDb?: number;
    eqBandsPerChannel?: number;
    eqMaxBoostDb?: number;
    eqMaxCutDb?: number;
    /** Lowest and highest filter frequency the processor takes, Hz: EQ bands are placed inside. */
    frequencyMinHz?: number;
    frequencyMaxHz?: number;
  };
  /**
   * The EQ part of the room's processor profile (plans of stored rooms): its band count, filter types and
   * frequency, gain and Q ranges bound the fit as the room's limits do.
   */
  processorEq?: ProcessorProfileSettings['eq'];
  temperatureC?: number;
  sampleRateHz?: number;
}

export interface PlanFilterPath {
  family: CrossoverFamily;
  order: number;
  frequencyHz: number;
  sections: Sos[];
}

export interface PlanChannel {
  id: string;
  role: 'managed' | 'fullRange' | 'lfe';
  distanceM: number | null;
  arrivalMs: number;
  delayMs: number;
  delaySamples: number;
  quantizationErrorUs: number;
  trimDb: number;
  /** Level expected at the listening position after the trim, dB; null without SPL readings. */
  expectedDb: number | null;
  polarity: Polarity;
  eq: {
    bands: PeakingBand[];
    sections: Sos[];
    residualRmsDb: { before: number; after: number } | null;
    predicted: { frequenciesHz: number[]; magnitudeDb: number[] } | null;
    fromHz: number | null;
    toHz: number | null;
    /** Largest boost and cut of the bands together, dB; null without a fit. */
    combined?: EqFitResult['combined'] | null;
    /** What each band corrects and what was left out; null without a fit. */
    explanation?: Pick<EqFitResult['explanation'], 'bands' | 'notUsed'> | null;
  };
  highPass: (PlanFilterPath & { polarity: Polarity }) | null;
}

export interface PlanSubwoofer {
  /** The output carrying the subwoofer feed: the first LFE channel, or null when there is none. */
  channel: string | null;
  lowPass: PlanFilterPath;
  lfeGainDb: number;
  headroomDb: number;
  /** The subwoofer's distance-aligned delay plus the crossover phase correction, ms (≥ 0). */
  suggestedDelayMs: number;
  suggestedDelaySamples: number;
  suggestedPolarity: Polarity;
  /** Phase of the subwoofer low-pass minus the mains' high-pass at the crossover, degrees. */
  crossoverPhaseDifferenceDeg: number;
}

export interface RoomPlan {
  layout: { id: string; name: string; title: string };
  sampleRateHz: number;
  speedOfSoundMps: number;
  referenceChannel: string;
  referenceDb: number | null;
  channels: PlanChannel[];
  subwoofer: PlanSubwoofer | null;
  warnings: CalculationWarning[];
  cautions: Caution[];
}

const LFE_LABEL = /^LFE\d*$/;
/** Levels of LFE channels are read in band 10 dB above the reference (BS.2051-3 Table 1 note 5; ISO 21727 85/95 dB). */
const LFE_TARGET_OFFSET_DB = 10;
/** The subwoofer's EQ is fitted up to one octave above the crossover [product choice]. */
const SUB_FIT_OCTAVES_ABOVE = 1;
/** A subwoofer's level is matched over its own band from here up, hertz [product choice]. */
const SUB_LEVEL_FROM_HZ = 30;
/** Without bass management the LFE band ends near 120 Hz (common practice). */
const LFE_BAND_TOP_HZ = 120;
/** Rounding noise below this is not worth a warning about a negative subwoofer delay, ms. */
const SUB_DELAY_SLACK_MS = 1e-6;

function positionsOf(input: PlanInput): Map<number, { distanceM: number }> {
  const positioned = new Map<number, { distanceM: number }>();
  const any = input.channels.some((c) => c.position !== undefined);
  if (!any) return positioned;
  if (!input.room) throw new CalculationInputError('room is required when channels give a position', '/room');
  if (!input.listener)
    throw new CalculationInputError('listener is required when channels give a position', '/listener');
  const room = input.room;
  requireInsideRoom(input.listener, room, '/listener', 'the listening position');
  input.channels.forEach((channel, i) => {
    if (!channel.position) return;
    requireInsideRoom(channel.position, room, `/channels/${i}/position`, `loudspeaker ${channel.id}`);
    positioned.set(i, {
      distanceM: toListenerPolar(input.listener as RoomPoint, channel.position).distanceM,
    });
  });
  return positioned;
}

/**
 * The whole room at once: per channel the delay that aligns arrivals at the listening position
 * (alignDelays), the trim to the reference level (computeLevelTrims; LFE channels 10 dB above it),
 * parametric EQ toward the target where a measured response is given (fitParametricEq, cut first,
 * within `limits`), the high-pass of bass-managed channels and the subwoofer path (planBassManagement),
 * with the subwoofer's polarity and delay lined up at the crossover (alignSubwooferAtCrossover).
 * Positions are checked against the layout (analyseGeometry) and its warnings included.
 * Deterministic: the same input always gives the same plan.
 * @throws CalculationInputError naming the field (`/channels/3/position/y`, `/limits/eqBandsPerChannel`).
 */
export function planRoom(input: PlanInput): RoomPlan {
  const layout = requireLayout(input.layout, '/layout');
  const fs = input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
  requireUniqueIds(input.channels, '/channels');
  const positioned = positionsOf(input);
  const warnings: CalculationWarning[] = [];

  if (input.room && input.listener && positioned.size > 0) {
    const geometry = analyseGeometry({
      room: input.room,
      listener: input.listener,
      layout: layout.id,
      speakers: input.channels.flatMap((c) => (c.position ? [{ id: c.id, ...c.position }] : [])),
    });
    warnings.push(
      ...geometry.warnings.filter((w) => w.code !== 'missingChannel' || !LFE_LABEL.test(w.channel ?? '')),
    );
  }

  const delays = alignDelays({
    channels: input.channels.map((c, i) => {
      if (c.arrivalMs !== undefined) return { id: c.id, arrivalMs: c.arrivalMs };
      const fromPosition = positioned.get(i)?.distanceM;
      if (fromPosition !== undefined) return { id: c.id, distance: fromPosition };
      if (c.distance !== undefined) return { id: c.id, distance: c.distance };
      throw new CalculationInputError(
        `${c.id} needs a position, a distance or an arrivalMs for its delay`,
        `/channels/${i}/position`,
      );
    }),
    temperatureC: input.temperatureC,
    sampleRateHz: fs,
    limits: { delayMaxMs: input.limits?.delayMaxMs },
  });
  warnings.push(...delays.warnings);

  const anyMeasured = input.channels.some((c) => c.measuredDb !== undefined);
  const levels = anyMeasured
    ? computeLevelTrims({
        channels: input.channels.map((c) => ({
          id: c.id,
          ...(c.measuredDb !== undefined && { measuredDb: c.measuredDb }),
          targetOffsetDb: c.targetOffsetDb ?? (LFE_LABEL.test(c.id) ? LFE_TARGET_OFFSET_DB : 0),
        })),
        targetDb: input.targets?.referenceDb,
        limits: { trimMinDb: input.limits?.trimMinDb, trimMaxDb: input.limits?.trimMaxDb },
      })
    : null;
  if (levels) warnings.push(...levels.warnings);
  else {
    warnings.push({
      code: 'noLevelReadings',
      message:
        'No SPL readings were given, so every trim is 0 dB; measure each channel at the listening position.',
    });
  }

  const crossover = withFieldPrefix('/targets', () =>
    checkedCrossover(
      {
        family: input.targets?.crossoverFamily ?? DEFAULT_BASS_CROSSOVER.family,
        order: input.targets?.crossoverOrder ?? DEFAULT_BASS_CROSSOVER.order,
        frequencyHz: input.targets?.crossoverHz ?? DEFAULT_BASS_CROSSOVER.frequencyHz,
      },
      fs,
    ),
  );
  const anyManaged = input.channels.some((c) => c.bassManaged);
  const lfeChannels = input.channels.filter((c) => LFE_LABEL.test(c.id));
  const bass =
    anyManaged || lfeChannels.length > 0
      ? planBassManagement({
          channels: input.channels.map((c) => ({ id: c.id, bassManaged: c.bassManaged ?? false })),
          crossover,
          lfeGainDb: input.targets?.lfeGainDb,
          sampleRateHz: fs,
        })
      : null;
  if (bass) warnings.push(...bass.warnings);

  const eqWarnings: CalculationWarning[] = [];
  const channels = input.channels.map((c, i): PlanChannel => {
    const delay = delays.channels[i];
    const level = levels?.channels[i];
    const role = bass?.channels[i].role ?? (LFE_LABEL.test(c.id) ? 'lfe' : 'fullRange');
    const highPass = bass?.channels[i].highPass ?? null;
    return {
      id: c.id,
      role,
      distanceM: delay.distanceM ?? null,
      arrivalMs: delay.arrivalMs,
      delayMs: delay.delayMs,
      delaySamples: delay.delaySamples,
      quantizationErrorUs: delay.quantizationErrorUs,
      trimDb: level?.trimDb ?? 0,
      expectedDb: level && c.measuredDb !== undefined ? level.expectedDb : null,
      polarity: highPass?.polarity ?? 'normal',
      eq: fitChannelEq(c, i, role, input, fs, anyManaged ? crossover.frequencyHz : null, eqWarnings),
      highPass,
    };
  });
  warnings.push(...eqWarnings);

  const subwoofer = bass
    ? subwooferPath(bass, channels, lfeChannels[0]?.id ?? null, anyManaged, fs, warnings)
    : null;
  return {
    layout: { id: layout.id, name: layout.name, title: layout.title },
    sampleRateHz: fs,
    speedOfSoundMps: delays.speedOfSoundMps,
    referenceChannel: delays.referenceChannel,
    referenceDb: levels?.targetDb ?? null,
    channels,
    subwoofer,
    warnings,
    cautions: planCautions(layout, channels, levels?.cautions ?? [], bass?.cautions ?? [], fs),
  };
}

function checkedCrossover(spec: { family: CrossoverFamily; order: number; frequencyHz: number }, fs: number) {
  try {
    designCrossover(spec, fs);
  } catch (error) {
    if (error instanceof CalculationInputError) {
      const name = error.field.replace('/', '');
      const key =
        name === 'frequencyHz' ? 'crossoverHz' : name === 'order' ? 'crossoverOrder' : 'crossoverFamily';
      throw new CalculationInputError(error.message, `/${key}`);
    }
    throw error;
  }
  return spec;
}

/** Runs `fn`, renaming the field of a CalculationInputError by the first matching prefix. */
function remapFields<T>(renames: Array<[from: string, to: string]>, fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (!(error instanceof CalculationInputError)) throw error;
    const match = renames.find(
      ([from]) => error.field === from || error.field.startsWith(from + '/') || from === '',
    );
    throw match
      ? new CalculationInputError(error.message, match[1] + error.field.slice(match[0].length))
      : error;
  }
}

function fitChannelEq(
  channel: PlanChannelInput,
  index: number,
  role: PlanChannel['role'],
  input: PlanInput,
  fs: number,
  crossoverHz: number | null,
  warnings: CalculationWarning[],
): PlanChannel['eq'] {
  const none = {
    bands: [],
    sections: [],
    residualRmsDb: null,
    predicted: null,
    fromHz: null,
    toHz: null,
    combined: null,
    explanation: null,
  };
  if (!channel.measuredResponse) return none;
  const maxBands = input.limits?.eqBandsPerChannel;
  if (maxBands === undefined) {
    throw new CalculationInputError(
      'limits.eqBandsPerChannel is required when measured responses are given',
      '/limits/eqBandsPerChannel',
    );
  }
  const subTopHz = crossoverHz !== null ? crossoverHz * 2 ** SUB_FIT_OCTAVES_ABOVE : LFE_BAND_TOP_HZ;
  // A subwoofer has no 500 Hz–2 kHz to match its level over: its own band is its reference.
  const band =
    role === 'lfe'
      ? { toHz: subTopHz, levelReferenceHz: { fromHz: SUB_LEVEL_FROM_HZ, toHz: subTopHz } }
      : role === 'managed' && crossoverHz !== null
        ? { fromHz: crossoverHz, toHz: input.targets?.eqToHz }
        : { toHz: input.targets?.eqToHz };
  const profile = input.processorEq;
  const lowestHz = Math.max(input.limits?.frequencyMinHz ?? 0, profile?.frequencyHz.min ?? 0);
  const highestHz = Math.min(input.limits?.frequencyMaxHz ?? Infinity, profile?.frequencyHz.max ?? Infinity);
  const bandRange =
    lowestHz > 0 || highestHz < Infinity
      ? { fromHz: Math.max(1, lowestHz), toHz: Math.min(highestHz, fs / 2) }
      : undefined;
  const room = input.room
    ? {
        volumeM3: input.room.widthM * input.room.lengthM * input.room.heightM,
        reverberationTimeS: input.targets?.reverberationTimeS,
      }
    : undefined;
  const fit = remapFields(
    [
      ['/measured', `/channels/${index}/measuredResponse`],
      ['/target', '/targets/curve'],
      ['/maxBands', '/limits/eqBandsPerChannel'],
      ['/maxBoostDb', '/targets/eqMaxBoostDb'],
      ['/maxCutDb', '/limits/eqMaxCutDb'],
      ['/room/reverberationTimeS', '/targets/reverberationTimeS'],
      ['/room', '/room'],
      ['/toHz', '/targets/eqToHz'],
      ['', `/channels/${index}/measuredResponse`],
    ],
    () =>
      fitParametricEq({
        sampleRateHz: fs,
        measured: channel.measuredResponse as { frequenciesHz: number[]; magnitudeDb: number[] },
        target: input.targets?.curve,
        maxBands: Math.min(maxBands, profile?.bandsPerChannel ?? Infinity),
        maxBoostDb: Math.max(
          0,
          Math.min(
            input.targets?.eqMaxBoostDb ?? 0,
            input.limits?.eqMaxBoostDb ?? Infinity,
            profile?.gainDb.max ?? Infinity,
          ),
        ),
        maxCutDb: Math.max(
          0,
          Math.min(input.limits?.eqMaxCutDb ?? EQ_FIT_DEFAULTS.maxCutDb, -(profile?.gainDb.min ?? -Infinity)),
        ),
        qRange: profile && {
          min: Math.max(EQ_FIT_DEFAULTS.qMin, profile.q.min),
          max: Math.max(
            Math.max(EQ_FIT_DEFAULTS.qMin, profile.q.min),
            Math.min(EQ_FIT_DEFAULTS.qMax, profile.q.max),
          ),
        },
        bandFrequencyRangeHz: bandRange,
        filterTypes: profile?.filterTypes,
        bandSteps: profile && {
          frequencyHz: profile.frequencyHz.step,
          frequencyStepUnit: profile.frequencyStepUnit,
          gainDb: profile.gainDb.step,
          q: profile.q.step,
        },
        room,
        ...band,
      }),
  );
  warnings.push(...fit.warnings.map((w) => ({ ...w, channel: channel.id })));
  return {
    bands: fit.bands,
    sections: fit.sections,
    residualRmsDb: fit.residualRmsDb,
    predicted: fit.predicted,
    fromHz: fit.fromHz,
    toHz: fit.toHz,
    combined: fit.combined,
    explanation: { bands: fit.explanation.bands, notUsed: fit.explanation.notUsed },
  };
}

function subwooferPath(
  bass: ReturnType<typeof planBassManagement>,
  channels: PlanChannel[],
  subChannel: string | null,
  anyManaged: boolean,
  fs: number,
  warnings: CalculationWarning[],
): PlanSubwoofer {
  const lowPass = bass.subwoofer.lowPass;
  const lfeGainDb = bass.subwoofer.inputs.find((x) => x.route === 'direct')?.gainDb ?? DEFAULT_LFE_GAIN_DB;
  const sub = channels.find((c) => c.id === subChannel);
  const managed = channels.find((c) => c.role === 'managed' && c.highPass);
  if (!subChannel || !sub) {
    warnings.push({
      code: 'noSubwooferChannel',
      message: 'Channels are bass-managed but no LFE channel carries a subwoofer; add the subwoofer as LFE1.',
    });
  }
  const alignment =
    anyManaged && managed?.highPass
      ? alignSubwooferAtCrossover(
          lowPass.sections,
          managed.highPass.sections,
          managed.highPass.polarity,
          lowPass.frequencyHz,
          fs,
        )
      : { polarity: 'normal' as Polarity, correctionMs: 0, phaseDifferenceDeg: 0 };
  const wanted = (sub?.delayMs ?? 0) + alignment.correctionMs;
  if (wanted < -SUB_DELAY_SLACK_MS) {
    warnings.push({
      code: 'subwooferEarlyAtCrossover',
      channel: subChannel ?? undefined,
      message: `Lining the subwoofer up at the crossover needs ${(-wanted).toFixed(3)} ms less delay than it has; add that delay to every other channel instead, or accept the offset.`,
    });
  }
  const suggestedDelayMs = Math.max(0, wanted);
  return {
    channel: sub ? sub.id : null,
    lowPass,
    lfeGainDb,
    headroomDb: bass.headroomDb,
    suggestedDelayMs,
    suggestedDelaySamples: Math.round((suggestedDelayMs * fs) / 1000),
    suggestedPolarity: alignment.polarity,
    crossoverPhaseDifferenceDeg: alignment.phaseDifferenceDeg,
  };
}
