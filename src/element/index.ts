export type { WireDipole, HertzianDipole, IsotropicRadiator, GroundPlane } from './types.js';
export { CoincidentElementsError } from './errors.js';
export type { FarFieldOptions, FarFieldResult } from './farField.js';
export { wireDipoleFarField, hertzianDipoleFarField, isotropicFarField } from './farField.js';
export type { InducedEmfOptions } from './mutualImpedance.js';
export {
  dipoleSelfImpedance, sideBySideMutualImpedance, collinearMutualImpedance, echelonMutualImpedance,
  dipoleMutualImpedance, dipoleArrayImpedanceMatrix,
} from './mutualImpedance.js';
export type {
  PatternExcitation, OpenCircuitExcitation, ShortCircuitExcitation, LoadedExcitation, Ludwig3Result, EmbeddedPatternSet, PatternSamples,
} from './patternSet.js';
export {
  embeddedPatternSet, dipoleEmbeddedPatterns, dipoleArrayFarFields, convertPatternExcitation, ludwig3Components, translatePhaseReference,
} from './patternSet.js';
export type { PatternInterpolator } from './patternInterpolation.js';
export { patternInterpolator, rotatePatternSet } from './patternInterpolation.js';
export type { RadiationMethod, RadiationOptions, RadiationProperties } from './radiation.js';
export {
  wireDipoleRadiationResistance, hertzianRadiationResistance, wireDipoleRadiation, hertzianDipoleRadiation,
  isotropicRadiation, radiationResistanceMatrix,
} from './radiation.js';
export { parsePatternJson, formatPatternJson, parsePatternCsv, formatPatternCsv } from './patternFormats.js';
export type { DipolesFromLayoutOptions } from './fromLayout.js';
export { dipolesFromLayout } from './fromLayout.js';
