// Hueledger's colour core: CIELAB D65 and CIEDE2000 through culori, exact nearest-chip search,
// "between", display hex, verdict bands and chip names. Pure functions, no Node or browser APIs.
export * from './constants.js';
export * from './lab.js';
export * from './parse.js';
export * from './delta-e.js';
export * from './delta-e-bound.js';
export * from './chip-index.js';
export * from './nearest.js';
export * from './between.js';
export * from './matcher.js';
export * from './verdict.js';
export * from './display-hex.js';
export * from './colour-name.js';
export * from './field-groups.js';
export * from './reference-set.js';
