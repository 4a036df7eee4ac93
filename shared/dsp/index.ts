/**
 * The signal-processing core: one section type, one complex type, one response evaluator (magnitude,
 * phase, group delay), one filter routine and one logarithmic frequency grid. Filter design lives in
 * `filters/` (cookbook biquads, crossovers) and `analysis/` (band filters); everything that evaluates or
 * runs sections comes here.
 */
export * from './complex';
export * from './grid';
export * from './response';
export * from './sos';
export * from './sosfilt';
