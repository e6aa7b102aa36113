/**
 * Embedded element patterns as data: the container, its validation, the
 * single-mode constructor for dipole arrays, conversion between excitation
 * conventions, Ludwig-3 components and phase-reference translation.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { transpose, add, scale, multiply } from '../linalg/ops.js';
import { zeros } from '../linalg/cmatrix.js';
import { solve } from '../linalg/lu.js';
import {
  assertColumn, assertFiniteArray, assertFiniteCMatrix, assertPositive, assertSquare, describeValue,
} from '../internal/validate.js';
import { C0_M_PER_S } from '../units/constants.js';
import {
  accumulateElementFarField, checkDirections, checkFarFieldOptions, SINUSOIDAL_CURRENT, type FarFieldOptions,
} from './farField.js';
import { assertAboveGround, dipoleGeometry, type WireDipole } from './types.js';

/**
 * How the ports were driven when a set of embedded patterns was recorded.
 *
 * @remarks
 * - `open-circuit-current`: port n driven by current I₀, all other ports open
 *   (the phasewise default, conventions "embedded pattern");
 * - `short-circuit-voltage`: port n driven by an ideal voltage source V₀, all
 *   other ports short-circuited;
 * - `loaded-voltage`: port n driven by a source of EMF V₀ in series with its
 *   load impedance Z_L,n, every other port m terminated in Z_L,m (the usual
 *   "all other ports matched/loaded" solver export; Z_L = 50 Ω is common practice).
 * @category Elements
 */
export type PatternExcitation = OpenCircuitExcitation | ShortCircuitExcitation | LoadedExcitation;

/**
 * Port driven by current I₀, all other ports open (the phasewise default).
 * @category Elements
 */
export interface OpenCircuitExcitation {
  /** Tag. */
  readonly kind: 'open-circuit-current';
  /** Drive current I₀ [A, RMS], > 0. */
  readonly driveCurrentA: number;
}

/**
 * Port driven by an ideal voltage source V₀, all other ports shorted.
 * @category Elements
 */
export interface ShortCircuitExcitation {
  /** Tag. */
  readonly kind: 'short-circuit-voltage';
  /** Source EMF V₀ [V, RMS], > 0. */
  readonly driveVoltageV: number;
}

/**
 * Port driven by EMF V₀ behind its load Z_L,n; every other port m terminated in Z_L,m.
 * @category Elements
 */
export interface LoadedExcitation {
  /** Tag. */
  readonly kind: 'loaded-voltage';
  /** Source EMF V₀ [V, RMS], > 0. */
  readonly driveVoltageV: number;
  /** Load (and source) impedance of each port [Ω], N×1. */
  readonly loadOhm: CMatrix;
}

/**
 * θ̂ and φ̂ components of N ports at M directions.
 * @category Elements
 */
export interface PatternSamples {
  /** f·θ̂ [V], N×M. */
  readonly thetaComponentV: CMatrix;
  /** f·φ̂ [V], N×M. */
  readonly phiComponentV: CMatrix;
}

/**
 * Co- and cross-polar components (Ludwig 3) of a set of patterns.
 * @category Elements
 */
export interface Ludwig3Result {
  /** Co-polar component [V], P×M. */
  readonly co: CMatrix;
  /** Cross-polar component [V], P×M. */
  readonly cross: CMatrix;
}

/**
 * Per-port far-field patterns sampled on a θ-φ grid.
 *
 * @remarks
 * Column c = iφ·nθ + iθ (θ fastest) of `thetaComponentV`/`phiComponentV` holds
 * the sample at (thetaRad[iθ], phiRad[iφ]) — the same order as the geometry
 * module's sphere quadrature, so a set sampled on a quadrature grid lines up
 * with its weights. Row n is port n. Values are f·θ̂ and f·φ̂ [V] with
 * E = f e^{−jkr}/r, the phase referred to the coordinate origin, time
 * dependence e^{+jωt}, RMS. `thetaRad` is strictly ascending within [0, π];
 * `phiRad` is uniform over one full turn, phiRad[j] = phiRad[0] + 2πj/nφ.
 * `phaseCentersM` (optional, 3·N interleaved) are points near which each port
 * radiates (usually the element positions); interpolation removes and restores
 * their phase, which keeps it accurate for elements far from the origin.
 * Build with {@link embeddedPatternSet} (validates) or {@link dipoleEmbeddedPatterns}.
 * @category Elements
 */
export interface EmbeddedPatternSet {
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
  /** Number of ports N. */
  readonly portCount: number;
  /** θ grid [rad], ascending in [0, π], length nθ ≥ 1. */
  readonly thetaRad: Float64Array;
  /** φ grid [rad], uniform over 2π, length nφ ≥ 1. */
  readonly phiRad: Float64Array;
  /** f·θ̂ [V], N × (nθ·nφ). */
  readonly thetaComponentV: CMatrix;
  /** f·φ̂ [V], N × (nθ·nφ). */
  readonly phiComponentV: CMatrix;
  /** How the ports were driven. */
  readonly excitation: PatternExcitation;
  /** Optional port names, length N. */
  readonly portLabels?: readonly string[];
  /** Optional per-port phase centres [m], length 3N, xyz-interleaved. */
  readonly phaseCentersM?: Float64Array;
}

/** @internal Wavenumber of a set. */
export function setWavenumber(set: EmbeddedPatternSet): number {
  return (2 * Math.PI * set.frequencyHz) / C0_M_PER_S;
}

/** @internal Validates an excitation record against a port count. */
export function checkExcitation(name: string, e: PatternExcitation, ports: number): void {
  if (e === null || typeof e !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected {kind, …}, received ${describeValue(e)}.`);
  }
  switch (e.kind) {
    case 'open-circuit-current':
      assertPositive(`${name}.driveCurrentA`, e.driveCurrentA, 'A');
      return;
    case 'short-circuit-voltage':
      assertPositive(`${name}.driveVoltageV`, e.driveVoltageV, 'V');
      return;
    case 'loaded-voltage':
      assertPositive(`${name}.driveVoltageV`, e.driveVoltageV, 'V');
      assertColumn(`${name}.loadOhm`, e.loadOhm, ports, 'one load impedance per port');
      assertFiniteCMatrix(`${name}.loadOhm`, e.loadOhm);
      return;
    default:
      throw new DomainError(`invalid argument "${name}.kind": expected "open-circuit-current", "short-circuit-voltage" or "loaded-voltage", received ${describeValue((e as { kind: unknown }).kind)}.`);
  }
}

/**
 * Validates the parts of an embedded-pattern set and returns it as a set.
 *
 * @param parts - All fields of {@link EmbeddedPatternSet}.
 * @returns The same data, checked (arrays are not copied).
 * @throws {@link DimensionError} for mismatched sizes; {@link DomainError} for a non-ascending θ grid, θ outside [0, π], a non-uniform φ grid, non-finite samples or a bad excitation.
 * @category Elements
 */
export function embeddedPatternSet(parts: EmbeddedPatternSet): EmbeddedPatternSet {
  if (parts === null || typeof parts !== 'object') {
    throw new DomainError(`invalid argument "parts": expected an object with the fields of EmbeddedPatternSet, received ${describeValue(parts)}.`);
  }
  assertPositive('frequencyHz', parts.frequencyHz, 'Hz');
  const { thetaRad, phiRad, portCount } = parts;
  if (!(thetaRad instanceof Float64Array) || thetaRad.length < 1) {
    throw new DimensionError(`invalid argument "thetaRad": expected a non-empty Float64Array, received ${describeValue(thetaRad)}.`);
  }
  if (!(phiRad instanceof Float64Array) || phiRad.length < 1) {
    throw new DimensionError(`invalid argument "phiRad": expected a non-empty Float64Array, received ${describeValue(phiRad)}.`);
  }
  assertFiniteArray('thetaRad', thetaRad);
  assertFiniteArray('phiRad', phiRad);
  for (let i = 0; i < thetaRad.length; i++) {
    if (thetaRad[i] < -1e-12 || thetaRad[i] > Math.PI + 1e-12 || (i > 0 && !(thetaRad[i] > thetaRad[i - 1]))) {
      throw new DomainError(`invalid argument "thetaRad": entry ${i} = ${thetaRad[i]} breaks the requirement "strictly ascending within [0, π]".`);
    }
  }
  const nphi = phiRad.length, step = (2 * Math.PI) / nphi;
  for (let j = 1; j < nphi; j++) {
    if (Math.abs(phiRad[j] - phiRad[0] - j * step) > 1e-9) {
      throw new DomainError(`invalid argument "phiRad": expected a uniform grid over one full turn (step 2π/${nphi} = ${step}), entry ${j} is ${phiRad[j]}; resample to a uniform φ grid.`);
    }
  }
  if (!Number.isInteger(portCount) || portCount < 1) {
    throw new DimensionError(`invalid argument "portCount": expected an integer ≥ 1, received ${describeValue(portCount)}.`);
  }
  const cols = thetaRad.length * nphi;
  for (const name of ['thetaComponentV', 'phiComponentV'] as const) {
    const m = parts[name];
    assertFiniteCMatrix(name, m);
    if (m.rows !== portCount || m.cols !== cols) {
      throw new DimensionError(`invalid argument "${name}": expected ${portCount}×${cols} (ports × nθ·nφ), received ${m.rows}×${m.cols}.`);
    }
  }
  checkExcitation('excitation', parts.excitation, portCount);
  if (parts.portLabels !== undefined && (!Array.isArray(parts.portLabels) || parts.portLabels.length !== portCount)) {
    throw new DimensionError(`invalid argument "portLabels": expected ${portCount} strings, received ${describeValue(parts.portLabels)}.`);
  }
  if (parts.phaseCentersM !== undefined) {
    if (!(parts.phaseCentersM instanceof Float64Array) || parts.phaseCentersM.length !== 3 * portCount) {
      throw new DimensionError(`invalid argument "phaseCentersM": expected a Float64Array of length ${3 * portCount} (xyz per port), received ${describeValue(parts.phaseCentersM)}.`);
    }
    assertFiniteArray('phaseCentersM', parts.phaseCentersM);
  }
  return parts;
}

/**
 * Open-circuit embedded patterns of a dipole array under the single-mode
 * assumption, on a θ-φ grid.
 *
 * @remarks
 * Assumption: each wire carries only the sinusoidal current shape of its own
 * terminal current (the model behind the induced-EMF impedance matrix). An
 * open-circuited port then carries no current at all, so the open-circuit
 * embedded pattern of dipole n is exactly its isolated pattern with the
 * position phase e^{+jk r̂·rₙ} (conventions, "embedded pattern" row), including the
 * ground-plane image when a plane is given. Real wires carry higher-order
 * currents when open; the assumption is good for thin dipoles up to about
 * λ/2 long (common practice). Phase centres are set to the dipole centres.
 *
 * @param dipoles - The N dipoles.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param thetaRad - θ grid [rad], ascending in [0, π].
 * @param phiRad - φ grid [rad], uniform over 2π.
 * @param options - Drive current I₀ [A] and ground plane.
 * @returns The open-circuit set, excitation `{kind: 'open-circuit-current', driveCurrentA: I₀}`.
 * @throws {@link DomainError} for bad dipoles or grids.
 * @category Elements
 */
export function dipoleEmbeddedPatterns(
  dipoles: ReadonlyArray<WireDipole>, frequencyHz: number, thetaRad: Float64Array, phiRad: Float64Array, options: FarFieldOptions = {},
): EmbeddedPatternSet {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const i0 = checkFarFieldOptions(options);
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of WireDipole, received ${describeValue(dipoles)}.`);
  }
  const geo = dipoles.map((d, i) => {
    const g = dipoleGeometry(`dipoles[${i}]`, d, k);
    if (options.groundPlane) assertAboveGround(`dipoles[${i}]`, g, options.groundPlane);
    return g;
  });
  assertFiniteArray('thetaRad', thetaRad);
  assertFiniteArray('phiRad', phiRad);
  const nt = thetaRad.length, np = phiRad.length, m = nt * np;
  const th = new Float64Array(m), ph = new Float64Array(m);
  for (let j = 0; j < np; j++) for (let i = 0; i < nt; i++) { th[j * nt + i] = thetaRad[i]; ph[j * nt + i] = phiRad[j]; }
  const n = geo.length;
  const tData = new Float64Array(2 * n * m), pData = new Float64Array(2 * n * m);
  const centres = new Float64Array(3 * n);
  for (let p = 0; p < n; p++) {
    accumulateElementFarField(tData, pData, p * m, geo[p], SINUSOIDAL_CURRENT, k, i0, th, ph, options.groundPlane);
    centres[3 * p] = geo[p].cx; centres[3 * p + 1] = geo[p].cy; centres[3 * p + 2] = geo[p].cz;
  }
  return embeddedPatternSet({
    frequencyHz, portCount: n, thetaRad: Float64Array.from(thetaRad), phiRad: Float64Array.from(phiRad),
    thetaComponentV: { rows: n, cols: m, data: tData }, phiComponentV: { rows: n, cols: m, data: pData },
    excitation: { kind: 'open-circuit-current', driveCurrentA: i0 }, phaseCentersM: centres,
  });
}

/**
 * Open-circuit embedded patterns of a dipole array (single-mode assumption, as
 * in {@link dipoleEmbeddedPatterns}) at an arbitrary list of directions.
 *
 * @param dipoles - The N dipoles.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param thetaRad - Polar angles [rad], length M.
 * @param phiRad - Azimuths [rad], length M.
 * @param options - Drive current I₀ [A] and ground plane.
 * @returns f·θ̂ and f·φ̂ [V], each N×M (row n = port n).
 * @throws {@link DomainError} for bad dipoles or angles.
 * @category Elements
 */
export function dipoleArrayFarFields(
  dipoles: ReadonlyArray<WireDipole>, frequencyHz: number, thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>, options: FarFieldOptions = {},
): PatternSamples {
  const k = checkDirections(frequencyHz, thetaRad, phiRad);
  const i0 = checkFarFieldOptions(options);
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of WireDipole, received ${describeValue(dipoles)}.`);
  }
  const n = dipoles.length, m = thetaRad.length;
  const t = new Float64Array(2 * n * m), p = new Float64Array(2 * n * m);
  dipoles.forEach((d, i) => {
    const g = dipoleGeometry(`dipoles[${i}]`, d, k);
    if (options.groundPlane) assertAboveGround(`dipoles[${i}]`, g, options.groundPlane);
    accumulateElementFarField(t, p, i * m, g, SINUSOIDAL_CURRENT, k, i0, thetaRad, phiRad, options.groundPlane);
  });
  return { thetaComponentV: { rows: n, cols: m, data: t }, phiComponentV: { rows: n, cols: m, data: p } };
}

/**
 * Re-expresses embedded patterns under another excitation convention, using
 * the array's open-circuit impedance matrix (network theory).
 *
 * @remarks
 * The radiated field is linear in the port currents and the open-circuit
 * patterns are its current basis: E = Σₘ (Iₘ/I₀) fₘᵒᶜ. With a source of EMF V₀
 * in series with Z_L,n at port n and loads Z_L at the others,
 * Z I = V₀eₙ − Z_L I, so I = (Z + Z_L)⁻¹ V₀ eₙ and
 *
 *   F_L = (V₀/I₀) [(Z + Z_L)⁻¹]ᵀ F_oc,   F_oc = (I₀/V₀) (Z + Z_L)ᵀ F_L,
 *
 * with F the N × (grid) pattern matrices (θ̂ and φ̂ alike) and Z_L = diag(loads);
 * short circuit is Z_L = 0 (F_sc = (V₀/I₀) Yᵀ F_oc, Y = Z⁻¹). Between two
 * open-circuit sets only the drive current rescales. Ports must not be left
 * floating with Z + Z_L singular (e.g. a short-circuit set of an array whose
 * Z is singular). Reference: any multiport-network text, e.g. D. M. Pozar,
 * Microwave Engineering, 4th ed., 2012, §4.2 (from memory); the embedded
 * pattern conventions follow D. F. Kelley and W. L. Stutzman, "Array antenna
 * pattern modeling methods that include mutual coupling effects", IEEE Trans.
 * Antennas Propag. 41(12), 1993 (from memory).
 *
 * @param set - The patterns to convert.
 * @param impedanceOhm - Open-circuit impedance matrix Z [Ω], N×N, of the same array and frequency.
 * @param target - The wanted excitation.
 * @returns A new set (same grid) under `target`.
 * @throws {@link DimensionError} if Z is not N×N or a load vector has the wrong length; {@link SingularMatrixError} if Z + Z_L is singular.
 * @category Elements
 */
export function convertPatternExcitation(set: EmbeddedPatternSet, impedanceOhm: CMatrix, target: PatternExcitation): EmbeddedPatternSet {
  embeddedPatternSet(set);
  assertSquare('impedanceOhm', impedanceOhm);
  assertFiniteCMatrix('impedanceOhm', impedanceOhm);
  const n = set.portCount;
  if (impedanceOhm.rows !== n) {
    throw new DimensionError(`invalid argument "impedanceOhm": expected ${n}×${n} (one row per port of the set), received ${impedanceOhm.rows}×${impedanceOhm.cols}.`);
  }
  checkExcitation('target', target, n);
  // to open circuit (current basis, per 1 A)
  let tOc: CMatrix, pOc: CMatrix;
  const src = set.excitation;
  if (src.kind === 'open-circuit-current') {
    tOc = scale(set.thetaComponentV, 1 / src.driveCurrentA);
    pOc = scale(set.phiComponentV, 1 / src.driveCurrentA);
  } else {
    const zl = src.kind === 'loaded-voltage' ? diagonalOf(src.loadOhm) : null;
    const m = transpose(zl ? add(impedanceOhm, zl) : impedanceOhm);
    tOc = scale(multiply(m, set.thetaComponentV), 1 / src.driveVoltageV);
    pOc = scale(multiply(m, set.phiComponentV), 1 / src.driveVoltageV);
  }
  let tOut: CMatrix, pOut: CMatrix;
  if (target.kind === 'open-circuit-current') {
    tOut = scale(tOc, target.driveCurrentA);
    pOut = scale(pOc, target.driveCurrentA);
  } else {
    const zl = target.kind === 'loaded-voltage' ? diagonalOf(target.loadOhm) : null;
    const m = transpose(zl ? add(impedanceOhm, zl) : impedanceOhm);
    tOut = scale(solve(m, tOc), target.driveVoltageV);
    pOut = scale(solve(m, pOc), target.driveVoltageV);
  }
  return { ...set, thetaComponentV: tOut, phiComponentV: pOut, excitation: target };
}

function diagonalOf(col: CMatrix): CMatrix {
  const n = col.rows;
  const d = zeros(n, n);
  for (let i = 0; i < n; i++) { d.data[2 * (i * n + i)] = col.data[2 * i]; d.data[2 * (i * n + i) + 1] = col.data[2 * i + 1]; }
  return d;
}

/**
 * Co- and cross-polar components by Ludwig's third definition.
 *
 * @remarks
 * Reference polarisation x̂ (`'x'`): co = f_θ cosφ − f_φ sinφ,
 * cross = f_θ sinφ + f_φ cosφ; reference ŷ (`'y'`): co = f_θ sinφ + f_φ cosφ,
 * cross = f_θ cosφ − f_φ sinφ (A. C. Ludwig, "The definition of cross
 * polarization", IEEE Trans. Antennas Propag. 21(1), 1973, definition 3, from
 * memory). At broadside (θ = 0) they are the x and y field components.
 *
 * @param thetaComponentV - f·θ̂ [V], P×M (any P; column m at direction m).
 * @param phiComponentV - f·φ̂ [V], P×M.
 * @param phiRad - φ of each of the M directions [rad].
 * @param reference - Co-polar reference direction. @defaultValue 'x'
 * @returns co and cross [V], each P×M.
 * @throws {@link DimensionError} for mismatched shapes; {@link DomainError} for a bad reference or NaN angles.
 * @category Elements
 */
export function ludwig3Components(thetaComponentV: CMatrix, phiComponentV: CMatrix, phiRad: ArrayLike<number>, reference: 'x' | 'y' = 'x'): Ludwig3Result {
  assertFiniteCMatrix('thetaComponentV', thetaComponentV);
  assertFiniteCMatrix('phiComponentV', phiComponentV);
  const { rows, cols } = thetaComponentV;
  if (phiComponentV.rows !== rows || phiComponentV.cols !== cols) {
    throw new DimensionError(`invalid argument "phiComponentV": expected ${rows}×${cols} like "thetaComponentV", received ${phiComponentV.rows}×${phiComponentV.cols}.`);
  }
  if (phiRad.length !== cols) {
    throw new DimensionError(`invalid argument "phiRad": expected ${cols} angles (one per column), received ${phiRad.length}.`);
  }
  assertFiniteArray('phiRad', phiRad);
  if (reference !== 'x' && reference !== 'y') {
    throw new DomainError(`invalid argument "reference": expected 'x' or 'y', received ${describeValue(reference)}.`);
  }
  const co = new Float64Array(2 * rows * cols), cross = new Float64Array(2 * rows * cols);
  const t = thetaComponentV.data, p = phiComponentV.data;
  for (let c = 0; c < cols; c++) {
    const cp = Math.cos(phiRad[c]), sp = Math.sin(phiRad[c]);
    for (let r = 0; r < rows; r++) {
      const o = 2 * (r * cols + c);
      for (let q = 0; q < 2; q++) {
        const a = t[o + q] * cp - p[o + q] * sp;
        const b = t[o + q] * sp + p[o + q] * cp;
        co[o + q] = reference === 'x' ? a : b;
        cross[o + q] = reference === 'x' ? b : a;
      }
    }
  }
  return { co: { rows, cols, data: co }, cross: { rows, cols, data: cross } };
}

/**
 * Moves the phase reference of a pattern set from the origin to another point
 * and returns the set re-expressed with that point as its new origin.
 *
 * @remarks
 * With r measured from p instead of O, e^{−jkr_O} = e^{−jkr_p} e^{−jk r̂·p}, so
 * f_p(r̂) = f_O(r̂) e^{−jk r̂·p}. A port radiating from p then has no position
 * phase left. Phase centres are shifted by −p.
 *
 * @param set - The set.
 * @param newOriginM - The new phase reference p [m], [x, y, z] in the current frame.
 * @returns A new set referred to p.
 * @throws {@link DomainError} for a non-finite point.
 * @category Elements
 */
export function translatePhaseReference(set: EmbeddedPatternSet, newOriginM: readonly [number, number, number]): EmbeddedPatternSet {
  embeddedPatternSet(set);
  if (!Array.isArray(newOriginM) || newOriginM.length !== 3) {
    throw new DomainError(`invalid argument "newOriginM": expected [x, y, z] in metres, received ${describeValue(newOriginM)}.`);
  }
  assertFiniteArray('newOriginM', newOriginM);
  const k = setWavenumber(set);
  const [px, py, pz] = newOriginM;
  const nt = set.thetaRad.length, np = set.phiRad.length, m = nt * np, n = set.portCount;
  const t = Float64Array.from(set.thetaComponentV.data), p = Float64Array.from(set.phiComponentV.data);
  for (let j = 0; j < np; j++) {
    const cp = Math.cos(set.phiRad[j]), sp = Math.sin(set.phiRad[j]);
    for (let i = 0; i < nt; i++) {
      const st = Math.sin(set.thetaRad[i]), ct = Math.cos(set.thetaRad[i]);
      const ph = -k * (st * cp * px + st * sp * py + ct * pz);
      const c = Math.cos(ph), s = Math.sin(ph);
      const col = j * nt + i;
      for (let r = 0; r < n; r++) {
        const o = 2 * (r * m + col);
        let a = t[o], b = t[o + 1];
        t[o] = a * c - b * s; t[o + 1] = a * s + b * c;
        a = p[o]; b = p[o + 1];
        p[o] = a * c - b * s; p[o + 1] = a * s + b * c;
      }
    }
  }
  let centres: Float64Array | undefined;
  if (set.phaseCentersM) {
    centres = Float64Array.from(set.phaseCentersM);
    for (let r = 0; r < n; r++) { centres[3 * r] -= px; centres[3 * r + 1] -= py; centres[3 * r + 2] -= pz; }
  }
  return {
    ...set, thetaComponentV: { rows: n, cols: m, data: t }, phiComponentV: { rows: n, cols: m, data: p },
    ...(centres ? { phaseCentersM: centres } : {}),
  };
}
