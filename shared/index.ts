export * from './errors';
export * from './units/sample-rate';
export * from './filters/biquad-design';
export * from './filters/response';
