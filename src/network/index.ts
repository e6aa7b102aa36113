export type { Multiport, MultiportForm, MultiportOptions, WaveDefinition } from './multiport.js';
export { createMultiport, multiportMatrix } from './multiport.js';
export { convertMultiport, renormalizeMultiport } from './convert.js';
export { reorderPorts, renamePorts, combineMultiports } from './ports.js';
export type { PortLoad } from './connect.js';
export {
  terminatePorts, keepPorts, joinPortPairs, joinOwnPorts, joinPorts, cascadeTwoPorts, addSeriesImpedance, addShuntAdmittance,
} from './connect.js';
export type { InterpolationRule } from './interpolate.js';
export { interpolateMultiport } from './interpolate.js';
export type { NetworkCheckResult, ImpedancePassivity } from './checks.js';
export { checkReciprocity, checkPassivity, checkLossless, impedancePassivity } from './checks.js';
export type { TheveninEquivalent, NortonEquivalent, LoadResponseResult, TerminatedSourceEquivalent, PortExcitation, IncidentWaveExcitation, PortCurrentExcitation } from './sources.js';
export { nortonFromThevenin, theveninFromNorton, loadResponse, terminateSourcePorts, availablePower, mismatchFactor, activeReflection } from './sources.js';
export type { TwoPortNoiseParameters, NoiseParametersInput, NoiseCorrelationForm, CascadeStage } from './noise.js';
export {
  noiseTemperatureK, noiseFigureDb, noiseParametersFromFigure, chainNoiseCorrelation, noiseParametersFromChainCorrelation,
  convertNoiseCorrelation, cascadeNoiseTemperatureK, thermalImpedanceNoise, thermalNoiseWaves, withImpedanceNoise,
  impedanceNoiseOf, withThermalNoise, withTwoPortNoise, twoPortNoiseOf,
} from './noise.js';
export type {
  TouchstoneParameter, TouchstoneNumberFormat, TouchstoneFrequencyUnit, TouchstoneNoiseTable, TouchstoneData,
  TouchstoneParseOptions, TouchstoneFormatOptions,
} from './touchstone.js';
export { parseTouchstone, formatTouchstone } from './touchstone.js';
