import { loadOpenApiDocument } from '../../api/openapi/document';
import {
  DEFAULT_BASS_CROSSOVER,
  DEFAULT_HEADROOM_WARNING_DB,
  DEFAULT_LFE_GAIN_DB,
} from '../../shared/bass-management/bass-management';
import { DEFAULT_SMOOTHING_OCTAVES } from '../../shared/analysis/analyze-impulse-response';
import { MAX_SMOOTHING_OCTAVES } from '../../shared/analysis/smoothing';
import { ARRIVAL_MAX_MS } from '../../shared/delay/align-delays';
import { DISTANCE_MAX_M } from '../../shared/units/distance';
import { DEFAULT_SWEEP_LEVEL_DBFS, TEST_SIGNAL_DEFAULTS } from '../../shared/capture/test-signal';
import { EQ_FIT_DEFAULTS, EQ_FIT_LIMITS } from '../../shared/eq-fit/fit-parametric-eq';
import { TARGET_LIMITS } from '../../shared/eq-fit/target-curve';
import { FILTER_LIMITS } from '../../shared/filters/biquad-design';
import { GEOMETRY_LIMITS } from '../../shared/geometry/analyse-geometry';
import {
  DEFAULT_SAMPLE_RATE_HZ,
  LIMITS,
  MAX_FREQUENCY_HZ,
  SAMPLE_RATE_MAX_HZ,
  SAMPLE_RATE_MIN_HZ,
} from '../../shared/limits';
import { TUNING_LIMITS } from '../../shared/plan/tuning';
import { contractBounds } from '../support/contract-bounds';

const limits: Record<string, object> = LIMITS;
const found = contractBounds(loadOpenApiDocument());

describe('every bound of the contract comes from shared/limits.ts', () => {
  it.each(found.map((b) => [b.where, b] as const))('%s', (_where, bound) => {
    const entry = limits[bound.key] ?? limits[bound.name];
    expect({ key: bound.key, bounds: entry }).toEqual({ key: bound.key, bounds: bound.bounds });
  });

  it('has no entry the contract does not use', () => {
    const used = new Set(found.flatMap((b) => [b.key, b.name]));
    expect(Object.keys(LIMITS).filter((key) => !used.has(key))).toEqual([]);
  });

  it('would notice a bound that differs from its entry', () => {
    const document = loadOpenApiDocument();
    const schemas = document.components.schemas as Record<string, { maximum?: number }>;
    schemas.SampleRateHz.maximum = 192000;
    const changed = contractBounds(document).find((b) => b.key === 'SampleRateHz');
    expect(changed?.bounds).not.toEqual(limits.SampleRateHz);
  });
});

/**
 * The core keeps named tables of the same bounds (its checks run for callers that skip the contract).
 * Each value must equal the contract's bound it restates, read from openapi/ itself, so a table that is
 * written by hand again and drifts fails here rather than making the core and the API disagree.
 */
describe("the core's limit tables restate the contract's bounds", () => {
  /** The one bound every schema under `key` (or, for a plain name, every one without its own entry) has. */
  const contract = (key: string): Record<string, unknown> => {
    const matching = found.filter((b) => b.key === key || (b.name === key && !(b.key in LIMITS)));
    expect({ key, schemas: matching.length > 0 }).toEqual({ key, schemas: true });
    const distinct = new Set(matching.map((b) => JSON.stringify(b.bounds)));
    expect({ key, distinct: [...distinct] }).toEqual({ key, distinct: [JSON.stringify(matching[0].bounds)] });
    return matching[0].bounds;
  };

  const restated: Array<[string, number, string, string]> = [
    ['FILTER_LIMITS.frequencyMinHz', FILTER_LIMITS.frequencyMinHz, 'frequencyHz', 'minimum'],
    ['FILTER_LIMITS.gainMinDb', FILTER_LIMITS.gainMinDb, 'FilterSpec.gainDb', 'minimum'],
    ['FILTER_LIMITS.gainMaxDb', FILTER_LIMITS.gainMaxDb, 'FilterSpec.gainDb', 'maximum'],
    ['FILTER_LIMITS.qMin', FILTER_LIMITS.qMin, 'q', 'minimum'],
    ['FILTER_LIMITS.qMax', FILTER_LIMITS.qMax, 'q', 'maximum'],
    ['FILTER_LIMITS.bandwidthMinOctaves', FILTER_LIMITS.bandwidthMinOctaves, 'bandwidthOctaves', 'minimum'],
    ['FILTER_LIMITS.bandwidthMaxOctaves', FILTER_LIMITS.bandwidthMaxOctaves, 'bandwidthOctaves', 'maximum'],
    ['FILTER_LIMITS.shelfSlopeMin', FILTER_LIMITS.shelfSlopeMin, 'shelfSlope', 'minimum'],
    ['FILTER_LIMITS.shelfSlopeMax', FILTER_LIMITS.shelfSlopeMax, 'shelfSlope', 'maximum'],
    ['TARGET_LIMITS.tiltMinDbPerOctave', TARGET_LIMITS.tiltMinDbPerOctave, 'dbPerOctave', 'minimum'],
    ['TARGET_LIMITS.tiltMaxDbPerOctave', TARGET_LIMITS.tiltMaxDbPerOctave, 'dbPerOctave', 'maximum'],
    ['TARGET_LIMITS.pivotMinHz', TARGET_LIMITS.pivotMinHz, 'pivotHz', 'minimum'],
    ['TARGET_LIMITS.pivotMaxHz', TARGET_LIMITS.pivotMaxHz, 'pivotHz', 'maximum'],
    ['TARGET_LIMITS.liftMinDb', TARGET_LIMITS.liftMinDb, 'TargetCurve|object.gainDb', 'minimum'],
    ['TARGET_LIMITS.liftMaxDb', TARGET_LIMITS.liftMaxDb, 'TargetCurve|object.gainDb', 'maximum'],
    ['TARGET_LIMITS.cornerMinHz', TARGET_LIMITS.cornerMinHz, 'cornerHz', 'minimum'],
    ['TARGET_LIMITS.cornerMaxHz', TARGET_LIMITS.cornerMaxHz, 'cornerHz', 'maximum'],
    ['TARGET_LIMITS.pointsMin', TARGET_LIMITS.pointsMin, 'TargetPoints', 'minItems'],
    ['TARGET_LIMITS.pointsMax', TARGET_LIMITS.pointsMax, 'TargetPoints', 'maxItems'],
    ['TARGET_LIMITS.pointMinHz', TARGET_LIMITS.pointMinHz, 'TargetPoint.frequencyHz', 'minimum'],
    ['TARGET_LIMITS.pointMaxHz', TARGET_LIMITS.pointMaxHz, 'TargetPoint.frequencyHz', 'maximum'],
    ['TARGET_LIMITS.pointMinDb', TARGET_LIMITS.pointMinDb, 'TargetPoint.gainDb', 'minimum'],
    ['TARGET_LIMITS.pointMaxDb', TARGET_LIMITS.pointMaxDb, 'TargetPoint.gainDb', 'maximum'],
    ['EQ_FIT_LIMITS.maxBands', EQ_FIT_LIMITS.maxBands, 'maxBands', 'maximum'],
    ['EQ_FIT_LIMITS.maxBoostDb', EQ_FIT_LIMITS.maxBoostDb, 'maxBoostDb', 'maximum'],
    ['EQ_FIT_LIMITS.maxCutDb', EQ_FIT_LIMITS.maxCutDb, 'maxCutDb', 'maximum'],
    ['EQ_FIT_LIMITS.maxPositions', EQ_FIT_LIMITS.maxPositions, 'EqFitRequest.positions', 'maxItems'],
    ['EQ_FIT_LIMITS.minGainMaxDb', EQ_FIT_LIMITS.minGainMaxDb, 'minGainDb', 'maximum'],
    ['EQ_FIT_LIMITS.aboveMaxBands', EQ_FIT_LIMITS.aboveMaxBands, 'AboveTransition.maxBands', 'maximum'],
    ['EQ_FIT_LIMITS.aboveQMin', EQ_FIT_LIMITS.aboveQMin, 'AboveTransition.qMax', 'minimum'],
    ['EQ_FIT_LIMITS.aboveQMaxMax', EQ_FIT_LIMITS.aboveQMaxMax, 'AboveTransition.qMax', 'maximum'],
    ['EQ_FIT_DEFAULTS.maxBoostDb', EQ_FIT_DEFAULTS.maxBoostDb, 'maxBoostDb', 'default'],
    ['EQ_FIT_DEFAULTS.maxCutDb', EQ_FIT_DEFAULTS.maxCutDb, 'maxCutDb', 'default'],
    ['EQ_FIT_DEFAULTS.minGainDb', EQ_FIT_DEFAULTS.minGainDb, 'minGainDb', 'default'],
    ['EQ_FIT_DEFAULTS.aboveMaxBands', EQ_FIT_DEFAULTS.aboveMaxBands, 'AboveTransition.maxBands', 'default'],
    [
      'EQ_FIT_DEFAULTS.aboveMaxBoostDb',
      EQ_FIT_DEFAULTS.aboveMaxBoostDb,
      'AboveTransition.maxBoostDb',
      'default',
    ],
    ['EQ_FIT_DEFAULTS.aboveMaxCutDb', EQ_FIT_DEFAULTS.aboveMaxCutDb, 'AboveTransition.maxCutDb', 'default'],
    ['EQ_FIT_DEFAULTS.aboveQMax', EQ_FIT_DEFAULTS.aboveQMax, 'AboveTransition.qMax', 'default'],
    ['TUNING_LIMITS.delayMaxMs', TUNING_LIMITS.delayMaxMs, 'delayMs', 'maximum'],
    ['TUNING_LIMITS.trimMinDb', TUNING_LIMITS.trimMinDb, 'trimDb', 'minimum'],
    ['TUNING_LIMITS.trimMaxDb', TUNING_LIMITS.trimMaxDb, 'trimDb', 'maximum'],
    ['TUNING_LIMITS.eqMaxSections', TUNING_LIMITS.eqMaxSections, 'eq', 'maxItems'],
    ['TUNING_LIMITS.lfeGainMinDb', TUNING_LIMITS.lfeGainMinDb, 'TuningSubwoofer.lfeGainDb', 'minimum'],
    ['TUNING_LIMITS.lfeGainMaxDb', TUNING_LIMITS.lfeGainMaxDb, 'TuningSubwoofer.lfeGainDb', 'maximum'],
    ['GEOMETRY_LIMITS.roomMaxM', GEOMETRY_LIMITS.roomMaxM, 'RoomDimensions.widthM', 'maximum'],
    [
      'GEOMETRY_LIMITS.maxAngleToleranceDeg',
      GEOMETRY_LIMITS.maxAngleToleranceDeg,
      'angleToleranceDeg',
      'maximum',
    ],
    [
      'GEOMETRY_LIMITS.defaultAngleToleranceDeg',
      GEOMETRY_LIMITS.defaultAngleToleranceDeg,
      'angleToleranceDeg',
      'default',
    ],
    ['DEFAULT_LFE_GAIN_DB', DEFAULT_LFE_GAIN_DB, 'BassManagementRequest.lfeGainDb', 'default'],
    ['DEFAULT_HEADROOM_WARNING_DB', DEFAULT_HEADROOM_WARNING_DB, 'headroomWarningDb', 'default'],
    ['DEFAULT_BASS_CROSSOVER.order', DEFAULT_BASS_CROSSOVER.order, 'crossoverOrder', 'default'],
    ['DEFAULT_BASS_CROSSOVER.frequencyHz', DEFAULT_BASS_CROSSOVER.frequencyHz, 'crossoverHz', 'default'],
    ['DEFAULT_SWEEP_LEVEL_DBFS', DEFAULT_SWEEP_LEVEL_DBFS, 'SweepRecordingUpload.levelDbfs', 'default'],
    ['TEST_SIGNAL_DEFAULTS.startHz', TEST_SIGNAL_DEFAULTS.startHz, 'SweepRecordingUpload.startHz', 'default'],
    ['TEST_SIGNAL_DEFAULTS.endHz', TEST_SIGNAL_DEFAULTS.endHz, 'SweepRecordingUpload.endHz', 'default'],
    ['TEST_SIGNAL_DEFAULTS.fadeInS', TEST_SIGNAL_DEFAULTS.fadeInS, 'SweepRecordingUpload.fadeInS', 'default'],
    [
      'TEST_SIGNAL_DEFAULTS.fadeOutS',
      TEST_SIGNAL_DEFAULTS.fadeOutS,
      'SweepRecordingUpload.fadeOutS',
      'default',
    ],
    ['DEFAULT_SMOOTHING_OCTAVES', DEFAULT_SMOOTHING_OCTAVES, 'smoothingOctaves', 'default'],
    ['MAX_SMOOTHING_OCTAVES', MAX_SMOOTHING_OCTAVES, 'smoothingOctaves', 'maximum'],
    ['ARRIVAL_MAX_MS', ARRIVAL_MAX_MS, 'arrivalMs', 'maximum'],
    ['DISTANCE_MAX_M', DISTANCE_MAX_M, 'Distance|number', 'maximum'],
    ['SAMPLE_RATE_MIN_HZ', SAMPLE_RATE_MIN_HZ, 'SampleRateHz', 'minimum'],
    ['SAMPLE_RATE_MAX_HZ', SAMPLE_RATE_MAX_HZ, 'SampleRateHz', 'maximum'],
    ['DEFAULT_SAMPLE_RATE_HZ', DEFAULT_SAMPLE_RATE_HZ, 'SampleRateHz', 'default'],
    ['MAX_FREQUENCY_HZ', MAX_FREQUENCY_HZ, 'frequencyHz', 'maximum'],
  ];

  it.each(restated)("%s (%d) equals the contract's %s %s", (_name, value, key, keyword) => {
    expect({ key, keyword, value }).toEqual({ key, keyword, value: contract(key)[keyword] });
  });
});
