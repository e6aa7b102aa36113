export type { ErrorDistribution, RandomDeviation, SubarrayErrors, RandomErrorModel, ErrorMoments, RandomErrorFigures } from './errorModel.js';
export { expectedErrorPattern, randomErrorFigures } from './errorModel.js';
export type { MonteCarloPatternPath, MonteCarloOptions, TrialPercentiles, MonteCarloErrorResult } from './monteCarlo.js';
export { monteCarloErrorPatterns } from './monteCarlo.js';
