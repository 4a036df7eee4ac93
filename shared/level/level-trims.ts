import { requireChannelList } from '../channel-list';
import { CalculationInputError, requireInRange } from '../errors';
import type { Caution, CalculationWarning } from '../notices';
import { HEARING_CAUTION } from '../plan/hearing';
import { parseDistanceM, type DistanceInput } from '../units/distance';
import { presentDb } from '../present';

/** Range of levels, targets and reference levels accepted, in dB. */
export const LEVEL_LIMIT_DB = 150;
/** Range of per-channel target offsets accepted, in dB. */
export const TARGET_OFFSET_LIMIT_DB = 40;

export interface LevelChannelInput {
  /** ITU-R BS.2051 label of the channel (`M+030`, `LFE1`), as in stored rooms; unique within the request. */
  id: string;
  /** Level read at the listening position with the test signal, in dB (SPL or another common reference). */
  measuredDb?: number;
  /** Distance to the listening position; the level is then estimated by the inverse-square law. */
  distance?: DistanceInput;
  /** This channel's target relative to the others, in dB (e.g. +10 for LFE in-band, −3 for cinema surrounds). */
  targetOffsetDb?: number;
}

export interface LevelInput {
  channels: LevelChannelInput[];
  /** Level every channel should reach, in dB. Absent: align to the quietest channel (all trims are cuts). */
  targetDb?: number;
  /**
   * Level each loudspeaker gives at 1 m with the test signal, in dB, for channels given by distance.
   * Needed with `targetDb` or with measured channels; otherwise estimates are relative to it (0 dB).
   */
  levelAt1mDb?: number;
  limits?: { trimMinDb?: number; trimMaxDb?: number };
}

export interface LevelChannelResult {
  id: string;
  /** The measured level, or the inverse-square estimate when `estimated`. */
  levelDb: number;
  estimated: boolean;
  distanceM?: number;
  /** Gain to apply, in dB (negative is a cut), after clamping. */
  trimDb: number;
  /** Level expected at the listening position once trimDb is applied. */
  expectedDb: number;
  clamped: boolean;
}

export interface LevelPlan {
  /** The reference level: the requested target, or the quietest channel's level less its offset. */
  targetDb: number;
  alignedTo: 'target' | 'quietestChannel';
  channels: LevelChannelResult[];
  warnings: CalculationWarning[];
  cautions: Caution[];
}

/**
 * Level trims that bring every channel to a reference level at the listening position:
 * `trim = target + targetOffset − level`. Without `targetDb` the reference is the quietest channel
 * (lowest `level − targetOffset`), so every trim is a cut. A channel given only by distance is
 * estimated by the inverse-square law `L(r) = L(1 m) − 20·log10(r / 1 m)` (direct sound only; room
 * reflections make real levels fall off more slowly, so measured SPL is preferred) and flagged
 * `estimated`. Trims outside `limits.trimMinDb..trimMaxDb` are clamped and warned.
 * @returns a new plan with cautions about loud test signals and boosts.
 * @throws CalculationInputError naming the field.
 */
export function computeLevelTrims(input: LevelInput): LevelPlan {
  const channels = requireChannelList(input.channels);
  channels.forEach(requireOneSource);
  const anyDistance = channels.some((c) => c.distance !== undefined);
  const anyMeasured = channels.some((c) => c.measuredDb !== undefined);
  const targetDb = optionalLevel(input.targetDb, 'targetDb', '/targetDb');
  let levelAt1mDb = optionalLevel(input.levelAt1mDb, 'levelAt1mDb', '/levelAt1mDb');
  if (anyDistance && levelAt1mDb === undefined) {
    if (targetDb !== undefined || anyMeasured) {
      throw new CalculationInputError(
        'levelAt1mDb is required to compare levels estimated from distance with a target or with measured levels',
        '/levelAt1mDb',
      );
    }
    levelAt1mDb = 0;
  }
  const { trimMinDb, trimMaxDb } = readTrimLimits(input.limits);

  const levels = channels.map((channel, i) => levelOf(channel, i, levelAt1mDb ?? 0));
  const offsets = channels.map((c, i) =>
    c.targetOffsetDb === undefined
      ? 0
      : requireInRange(
          c.targetOffsetDb,
          { min: -TARGET_OFFSET_LIMIT_DB, max: TARGET_OFFSET_LIMIT_DB, unit: 'dB' },
          'targetOffsetDb',
          `/channels/${i}/targetOffsetDb`,
        ),
  );
  const reference = targetDb ?? Math.min(...levels.map((l, i) => l.levelDb - offsets[i]));
  const warnings: CalculationWarning[] = [];

  const results = channels.map((channel, i): LevelChannelResult => {
    const { levelDb, distanceM } = levels[i];
    const idealDb = reference + offsets[i] - levelDb;
    const trimDb = Math.min(trimMaxDb ?? Infinity, Math.max(trimMinDb ?? -Infinity, idealDb));
    const clamped = trimDb !== idealDb;
    if (clamped) {
      warnings.push({
        code: 'trimClamped',
        channel: channel.id,
        message: `${channel.id} needs a trim of ${round2(idealDb)} dB but the processor allows ${trimMinDb === undefined ? '−∞' : presentDb(trimMinDb)} to ${trimMaxDb === undefined ? '+∞' : presentDb(trimMaxDb)} dB; it will be ${round2(Math.abs(idealDb - trimDb))} dB ${idealDb > trimDb ? 'quiet' : 'loud'}.`,
      });
    }
    return {
      id: channel.id,
      levelDb,
      estimated: distanceM !== undefined,
      ...(distanceM === undefined ? {} : { distanceM }),
      trimDb,
      expectedDb: levelDb + trimDb,
      clamped,
    };
  });
  if (anyDistance) {
    warnings.push({
      code: 'levelEstimated',
      message:
        'Levels from distance are inverse-square estimates of the direct sound only; confirm them with an SPL reading.',
    });
  }
  return {
    targetDb: reference,
    alignedTo: targetDb === undefined ? 'quietestChannel' : 'target',
    channels: results,
    warnings,
    cautions: levelCautions(results, trimMaxDb),
  };
}

function requireOneSource(channel: LevelChannelInput, i: number): void {
  const hasMeasured = channel.measuredDb !== undefined;
  if (hasMeasured === (channel.distance !== undefined)) {
    throw new CalculationInputError(
      'give exactly one of measuredDb or distance for each channel',
      `/channels/${i}/${hasMeasured ? 'distance' : 'measuredDb'}`,
    );
  }
}

function levelOf(
  channel: LevelChannelInput,
  i: number,
  levelAt1mDb: number,
): { levelDb: number; distanceM?: number } {
  if (channel.measuredDb !== undefined) {
    return {
      levelDb: optionalLevel(channel.measuredDb, 'measuredDb', `/channels/${i}/measuredDb`) as number,
    };
  }
  const distanceM = parseDistanceM(channel.distance as DistanceInput, `/channels/${i}/distance`);
  return { distanceM, levelDb: levelAt1mDb - 20 * Math.log10(distanceM) };
}

function optionalLevel(value: number | undefined, name: string, field: string): number | undefined {
  return value === undefined
    ? undefined
    : requireInRange(value, { min: -LEVEL_LIMIT_DB, max: LEVEL_LIMIT_DB, unit: 'dB' }, name, field);
}

function readTrimLimits(limits: LevelInput['limits']): { trimMinDb?: number; trimMaxDb?: number } {
  const trimMinDb =
    limits?.trimMinDb === undefined
      ? undefined
      : requireInRange(limits.trimMinDb, { max: 0, unit: 'dB' }, 'trimMinDb', '/limits/trimMinDb');
  const trimMaxDb =
    limits?.trimMaxDb === undefined
      ? undefined
      : requireInRange(limits.trimMaxDb, { min: 0, unit: 'dB' }, 'trimMaxDb', '/limits/trimMaxDb');
  return { trimMinDb, trimMaxDb };
}

/**
 * Level of every channel playing together at the listening position: the power sum
 * `10·log10(Σ 10^(L/10))` of the levels the channels will really reach (after clamped trims; the LFE at
 * its in-band offset), as for uncorrelated signals such as independent pink noise (IEC 61672-1 energy
 * summation of sound pressure levels). 79 dB and 89 dB together are 89.41 dB.
 */
export function combinedLevelDb(levelsDb: readonly number[]): number {
  return 10 * Math.log10(levelsDb.reduce((sum, db) => sum + Math.pow(10, db / 10), 0));
}

function levelCautions(results: LevelChannelResult[], trimMaxDb: number | undefined): Caution[] {
  const together = combinedLevelDb(results.map((r) => r.expectedDb));
  const cautions: Caution[] = [
    {
      code: 'testSignalLevel',
      message:
        'Level calibration plays test noise from each loudspeaker at the reference level. Start with the system ' +
        `turned down and raise it gradually. ${HEARING_CAUTION}` +
        (results.length > 1
          ? ` All ${results.length} channels playing together reach about ${round2(together)} dB at the listening position ` +
            '(power sum of the levels each channel will reach after its trim, the LFE included at its offset).'
          : ''),
    },
  ];
  const boosted = results.filter((r) => r.trimDb > 0).map((r) => r.id);
  if (boosted.length > 0) {
    cautions.push({
      code: 'levelBoost',
      message: `Positive trims raise the drive level of ${boosted.join(', ')}; check amplifier and loudspeaker headroom, or lower the target so every trim is a cut.`,
    });
  }
  const starved = results.filter((r) => r.clamped && trimMaxDb !== undefined && r.trimDb === trimMaxDb);
  if (starved.length > 0) {
    cautions.push({
      code: 'trimAtLimit',
      message: `${starved.map((r) => r.id).join(', ')} ${starved.length === 1 ? 'reads' : 'read'} so low that the trim runs into its limit of +${presentDb(trimMaxDb ?? 0)} dB. A channel this quiet usually has a fault: check the loudspeaker and its wiring before adding gain.`,
    });
  }
  return cautions;
}

function round2(value: number): number {
  return Math.round(value * 100) / 100;
}
