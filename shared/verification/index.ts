export { promiseOfPlan, type TuningPromise, type SignOff } from './promise';
export {
  verifyTuning,
  judge,
  DEFAULT_TOLERANCES,
  type Tolerances,
  type Verification,
  type ChannelVerification,
  type Status,
} from './verify';
