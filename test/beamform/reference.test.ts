/**
 * Beamformers, spectra, MDL/AIC and the CRB against numpy/scipy reference values
 * (fixtures/generate_beamform.py; library versions recorded in the JSON).
 */
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { matrixFromJSON } from '../../src/linalg/cmatrix.js';
import { minimumVarianceWeights, maxSnrWeights, constrainedMinimumVarianceWeights } from '../../src/beamform/weights.js';
import { bartlettSpectrum, caponSpectrum, musicSpectrum } from '../../src/beamform/spectra.js';
import { estimateSourceCount } from '../../src/beamform/sourceCount.js';
import { deterministicCramerRaoBound } from '../../src/beamform/crb.js';
import { maxSnrWeightsForCorrelation, projectionWeights } from '../../src/beamform/projection.js';
import { rootMusic } from '../../src/beamform/rootMusic.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const fx = JSON.parse(readFileSync(new URL('./fixtures/beamform.json', import.meta.url), 'utf8'));
const R = matrixFromJSON(fx.R), Rn = matrixFromJSON(fx.Rn), a0 = matrixFromJSON(fx.a0), scan = matrixFromJSON(fx.scan);

function expectArrayClose(got: ArrayLike<number>, want: number[], rtol: number) {
  expect(got.length).toBe(want.length);
  for (let i = 0; i < want.length; i++) expect(Math.abs(got[i] - want[i])).toBeLessThanOrEqual(rtol * Math.abs(want[i]));
}

// Tolerances: the sample correlation has condition number ~1e2, N = 8; Cholesky vs LU solves agree to
// ~κ·N·ε ≈ 1e-13, so 1e-10 leaves ample margin while still catching any formula error.
describe('against numpy/scipy', () => {
  it('MVDR, raw max-SNR and LCMV (look, null, derivative and a complex-valued look constraint)', () => {
    expectCMatrixClose(minimumVarianceWeights(a0, R), matrixFromJSON(fx.mvdr), { rtol: 1e-10 });
    expectCMatrixClose(maxSnrWeights(a0, Rn, { normalization: 'none' }), matrixFromJSON(fx.maxSnrRaw), { rtol: 1e-10 });
    expectCMatrixClose(constrainedMinimumVarianceWeights(matrixFromJSON(fx.constraints), R, matrixFromJSON(fx.responses)), matrixFromJSON(fx.lcmv), { rtol: 1e-10 });
  });
  it('Bartlett, Capon and MUSIC spectra', () => {
    expectArrayClose(bartlettSpectrum(R, scan), fx.bartlett, 1e-12);
    expectArrayClose(caponSpectrum(R, scan), fx.capon, 1e-10);
    expectArrayClose(musicSpectrum(R, scan, 3), fx.music3, 1e-9);
  });
  it('MDL and AIC criteria (Wax & Kailath 1985) and the chosen count', () => {
    const res = estimateSourceCount(R, fx.snapshotCount);
    expectArrayClose(res.eigenvalues, fx.eigenvaluesDescending, 1e-11);
    for (let k = 0; k < fx.mdl.length; k++) {
      expect(Math.abs(res.mdl[k] - fx.mdl[k])).toBeLessThan(1e-9 * Math.max(1, Math.abs(fx.mdl[k])));
      expect(Math.abs(res.aic[k] - fx.aic[k])).toBeLessThan(1e-9 * Math.max(1, Math.abs(fx.aic[k])));
    }
    expect(res.count).toBe(fx.mdl.indexOf(Math.min(...fx.mdl)));
    expect(res.count).toBe(3);
  });
  it('deterministic CRB for three sources (Stoica & Nehorai 1989)', () => {
    const crb = deterministicCramerRaoBound(matrixFromJSON(fx.steeringSources), matrixFromJSON(fx.crb.derivatives), fx.sourcePowers, fx.crb.sigma2, fx.crb.T);
    expectArrayClose([0, 4, 8].map((i) => crb.covariance[i]), fx.crb.covarianceDiagonal, 1e-10);
  });
  it('any-rank max-SNR equals scipy.linalg.eigh(Rs, Rn) largest eigenvalue; projection equals (I − BB⁺)a', () => {
    expect(Math.abs(maxSnrWeightsForCorrelation(matrixFromJSON(fx.signalRankTwo), Rn).snr / fx.generalizedMax - 1)).toBeLessThan(1e-10);
    expectCMatrixClose(projectionWeights(a0, matrixFromJSON(fx.interference), { normalization: 'none' }).weights, matrixFromJSON(fx.projected), { rtol: 1e-12 });
  });
  it('root-MUSIC equals numpy.roots on the same polynomial', () => {
    // Half-wave spacing: spacingM/λ = 0.5 with λ = 1 m. Sample matrix, so the roots are simple and well conditioned.
    const rm = rootMusic(R, 3, { spacingM: 0.5, frequencyHz: 299792458 });
    for (let i = 0; i < 3; i++) expect(Math.abs(rm.directionCosines[i] - fx.rootMusicU[i])).toBeLessThan(1e-9);
    for (let i = 0; i < 3; i++) expect(Math.abs(rm.directionCosines[i] - fx.sourceU[i])).toBeLessThan(0.05);
  });
});
