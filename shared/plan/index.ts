export {
  planRoom,
  type PlanInput,
  type PlanChannelInput,
  type RoomPlan,
  type PlanChannel,
  type PlanSubwoofer,
} from './plan-room';
export { alignSubwooferAtCrossover, type SubwooferAlignment } from './subwoofer-alignment';
export {
  checkTuningSettings,
  checkTuningSettingsAt,
  TUNING_LIMITS,
  type CrossoverSpec,
  type TuningChannel,
  type TuningSettings,
  type TuningSubwoofer,
} from './tuning';
export { planToTuningSettings } from './plan-to-tuning';
export {
  designTuning,
  type DesignedTuning,
  type DesignedChannel,
  type DesignedSection,
} from './tuning-design';
export { compareTunings, type TuningComparison, type ChannelDifference } from './tuning-compare';
export { tuningCautions } from './tuning-cautions';
export {
  integrateSubwoofer,
  type ComplexResponse,
  type SubwooferIntegration,
  type IntegrationCandidate,
} from './subwoofer-integration';
export {
  planStoredRoom,
  type StoredMeasurement,
  type StoredRoom,
  type StoredPlanOverrides,
  type StoredRoomPlan,
  type ChannelSources,
} from './stored-room-plan';
