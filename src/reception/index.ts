export type { SampledPortPatterns, PortPatternSource, QuadratureDirections } from './patterns.js';
export { sampledPatternSource, samplePatterns, quadratureDirections } from './patterns.js';
export type { IncidentPolarization, ThetaPhiPolarization, Ludwig3Polarization, CircularPolarization } from './planeWave.js';
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
export { ohmicLossNoiseCorrelation } from './thermal.js';
export { receiverNoiseCorrelation } from './amplifier.js';
export {
  loadedVoltageTransfer, referCorrelationToLoads, referCorrelationToOpenCircuit, referWeightsToOpenCircuit, referWeightsToLoads,
} from './referral.js';
export type { NoiseEnvironment, SkyAndGroundEnvironmentOptions, LossModel, ElementEfficiencyLoss, LossResistance, NoiseBudgetInput, NoiseBudget } from './budget.js';
export { isotropicEnvironment, skyAndGroundEnvironment, arrayNoiseBudget } from './budget.js';
export type { BeamFigures, BeamFigureOptions, ScanSweepOptions, ScanSweepResult } from './figures.js';
export { beamFigures, maxSnrWeightsUnpolarized, scanSweep, embeddedElementEfficiencies, minimumReceiverTemperature } from './figures.js';
export type { ArrayPorts, ReceivingArrayDescription, ReceivingArrayEvaluation, ArrayEvaluation, BeamDirections, EvaluationTimings } from './evaluate.js';
export { evaluateReceivingArray } from './evaluate.js';
export type { ReceivingArrayCheckInput } from './checks.js';
export { receivingArrayChecks, twissResidual } from './checks.js';
export type { ArrayPortSource, DipoleArrayPortsOptions, HertzianDipolePortsOptions, PortGeometry } from './ports.js';
export { dipoleArrayPorts, hertzianDipolePorts, patternSetPorts, dipoleModelChecks, DIPOLE_MODEL_MAX_LENGTH_WAVELENGTHS, DIPOLE_MODEL_MAX_RADIUS_WAVELENGTHS } from './ports.js';
export type { EvaluationSize, EvaluationCost } from './cost.js';
export { evaluationCost, assertEvaluationFits, ARRAY_FIGURES_AUTO_MAX_PORTS, PASSIVITY_CHOLESKY_MAX_PORTS } from './cost.js';
export { patternOverlapMatrix } from './overlap.js';
export { matchedFieldWeightsUnpolarized, beamPowerPatterns } from './fixedBeams.js';
export type { SkyPowerLaw } from './sky.js';
export { skyTemperatureAt, CMB_TEMPERATURE_K, SYNCHROTRON_SPECTRAL_INDEX } from './sky.js';
export { gainOverTemperatureDbPerK, systemEquivalentFluxDensityJy } from './merit.js';
export type { AdaptiveSphereRuleOptions, AdaptiveSphereRule } from './integration.js';
export { adaptiveSphereRule } from './integration.js';
export type { ShiftedElementPattern } from './displacement.js';
