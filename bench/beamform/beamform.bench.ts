import { bench, describe } from 'vitest';
import { maxSnrWeightsForDirections } from '../../src/beamform/weights.js';
import { musicSpectrum } from '../../src/beamform/spectra.js';
import { choleskyFactor, choleskySolve } from '../../src/linalg/cholesky.js';
import { sink } from '../linalg/sink.js';
import { maxSnrInputs, musicInputs } from './inputs.js';

describe('1000 max-SNR beams, N = 128 (one factorisation, many solves)', () => {
  const { noise, steering } = maxSnrInputs();
  bench('maxSnrWeightsForDirections (validate, factor, solve, normalise)', () => { sink(maxSnrWeightsForDirections(steering, noise)); });
  bench('raw choleskyFactor + choleskySolve, no normalisation', () => { sink(choleskySolve(choleskyFactor(noise), steering)); });
});

describe('MUSIC spectrum, N = 64, 10 000 directions', () => {
  const { correlation, scan } = musicInputs();
  bench('musicSpectrum, K = 3 (signal-subspace branch)', () => { sink(musicSpectrum(correlation, scan, 3)); });
  bench('musicSpectrum, K = 40 (noise-subspace branch)', () => { sink(musicSpectrum(correlation, scan, 40)); });
});
