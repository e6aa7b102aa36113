export type { YFactorInput, YFactorResult, YFactorVarianceBudget, NoiseSourceInput, NoiseSourceResult } from './yfactor.js';
export { yFactorReceiverTemperature, noiseSourceReceiverTemperature, noiseSourceOnTemperature } from './yfactor.js';
export type { HotColdCorrelationInput, HotColdCorrelationResult } from './hotcold.js';
export { receiverNoiseFromHotCold, beamReceiverTemperature } from './hotcold.js';
export type { AtmosphereCorrection, FluxCorrections, OnOffInput, OnOffResult, OnOffCorrelationInput } from './sensitivity.js';
export { onOffSensitivity, onOffSensitivityFromCorrelation, apertureEfficiencyFromSensitivity } from './sensitivity.js';
export type { YFactorRow, OnOffRow, YFactorTableOptions, OnOffTableOptions, YFactorTableResult, OnOffTableResult, RejectedRow, TableReduction } from './table.js';
export { parseYFactorCsv, parseOnOffCsv, reduceYFactorTable, reduceOnOffTable, reduceYFactorCsv, reduceOnOffCsv } from './table.js';
