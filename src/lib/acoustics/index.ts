/**
 * Throwline acoustics core: pure functions, no framework, no I/O. Every function cites its source
 * in its doc comment and throws a RangeError with an actionable sentence on input outside its domain.
 */
export * from './limits';
export * from './bandwidth';
export * from './octave-bands';
export * from './notes';
export * from './spl-sum';
export * from './distance-loss';
export * from './background-correction';
export * from './weighting';
export * from './exposure';
export * from './speed-of-sound';
export * from './unit-conversions';
export * from './delay';
export * from './fill-delay';
export * from './sub-to-top-offset';
export * from './biquad';
export { RESPONSE_FLOOR_DB, biquadResponse, cascadeComplexResponse, type Complex, type PointResponse } from './biquad-response';
export * from './crossover';
export * from './filter-response';
export * from './frequency-grid';
export * from './wrap-phase';
export * from './crossover-ways';
export * from './analog-prototype';
export * from './signal-level';
export * from './wavelength';
export * from './comb-filter';
export * from './speaker-load';
export * from './max-spl';
export * from './noise-dose';
export * from './air-absorption';
export * from './sub-array';
