export type { Design } from './schema.js';
export { parseDesign, validateDesign } from './schema.js';
export type { DesignFileReader } from './bandData.js';
export type { DesignBeams, PreparedDesign, PrepareDesignOptions } from './build.js';
export { prepareDesign, designPortsAt, designEnvironmentAt, scanPlaneDirections } from './build.js';
export type {
  DesignBeamFigures, DesignPatternCut, FrequencyEvaluation, BeamBandSummary, DesignEvaluation, EvaluateDesignOptions,
} from './evaluate.js';
export { evaluateDesign, evaluateDesignFrequency, assembleDesignEvaluation, frequencyBlock } from './evaluate.js';
