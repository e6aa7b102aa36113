/**
 * The generic inputs of the reception module: embedded open-circuit patterns of
 * every port sampled at M directions, quadrature directions, and pattern
 * sources that fill blocks of directions on demand (bounded memory).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertCMatrix, assertFiniteArray, assertPositive, describeValue } from '../internal/validate.js';
import type { SphereQuadrature } from '../geometry/quadrature.js';
import type { ShiftedElementPattern } from './displacement.js';
import { type Directions, type WeightedDirections, weightedDirections } from '../geometry/directions.js';

/**
 * Embedded open-circuit patterns of N ports sampled at M directions.
 *
 * @remarks
 * Convention (conventions, "embedded pattern"): with port n driven by the RMS
 * current I₀ and every other port open, the radiated field is
 * Eₙ(r) = fₙ(r̂)·e^{−jkr}/r, time dependence e^{+jωt}, phase referred to the
 * coordinate origin. Row n of `thetaComponentV` holds fₙ·θ̂ and row n of
 * `phiComponentV` holds fₙ·φ̂ at the M directions (θ from +z, φ from +x toward +y).
 * @category Reception
 */
export interface SampledPortPatterns extends Directions {
  /** fₙ·θ̂ [V], N×M (row = port, column = direction). */
  readonly thetaComponentV: CMatrix;
  /** fₙ·φ̂ [V], N×M. */
  readonly phiComponentV: CMatrix;
  /** RMS drive current I₀ the patterns are referred to [A], > 0. */
  readonly driveCurrentA: number;
  /** Frequency of the patterns [Hz], > 0. */
  readonly frequencyHz: number;
}

/**
 * A source of embedded patterns that fills any block of directions on demand,
 * so that integrals over 10⁵ directions never hold all N×M samples at once.
 *
 * @remarks
 * `fill` writes fₙ·θ̂ and fₙ·φ̂ for ports n = 0…N−1 and directions
 * k = 0…count−1 (angles `thetaRad[start + k]`, `phiRad[start + k]`) into
 * interleaved row-major buffers with leading dimension `ld` (complex elements):
 * entry (n, k) starts at `2·(n·ld + k)`. Conventions as {@link SampledPortPatterns}.
 * @category Reception
 */
export interface PortPatternSource {
  /** Tells a source from sampled patterns; optional for sources written before it existed (a `fill` method identifies them too). */
  readonly kind?: 'source';
  /** Number of ports N. */
  readonly portCount: number;
  /** RMS drive current I₀ the patterns are referred to [A]. */
  readonly driveCurrentA: number;
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
  /**
   * Present when every port's pattern is one element pattern shifted by the
   * phase of the port's position; the brightness integrals then take the
   * displacement path (see {@link ShiftedElementPattern}).
   */
  readonly shifted?: ShiftedElementPattern;
  /**
   * Writes the patterns of every port at `count` directions starting at `start`.
   * @param thetaRad - Polar angles of all directions [rad].
   * @param phiRad - Azimuths of all directions [rad].
   * @param start - First direction index.
   * @param count - Number of directions.
   * @param outTheta - Destination of fₙ·θ̂ [V], interleaved, N rows of leading dimension `ld`.
   * @param outPhi - Destination of fₙ·φ̂ [V], same layout.
   * @param ld - Leading dimension of the destinations (complex elements), ≥ count.
   */
  fill(
    thetaRad: Float64Array, phiRad: Float64Array, start: number, count: number,
    outTheta: Float64Array, outPhi: Float64Array, ld: number,
  ): void;
}

/**
 * Directions with solid-angle quadrature weights, ∮ g dΩ ≈ Σₖ weightSr[k]·g(θₖ, φₖ): the
 * geometry module's {@link WeightedDirections} under the name this module has used.
 * @category Reception
 */
export type QuadratureDirections = WeightedDirections;

/**
 * Whether port patterns are a {@link PortPatternSource} (computed on demand) rather than
 * {@link SampledPortPatterns}: the one place that tells the two forms apart.
 * @internal
 */
export function isPatternSource(p: SampledPortPatterns | PortPatternSource): p is PortPatternSource {
  return p !== null && typeof p === 'object' && ((p as PortPatternSource).kind === 'source' || typeof (p as PortPatternSource).fill === 'function');
}

/**
 * Port patterns as a validated {@link PortPatternSource}: a source as it is, sampled patterns
 * wrapped by {@link sampledPatternSource}.
 * @internal
 */
export function asPatternSource(name: string, p: SampledPortPatterns | PortPatternSource): PortPatternSource {
  if (isPatternSource(p)) {
    assertPatternSource(name, p);
    return p;
  }
  return sampledPatternSource(p);
}

/** @internal Full validation of sampled patterns; returns N. */
export function assertSampledPatterns(name: string, p: SampledPortPatterns): number {
  if (p === null || typeof p !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected SampledPortPatterns {thetaRad, phiRad, thetaComponentV, phiComponentV, driveCurrentA, frequencyHz}, received ${describeValue(p)}.`);
  }
  assertFiniteArray(`${name}.thetaRad`, p.thetaRad);
  assertFiniteArray(`${name}.phiRad`, p.phiRad);
  const m = p.thetaRad.length;
  if (p.phiRad.length !== m) {
    throw new DimensionError(`invalid argument "${name}.phiRad": expected ${m} azimuths (one per entry of "${name}.thetaRad"), received ${p.phiRad.length}.`);
  }
  assertCMatrix(`${name}.thetaComponentV`, p.thetaComponentV);
  assertCMatrix(`${name}.phiComponentV`, p.phiComponentV);
  const n = p.thetaComponentV.rows;
  if (p.thetaComponentV.cols !== m || p.phiComponentV.rows !== n || p.phiComponentV.cols !== m) {
    throw new DimensionError(`invalid argument "${name}": expected thetaComponentV and phiComponentV of shape N×${m} (one column per direction), received ${p.thetaComponentV.rows}×${p.thetaComponentV.cols} and ${p.phiComponentV.rows}×${p.phiComponentV.cols}.`);
  }
  if (n < 1) throw new DimensionError(`invalid argument "${name}": expected at least one port (row), received 0.`);
  assertPositive(`${name}.driveCurrentA`, p.driveCurrentA, 'A');
  assertPositive(`${name}.frequencyHz`, p.frequencyHz, 'Hz');
  return n;
}

/** @internal Validation of a pattern source. */
export function assertPatternSource(name: string, s: PortPatternSource): number {
  if (s === null || typeof s !== 'object' || typeof s.fill !== 'function') {
    throw new DomainError(`invalid argument "${name}": expected a PortPatternSource {portCount, driveCurrentA, frequencyHz, fill}, received ${describeValue(s)}; wrap sampled data with sampledPatternSource.`);
  }
  if (!Number.isInteger(s.portCount) || s.portCount < 1) {
    throw new DomainError(`invalid argument "${name}.portCount": expected an integer ≥ 1, received ${describeValue(s.portCount)}.`);
  }
  assertPositive(`${name}.driveCurrentA`, s.driveCurrentA, 'A');
  assertPositive(`${name}.frequencyHz`, s.frequencyHz, 'Hz');
  return s.portCount;
}

/** @internal Validation of quadrature directions; returns M. */
export function assertQuadrature(name: string, q: QuadratureDirections): number {
  if (q === null || typeof q !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected {thetaRad, phiRad, weightSr}, received ${describeValue(q)}.`);
  }
  assertFiniteArray(`${name}.thetaRad`, q.thetaRad);
  assertFiniteArray(`${name}.phiRad`, q.phiRad);
  assertFiniteArray(`${name}.weightSr`, q.weightSr);
  const m = q.thetaRad.length;
  if (q.phiRad.length !== m || q.weightSr.length !== m) {
    throw new DimensionError(`invalid argument "${name}": expected thetaRad, phiRad and weightSr of equal length, received ${m}, ${q.phiRad.length} and ${q.weightSr.length}.`);
  }
  for (let k = 0; k < m; k++) {
    if (q.weightSr[k] < 0) {
      throw new DomainError(`invalid argument "${name}.weightSr": entry ${k} is ${q.weightSr[k]}; quadrature weights must be ≥ 0 [sr].`);
    }
  }
  return m;
}

/**
 * Wraps sampled patterns as a {@link PortPatternSource} defined on exactly
 * their own sample directions.
 *
 * @remarks
 * Direction k of a request is looked up by its angles (a binary search over the samples
 * sorted by θ); when a request uses the very arrays of the samples (the usual case: the
 * quadrature of the samples) the lookup is an index copy. Requests for directions that are not samples
 * (within 1e-9 rad, φ modulo 2π) throw: this wrapper never interpolates.
 *
 * @param patterns - The samples (validated here).
 * @returns The source.
 * @throws {@link DimensionError} / {@link DomainError} for malformed samples; the
 * returned `fill` throws {@link DomainError} for a direction that is not sampled.
 * @category Reception
 */
export function sampledPatternSource(patterns: SampledPortPatterns): PortPatternSource {
  const n = assertSampledPatterns('patterns', patterns);
  const m = patterns.thetaRad.length;
  const th = patterns.thetaComponentV.data, ph = patterns.phiComponentV.data;
  // Lookup of a requested direction among the samples: sample indices sorted by θ, a binary
  // search for the θ window (±1e-9 rad), then the φ match modulo 2π inside it. Built on first use.
  let order: Uint32Array | null = null;
  const TOL = 1e-9, TWO_PI = 2 * Math.PI;
  const samePhi = (a: number, b: number): boolean => {
    const d = Math.abs((((a - b) % TWO_PI) + TWO_PI) % TWO_PI);
    return d <= TOL || TWO_PI - d <= TOL;
  };
  const indexOf = (t: number, p: number): number => {
    if (order === null) {
      order = Uint32Array.from({ length: m }, (_, k) => k).sort((a, b) => patterns.thetaRad[a] - patterns.thetaRad[b]);
    }
    const o = order;
    let lo = 0, hi = m;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (patterns.thetaRad[o[mid]] < t - TOL) lo = mid + 1; else hi = mid;
    }
    for (let q = lo; q < m && patterns.thetaRad[o[q]] <= t + TOL; q++) {
      // φ must match even at a pole: the θ̂, φ̂ components there depend on φ.
      if (samePhi(patterns.phiRad[o[q]], p)) return o[q];
    }
    throw new DomainError(`pattern request at θ = ${t} rad, φ = ${p} rad: this direction is not one of the ${m} sampled directions; include it in the sampled grid (sampled patterns are never interpolated).`);
  };
  return {
    portCount: n,
    driveCurrentA: patterns.driveCurrentA,
    frequencyHz: patterns.frequencyHz,
    fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
      const same = thetaRad === patterns.thetaRad && phiRad === patterns.phiRad;
      if (same) {
        // the requested directions are the sampled ones, in order: one contiguous copy per port
        for (let i = 0; i < n; i++) {
          const s = 2 * (i * m + start), d = 2 * i * ld;
          outTheta.set(th.subarray(s, s + 2 * count), d);
          outPhi.set(ph.subarray(s, s + 2 * count), d);
        }
        return;
      }
      for (let k = 0; k < count; k++) {
        const src = indexOf(thetaRad[start + k], phiRad[start + k]);
        for (let i = 0; i < n; i++) {
          const s = 2 * (i * m + src), d = 2 * (i * ld + k);
          outTheta[d] = th[s]; outTheta[d + 1] = th[s + 1];
          outPhi[d] = ph[s]; outPhi[d + 1] = ph[s + 1];
        }
      }
    },
  };
}

/**
 * Samples a pattern source at the given directions.
 * @param source - The pattern source.
 * @param thetaRad - Polar angles [rad], length M.
 * @param phiRad - Azimuths [rad], length M.
 * @returns The N×M samples.
 * @throws {@link DimensionError} / {@link DomainError} for malformed arguments.
 * @category Reception
 */
export function samplePatterns(source: PortPatternSource, thetaRad: Float64Array, phiRad: Float64Array): SampledPortPatterns {
  const n = assertPatternSource('source', source);
  assertFiniteArray('thetaRad', thetaRad);
  assertFiniteArray('phiRad', phiRad);
  if (phiRad.length !== thetaRad.length) {
    throw new DimensionError(`invalid argument "phiRad": expected ${thetaRad.length} azimuths (one per polar angle), received ${phiRad.length}.`);
  }
  const m = thetaRad.length;
  const t = new Float64Array(2 * n * m), p = new Float64Array(2 * n * m);
  source.fill(thetaRad, phiRad, 0, m, t, p, m);
  return {
    thetaRad, phiRad,
    thetaComponentV: { rows: n, cols: m, data: t },
    phiComponentV: { rows: n, cols: m, data: p },
    driveCurrentA: source.driveCurrentA,
    frequencyHz: source.frequencyHz,
  };
}

/**
 * Expands a product sphere quadrature into one (θ, φ, weight) triple per direction.
 * @deprecated Use the geometry module's {@link weightedDirections} (the same expansion, and it
 * also accepts weighted directions); kept for one minor version.
 * @param quadrature - The rule from sphereQuadrature or sphereQuadratureForLayout.
 * @returns Per-direction angles [rad] and weights [sr].
 * @throws {@link DimensionError} if the rule's arrays are inconsistent.
 * @category Reception
 */
export function quadratureDirections(quadrature: SphereQuadrature): QuadratureDirections {
  return weightedDirections(quadrature);
}
