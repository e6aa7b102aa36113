export type { SampledPortPatterns, PortPatternSource, QuadratureDirections } from './patterns.js';
export { sampledPatternSource, samplePatterns, quadratureDirections } from './patterns.js';
export type { IncidentPolarization } from './planeWave.js';
export { openCircuitVoltages } from './planeWave.js';
export type { PointSourceOptions } from './signal.js';
export { pointSourceCorrelation } from './signal.js';
export type {
  BrightnessFunction, Brightness, BrightnessOptions, HorizonOrientation, SkyGroundOptions,
} from './brightness.js';
export {
  brightnessCorrelation, brightnessCorrelations, isotropicBrightness, aboveHorizon, skyAndGroundBrightness,
} from './brightness.js';
export type { OhmicLossOptions } from './thermal.js';
export { thermalNoiseCorrelation, ohmicLossNoiseCorrelation } from './thermal.js';
export type { AmplifierNoise } from './amplifier.js';
export { amplifierNoiseTemperature, receiverNoiseCorrelation } from './amplifier.js';
export {
  loadedVoltageTransfer, referCorrelationToLoads, referCorrelationToOpenCircuit, referWeightsToOpenCircuit, referWeightsToLoads,
} from './referral.js';
export type { NoiseEnvironment, SkyAndGroundEnvironmentOptions, LossModel, NoiseBudgetInput, NoiseBudget } from './budget.js';
export { isotropicEnvironment, skyAndGroundEnvironment, arrayNoiseBudget } from './budget.js';
export type { BeamFigures, BeamFigureOptions, ScanSweepOptions, ScanSweepResult } from './figures.js';
export { beamFigures, maxSnrWeightsUnpolarized, scanSweep, embeddedElementEfficiencies, minimumReceiverTemperature } from './figures.js';
export type { ArrayPorts, ReceivingArrayDescription, ReceivingArrayEvaluation } from './evaluate.js';
export { evaluateReceivingArray } from './evaluate.js';
