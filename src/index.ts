/**
 * phasewise: array electromagnetics and signal-model math for receiving phased arrays.
 * Conventions (time dependence e^{+jωt}, RMS phasors, SI units, θ from +z, φ from +x,
 * steering aₙ = exp(+j k r̂·rₙ), beam output y = wᴴx): docs/conventions.md.
 * @module
 */
export * from './errors.js';
export * from './checks.js';
export * from './linalg/index.js';
export * from './units/index.js';
export * from './taper/index.js';
export * from './network/index.js';
export * from './element/index.js';
export * from './reception/index.js';
export * from './geometry/index.js';
export * from './pattern/index.js';
export * from './beamform/index.js';
export * from './measure/index.js';
export * from './reflector/index.js';
export * from './floquet/index.js';
export * from './wire/index.js';
export * from './imperfect/index.js';
export * from './design/index.js';
export * from './display/index.js';
export { VERSION } from './version.js';
