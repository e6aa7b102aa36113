export type { ErrorDistribution, RandomDeviation, SubarrayErrors, RandomErrorModel, PositionErrors, ErrorMoments, RandomErrorFigures } from './errorModel.js';
export { expectedErrorPattern, randomErrorFigures } from './errorModel.js';
export type { MonteCarloPatternPath, DirectionSetPath, FftGridPath, PercentileBands, MonteCarloOptions, TrialPercentiles, MonteCarloErrorResult } from './monteCarlo.js';
export { monteCarloErrorPatterns } from './monteCarlo.js';
export type { RoundingRule, QuantizeWeightsOptions, QuantizationLobe, DigitalWeightFigures } from './quantization.js';
export { quantizeWeights, phaseQuantizationLobes, digitalWeightFigures, roundDigitalWeights } from './quantization.js';
export type { SubarrayLayout, SteeringHardware, SquintPoint } from './subarrays.js';
export { gridSubarrays, bandSteeringWeights, beamSquint } from './subarrays.js';
