/**
 * The narrowband array signal model: seeded snapshot simulation and the
 * sample correlation matrix. Convention: snapshot x(t) = A s(t) + B i(t) + n(t)
 * with steering columns aₖ(r̂)ₙ = exp(+j k r̂·rₙ) (docs/conventions.md);
 * powers are mean-square values of the complex envelopes (RMS phasors).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { choleskyFactor } from '../linalg/cholesky.js';
import { assertHermitian, hermitianEigen } from '../linalg/eigen.js';
import { HERMITIAN_TOLERANCE } from './conditioning.js';
import { multiplyInto } from '../linalg/ops.js';
import { RandomStream } from '../internal/random.js';
import { assertFiniteArray, assertFiniteCMatrix, assertInteger, assertNonNegative, assertShape } from '../internal/validate.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * A simulated observation scenario for {@link simulateSnapshots}.
 * @category Beamforming
 */
export interface SnapshotScenario {
  /** Steering (or response) vectors of the K sources as columns, N×K (K may be 0). */
  steering: CMatrix;
  /** Mean power of each source's complex envelope, length K, ≥ 0 [W or V², the unit of the snapshots squared]. */
  sourcePowers: ArrayLike<number>;
  /**
   * Complex correlation coefficients between the sources, K×K Hermitian positive semidefinite with unit diagonal
   * (1 on an off-diagonal entry: fully coherent sources, e.g. multipath).
   * @defaultValue identity (mutually uncorrelated sources)
   */
  sourceCoherence?: CMatrix;
  /** Steering vectors of J interferers as columns, N×J; interferers are uncorrelated with each other and the sources. @defaultValue none */
  interferenceSteering?: CMatrix;
  /** Mean power of each interferer, length J, ≥ 0. @defaultValue none */
  interferencePowers?: ArrayLike<number>;
  /** Spatially white noise power per element, ≥ 0; ignored when `noiseCorrelation` is given. @defaultValue 1 */
  noisePower?: number;
  /** Noise correlation matrix R_n, N×N Hermitian positive definite; coloured by its Cholesky factor. @defaultValue noisePower·I */
  noiseCorrelation?: CMatrix;
  /** Number of snapshots T, integer ≥ 1. */
  snapshotCount: number;
  /** Seed of the xoshiro128** stream, an integer in [0, 2⁵³). Same seed, same snapshots on every platform. */
  seed: number;
}

/**
 * Result of {@link simulateSnapshots}.
 * @category Beamforming
 */
export interface SnapshotSimulation {
  /** Array snapshots x(t) as columns, N×T [unit of the powers' square root]. */
  readonly snapshots: CMatrix;
  /** Source envelopes s(t), K×T. */
  readonly sourceSignals: CMatrix;
  /** Interferer envelopes, J×T. */
  readonly interferenceSignals: CMatrix;
  /** Noise n(t), N×T. */
  readonly noise: CMatrix;
}

function complexNormalMatrix(g: RandomStream, rows: number, cols: number): CMatrix {
  const data = new Float64Array(2 * rows * cols);
  g.fillComplexNormal(data, rows * cols);
  return matrixView(rows, cols, data);
}

/** Any factor F with F Fᴴ = C for a Hermitian PSD C (from its eigendecomposition), K×K. */
function psdFactor(name: string, c: CMatrix): CMatrix {
  const k = c.rows;
  const { values, vectors } = hermitianEigen(c);
  const v = vectors!;
  const top = Math.max(values[k - 1], 0);
  const out = new Float64Array(2 * k * k);
  for (let j = 0; j < k; j++) {
    let lam = values[j];
    if (lam < -1e-10 * Math.max(top, 1e-300)) {
      throw new DomainError(`invalid argument "${name}": the source correlation is not positive semidefinite (eigenvalue ${lam.toExponential(3)}); coherence magnitudes must form a valid correlation matrix.`);
    }
    lam = Math.sqrt(Math.max(lam, 0));
    for (let i = 0; i < k; i++) {
      out[2 * (i * k + j)] = v.data[2 * (i * k + j)] * lam;
      out[2 * (i * k + j) + 1] = v.data[2 * (i * k + j) + 1] * lam;
    }
  }
  return matrixView(k, k, out);
}

function checkPowers(name: string, p: ArrayLike<number>, k: number): void {
  if (p === null || typeof p !== 'object' || typeof p.length !== 'number' || p.length !== k) {
    throw new DimensionError(`invalid argument "${name}": expected ${k} powers (one per steering column), received ${p === null || p === undefined ? String(p) : `length ${p.length}`}.`);
  }
  assertFiniteArray(name, p);
  for (let i = 0; i < k; i++) assertNonNegative(`${name}[${i}]`, p[i]);
}

/**
 * Simulates T narrowband array snapshots x(t) = A s(t) + B i(t) + n(t).
 *
 * @remarks
 * Sources: s(t) = F z(t) with F Fᴴ = D^{1/2} Γ D^{1/2} (D the source powers, Γ the
 * coherence matrix, F from its eigendecomposition so fully coherent sources are
 * allowed) and z(t) independent circular complex normals of unit variance.
 * Interferers: independent, i(t) = D_I^{1/2} z_I(t). Noise: n(t) = L z_n(t) with
 * R_n = L Lᴴ (Cholesky), or σ·z_n(t) for white noise. The expected sample
 * correlation is A D^{1/2}ΓD^{1/2} Aᴴ + B D_I Bᴴ + R_n.
 *
 * Reproducibility: the draws come from one xoshiro128** stream seeded by
 * SplitMix64 (see the module documentation), in the order z (K×T row-major),
 * z_I (J×T), z_n (N×T); normals by Box–Muller. Uniforms are bit-identical on
 * every engine; normals agree to a few ulp.
 * @param scenario - See {@link SnapshotScenario}.
 * @returns Snapshots and their components.
 * @throws {@link DimensionError} on inconsistent shapes; {@link DomainError} on negative powers, a bad seed or count,
 *   a coherence matrix that is not a correlation matrix; {@link NotPositiveDefiniteError} for a singular noise correlation.
 * @example
 * ```ts
 * const a = steeringVector(uniformLineLayout(8, 0.05), [0, 0, 1], 2.99792458e9); // one source at broadside
 * const { snapshots } = simulateSnapshots({ steering: a, sourcePowers: [10], snapshotCount: 200, seed: 1 });
 * [snapshots.rows, snapshots.cols]; // [8, 200]
 * ```
 * @category Beamforming
 */
export function simulateSnapshots(scenario: SnapshotScenario): SnapshotSimulation {
  const { steering, sourcePowers, snapshotCount: t, seed } = scenario;
  assertFiniteCMatrix('steering', steering);
  const n = steering.rows, k = steering.cols;
  if (n < 1) throw new DimensionError('invalid argument "steering": expected N×K with N ≥ 1 elements, received 0 rows.');
  checkPowers('sourcePowers', sourcePowers, k);
  assertInteger('snapshotCount', t, 1);
  assertInteger('seed', seed, 0, Number.MAX_SAFE_INTEGER);
  const ib = scenario.interferenceSteering ?? { rows: n, cols: 0, data: new Float64Array(0) };
  assertFiniteCMatrix('interferenceSteering', ib);
  if (ib.rows !== n) throw new DimensionError(`invalid argument "interferenceSteering": expected ${n} rows (one per element), received ${ib.rows}×${ib.cols}.`);
  const ip = scenario.interferencePowers ?? [];
  checkPowers('interferencePowers', ip, ib.cols);
  let noiseFactor: CMatrix | null = null;
  let sigma = 1;
  if (scenario.noiseCorrelation) {
    assertFiniteCMatrix('noiseCorrelation', scenario.noiseCorrelation);
    assertShape('noiseCorrelation', scenario.noiseCorrelation, n, n, 'one row and column per element');
    assertHermitian('noiseCorrelation', scenario.noiseCorrelation, HERMITIAN_TOLERANCE);
    const f = choleskyFactor(scenario.noiseCorrelation);
    if (!f.positiveDefinite) {
      throw new DomainError(`invalid argument "noiseCorrelation": not positive definite (Cholesky pivot ${f.failedPivot}); pass a positive definite noise correlation or use noisePower.`);
    }
    noiseFactor = f.l;
  } else {
    const p = scenario.noisePower ?? 1;
    assertNonNegative('noisePower', p);
    sigma = Math.sqrt(p);
  }
  // Source factor F = D^{1/2} Γ^{1/2}-like, K×K.
  let sourceFactor: CMatrix | null = null;
  if (k > 0) {
    const c = new Float64Array(2 * k * k);
    if (scenario.sourceCoherence) {
      const g = scenario.sourceCoherence;
      assertFiniteCMatrix('sourceCoherence', g);
      assertShape('sourceCoherence', g, k, k, 'one row and column per source');
      assertHermitian('sourceCoherence', g, HERMITIAN_TOLERANCE);
      for (let i = 0; i < k; i++) {
        const d = g.data[2 * (i * k + i)], di = g.data[2 * (i * k + i) + 1];
        if (Math.abs(d - 1) > 1e-12 || Math.abs(di) > 1e-12) {
          throw new DomainError(`invalid argument "sourceCoherence": diagonal entry ${i} is ${d} + ${di}j; a coherence matrix has unit diagonal (powers go in sourcePowers).`);
        }
      }
      for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) {
        const s = Math.sqrt(sourcePowers[i] * sourcePowers[j]);
        c[2 * (i * k + j)] = s * g.data[2 * (i * k + j)];
        c[2 * (i * k + j) + 1] = s * g.data[2 * (i * k + j) + 1];
      }
      sourceFactor = psdFactor('sourceCoherence', { rows: k, cols: k, data: c });
    } else {
      for (let i = 0; i < k; i++) c[2 * (i * k + i)] = Math.sqrt(sourcePowers[i]);
      sourceFactor = { rows: k, cols: k, data: c };
    }
  }
  const g = RandomStream.fromSeed(seed);
  const zs = complexNormalMatrix(g, k, t);
  const zi = complexNormalMatrix(g, ib.cols, t);
  const zn = complexNormalMatrix(g, n, t);
  const s = k > 0 ? multiplyInto({ rows: k, cols: t, data: new Float64Array(2 * k * t) }, sourceFactor!, zs) : zs;
  const iSig = zi;
  for (let j = 0; j < ib.cols; j++) {
    const a = Math.sqrt(ip[j]);
    for (let q = 2 * j * t; q < 2 * (j + 1) * t; q++) iSig.data[q] *= a;
  }
  let noise: CMatrix;
  if (noiseFactor) {
    noise = multiplyInto({ rows: n, cols: t, data: new Float64Array(2 * n * t) }, noiseFactor, zn);
  } else {
    for (let q = 0; q < zn.data.length; q++) zn.data[q] *= sigma;
    noise = zn;
  }
  const x = { rows: n, cols: t, data: noise.data.slice() };
  if (k > 0) addProduct(x, steering, s);
  if (ib.cols > 0) addProduct(x, ib, iSig);
  return { snapshots: x, sourceSignals: s, interferenceSignals: iSig, noise };
}

function addProduct(x: CMatrix, a: CMatrix, b: CMatrix): void {
  const p = multiplyInto({ rows: x.rows, cols: x.cols, data: new Float64Array(x.data.length) }, a, b);
  for (let q = 0; q < x.data.length; q++) x.data[q] += p.data[q];
}

/**
 * Sample correlation matrix R̂ = (1/T) Σₜ x(t) x(t)ᴴ = X Xᴴ / T.
 *
 * @remarks
 * The maximum-likelihood estimate of the correlation of zero-mean circular
 * Gaussian snapshots. The result is exactly Hermitian (upper triangle computed,
 * lower mirrored); it is singular when T < N.
 * @param snapshots - Snapshots as columns, N×T, T ≥ 1 [V or √W].
 * @returns R̂, N×N Hermitian [square of the snapshot unit].
 * @throws {@link DimensionError} on an empty matrix; {@link DomainError} on non-finite entries.
 * @category Beamforming
 */
export function sampleCorrelation(snapshots: CMatrix): CMatrix {
  assertFiniteCMatrix('snapshots', snapshots);
  const n = snapshots.rows, t = snapshots.cols, x = snapshots.data;
  if (n < 1 || t < 1) throw new DimensionError(`invalid argument "snapshots": expected N×T with N, T ≥ 1, received ${n}×${t}.`);
  const out = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    const ri = 2 * i * t;
    for (let j = i; j < n; j++) {
      const rj = 2 * j * t;
      let re = 0, im = 0;
      for (let q = 0; q < 2 * t; q += 2) {
        const ar = x[ri + q], ai = x[ri + q + 1], br = x[rj + q], bi = x[rj + q + 1];
        re += ar * br + ai * bi;
        im += ai * br - ar * bi;
      }
      out[2 * (i * n + j)] = re / t;
      out[2 * (i * n + j) + 1] = i === j ? 0 : im / t;
      out[2 * (j * n + i)] = re / t;
      out[2 * (j * n + i) + 1] = i === j ? 0 : -im / t;
    }
  }
  return matrixView(n, n, out);
}
