export type { ParaboloidOptions, Paraboloid } from './paraboloid.js';
export { paraboloidReflector, beamDeviationFactor } from './paraboloid.js';
export type { FeedFieldSample, FeedPattern } from './feed.js';
export { bodyOfRevolutionFeed, cosinePowerFeed } from './feed.js';
export type { SecondaryPatternOptions, SecondaryPatterns, ReflectorIntegrationOrders } from './secondary.js';
export { reflectorIntegrationOrders, secondaryPatternsPhysicalOptics, secondaryPatternsApertureField } from './secondary.js';
export type { FeedEfficiencyOptions, FeedEfficiencies } from './efficiency.js';
export { feedEfficiencies } from './efficiency.js';
