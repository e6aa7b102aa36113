export type { BeamNormalization } from './normalize.js';
export { diagonalLoading } from './conditioning.js';
export type { BeamWeightOptions } from './weights.js';
export {
  conjugateFieldWeights, maxSnrWeights, maxSnrWeightsForDirections, minimumVarianceWeights,
  constrainedMinimumVarianceWeights, maxDirectivityWeights, maxGainWeights,
} from './weights.js';
export { maxSnrWeightsUnpolarizedSource, matchedFieldWeightsUnpolarizedSource } from './unpolarized.js';
export type { ProjectionBeamResult, CorrelationBeamResult } from './projection.js';
export { projectionWeights, estimateInterferenceSubspace, maxSnrWeightsForCorrelation } from './projection.js';
export type { InterferenceRejectionResult } from './evaluate.js';
export {
  beamResponse, beamPowerPattern, beamPowerPatternInto, beamOutputPower, beamSnr, whiteNoiseGain, arrayGain, interferenceRejection,
} from './evaluate.js';
export type { SnapshotScenario, SnapshotSimulation } from './snapshots.js';
export { simulateSnapshots, sampleCorrelation } from './snapshots.js';
export type { SourceCountResult } from './sourceCount.js';
export { estimateSourceCount } from './sourceCount.js';
export { bartlettSpectrum, caponSpectrum, musicSpectrum } from './spectra.js';
export type { UniformLineGeometry, RootMusicResult } from './rootMusic.js';
export { rootMusic } from './rootMusic.js';
export type { SpectrumPeak, SpectrumPeakOptions } from './peaks.js';
export { findSpectrumPeaks } from './peaks.js';
export type { CramerRaoBoundResult } from './crb.js';
export { deterministicCramerRaoBound } from './crb.js';
