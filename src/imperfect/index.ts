export type { ErrorDistribution, RandomDeviation, SubarrayErrors, RandomErrorModel, PositionErrors, ErrorMoments, RandomErrorFigures } from './errorModel.js';
export { expectedErrorPattern, randomErrorFigures } from './errorModel.js';
export type { MonteCarloPatternPath, DirectionSetPath, FftGridPath, PercentileBands, MonteCarloOptions, TrialPercentiles, MonteCarloErrorResult } from './monteCarlo.js';
export { monteCarloErrorPatterns } from './monteCarlo.js';
