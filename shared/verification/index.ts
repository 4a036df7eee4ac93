export { promiseOfPlan, type TuningPromise, type SignOff } from './promise';
