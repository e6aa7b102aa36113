export type {
  Design, DesignComplex, DesignFrequencies, DesignLayout, DesignElements, DesignBackEnd, DesignAmplifiers,
  DesignEnvironment, DesignTaper, DesignBeamsSpec,
} from './types.js';
export { parseDesign, validateDesign } from './schema.js';
export type { DesignFileReader } from './bandData.js';
export type { DesignBeams, PreparedDesign, PrepareDesignOptions, DesignEnvironmentAt } from './build.js';
export { prepareDesign, designPortsAt, designEnvironmentAt, scanPlaneDirections } from './build.js';
export type {
  DesignBeamFigures, DesignPatternCut, UsedNoiseParameters, ActiveReflectionTrace, FailedCheck, DesignSphereRule, DesignEvaluationBeams, GratingCircle, FrequencyEvaluation, BeamBandSummary, DesignEvaluation, EvaluateDesignOptions,
} from './evaluate.js';
export { evaluateDesign, evaluateDesignFrequency, assembleDesignEvaluation, frequencyBlock, designQuadratureAt, estimateDesignCost } from './evaluate.js';
