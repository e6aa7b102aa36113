export type {
  Design, DesignComplex, DesignFrequencies, DesignLayout, DesignElements, DesignBackEnd, DesignAmplifiers,
  DesignEnvironment, DesignTaper, DesignBeamsSpec, DesignRandomErrors, DesignImperfections, DesignFailures, DesignSubarrays,
} from './types.js';
export { parseDesign, validateDesign } from './schema.js';
export type { DesignFileReader } from './bandData.js';
export type { DesignBeams, PreparedDesign, PrepareDesignOptions, DesignEnvironmentAt } from './build.js';
export { prepareDesign, designPortsAt, designEnvironmentAt, scanPlaneDirections } from './build.js';
export type {
  DesignBeamFigures, FailureCostBeam, DesignPatternCut, UsedNoiseParameters, ActiveReflectionTrace, FailedCheck, DesignSphereRule, DesignCostEstimate, DesignEvaluationBeams, GratingCircle, FrequencyEvaluation, BeamBandSummary, DesignEvaluation, EvaluateDesignOptions,
} from './evaluate.js';
export { evaluateDesign, evaluateDesignFrequency, assembleDesignEvaluation, frequencyBlock, designQuadratureAt, estimateDesignCost } from './evaluate.js';
export type { DesignImperfectionFigures, DesignImperfectionBeam, DesignSubarrayFigures } from './imperfections.js';
export { designImperfectionFigures } from './imperfections.js';
export type { DesignLivePorts } from './failures.js';
export type { DesignPolarization } from './polarization.js';
export { designPolarizationAt } from './polarization.js';
export { designLivePorts } from './failures.js';
