/**
 * Self and mutual impedance of thin sinusoidal dipoles by the induced-EMF
 * method, and the impedance matrix of a whole dipole array.
 * @module
 */
import { Complex } from 'complex.js';
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertInteger, assertPositive, assertNonNegative, describeValue } from '../internal/validate.js';
import { C0_M_PER_S } from '../units/constants.js';
import { CoincidentElementsError } from './errors.js';
import {
  generalMutualImpedanceInto, parallelMutualImpedanceInto, segmentDistance, type WireIntegrationOptions,
} from './inducedEmf.js';
import {
  assertAboveGround, assertGroundPlane, dipoleGeometry, imageGeometry,
  type DipoleGeometry, type GroundPlane, type WireDipole,
} from './types.js';
import { matrixView } from '../linalg/cmatrix.js';
import { mirrorTriangle } from '../internal/herk.js';

/**
 * Options of the pair and matrix induced-EMF functions.
 * @category Elements
 */
export interface InducedEmfOptions {
  /** Infinite PEC ground plane z = zM; image currents are included. @defaultValue none (free space) */
  groundPlane?: GroundPlane;
  /** Gauss–Legendre nodes per wire segment for non-parallel pairs. @defaultValue 16 */
  nodesPerSegment?: number;
  /** Longest wire segment for non-parallel pairs [wavelengths]. @defaultValue 0.25 */
  maxSegmentWavelengths?: number;
}

const PARALLEL_TOL = 1e-12;

function wavenumber(frequencyHz: number): number {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  return (2 * Math.PI * frequencyHz) / C0_M_PER_S;
}

function integrationOptions(o: InducedEmfOptions): WireIntegrationOptions {
  if (o === null || typeof o !== 'object') {
    throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(o)}.`);
  }
  const nodesPerSegment = o.nodesPerSegment ?? 16;
  const maxSegmentWavelengths = o.maxSegmentWavelengths ?? 0.25;
  assertInteger('options.nodesPerSegment', nodesPerSegment, 2, 64);
  assertPositive('options.maxSegmentWavelengths', maxSegmentWavelengths, 'wavelengths');
  assertGroundPlane('options.groundPlane', o.groundPlane);
  return { nodesPerSegment, maxSegmentWavelengths };
}

/**
 * Free-space mutual impedance of two distinct dipoles into `out` (re, im):
 * the Si/Ci closed form when parallel (or antiparallel), numerical integration
 * otherwise. `labels` name the pair in errors.
 */
function freePairInto(
  out: Float64Array, a: DipoleGeometry, b: DipoleGeometry, k: number, opts: WireIntegrationOptions,
  pair: readonly [number, number], what: string,
): Float64Array {
  const dist = segmentDistance(a, b);
  const touch = Math.max(a.radiusM, b.radiusM);
  if (!(dist > touch) && crossedAtCentres(a, b)) {
    // A crossed pair (orthogonal, one feed point): the field of a centre-fed dipole in its own
    // equatorial plane is parallel to its axis, so it has no component along the other wire and
    // the induced-EMF mutual impedance vanishes exactly (symmetry; C. A. Balanis, *Antenna
    // Theory*, 4th ed., Wiley, 2016, §4.3 fields of a finite dipole, from memory).
    out[0] = 0; out[1] = 0;
    return out;
  }
  if (!(dist > touch)) {
    throw new CoincidentElementsError(
      `elements ${pair[0]} and ${pair[1]}${what}: the wire axes come within ${dist.toPrecision(4)} m, not more than the wire radius ${touch} m, so the wires overlap and their mutual impedance is undefined; separate or remove one of them.`,
      pair,
    );
  }
  const dot = a.ax * b.ax + a.ay * b.ay + a.az * b.az;
  if (1 - Math.abs(dot) < PARALLEL_TOL) {
    const dx = b.cx - a.cx, dy = b.cy - a.cy, dz = b.cz - a.cz;
    const bigH = dx * a.ax + dy * a.ay + dz * a.az;
    const px = dx - bigH * a.ax, py = dy - bigH * a.ay, pz = dz - bigH * a.az;
    const d = Math.sqrt(px * px + py * py + pz * pz);
    // a d below round-off of the offset is a collinear pair
    parallelMutualImpedanceInto(out, k, a.halfLengthM, b.halfLengthM, d < 1e-13 * Math.abs(bigH) ? 0 : d, bigH);
    if (dot < 0) { out[0] = -out[0]; out[1] = -out[1]; }
    return out;
  }
  return generalMutualImpedanceInto(out, a, b, k, dist, opts);
}

/** Orthogonal dipoles whose centres coincide (a crossed-dipole pair), to round-off of their size. */
function crossedAtCentres(a: DipoleGeometry, b: DipoleGeometry): boolean {
  const scale = Math.max(a.halfLengthM, b.halfLengthM);
  const dot = a.ax * b.ax + a.ay * b.ay + a.az * b.az;
  return Math.hypot(b.cx - a.cx, b.cy - a.cy, b.cz - a.cz) <= 1e-12 * scale && Math.abs(dot) <= 1e-12;
}

/**
 * Self impedance of one dipole (free space) into out: the reactance from the
 * filament's field on the wire surface ρ = a, the resistance from the filament
 * limit ρ → 0 (evaluated at ρ = 10⁻⁹·h, where the closed form has converged to
 * rounding), which is the power the filament radiates — the same filament whose
 * far field the patterns use. With ρ = a the resistance would be low by O((ka)²)
 * (0.0033 Ω of 64.94 Ω for l = 0.48λ, a = λ/400), which is enough to make
 * Re Z of a large array indefinite in its invisible-space modes.
 */
function freeSelfInto(out: Float64Array, a: DipoleGeometry, k: number): Float64Array {
  parallelMutualImpedanceInto(out, k, a.halfLengthM, a.halfLengthM, 1e-9 * a.halfLengthM, 0);
  const r = out[0];
  parallelMutualImpedanceInto(out, k, a.halfLengthM, a.halfLengthM, a.radiusM, 0);
  out[0] = r;
  return out;
}

const work = new Float64Array(2);

/**
 * Input (self) impedance of an isolated thin centre-fed dipole by the
 * induced-EMF method.
 *
 * @remarks
 * The field of the sinusoidal filament on the axis is evaluated on the wire
 * surface ρ = a and integrated against the same current: the mutual impedance
 * of two side-by-side filaments a apart (Balanis, Antenna Theory, 4th ed., 2016,
 * §8.5 and eqs. (8-57)–(8-60), from memory), exact closed form with Si/Ci.
 * Referred to the terminal current: Z_in = Z_m / sin²(kl/2). The resistance is
 * taken in the limit a → 0, where it is the radiation resistance of the
 * filament (Balanis eq. (8-60a), independent of a): the surface evaluation
 * would lower it by O((ka)²), and only the filament value equals the integral
 * of the filament's own far field, so that Re Z of an array is the positive
 * semidefinite Gram matrix of its patterns (the Twiss identity of the
 * conventions). The reactance depends on a at every length. For l = λ/2 the exact form is
 * X = (η/4π)[Si(2π) − 2 Si(ka) + Si(k(√(l² + a²) − l))] = (η/4π) Si(2π) − η·a/λ + O((ka)³):
 * the radius-free 42.515 Ω of the handbook formula (Balanis eq. (8-60b), which
 * drops the Si(ka) term; from memory) less η·a/λ. With η0 = 376.7303 Ω and
 * a = 10⁻⁶λ this gives 73.079 + j42.5147 Ω (mpmath 1.3.0 evaluation of the
 * same closed form, in the tests). The sinusoidal-current model is trustworthy for thin wires
 * (a ≲ 10⁻³λ) and l ≲ 1.25λ; near l = λ the input impedance is very large and
 * model-sensitive.
 *
 * @param lengthM - Dipole length l [m], > 0, not a whole number of wavelengths.
 * @param radiusM - Wire radius a [m], 0 < a < l/2.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns Z_in [Ω].
 * @throws {@link DomainError} for non-positive length/radius/frequency or l = nλ.
 * @example
 * ```ts
 * dipoleSelfImpedance(0.5, 1e-6, 299792458); // ≈ 73.08 + 42.51j Ω
 * ```
 * @category Elements
 */
export function dipoleSelfImpedance(lengthM: number, radiusM: number, frequencyHz: number): Complex {
  const k = wavenumber(frequencyHz);
  const g = dipoleGeometry('dipole', { centerM: [0, 0, 0], axis: [0, 0, 1], lengthM, radiusM }, k);
  freeSelfInto(work, g, k);
  return new Complex(work[0], work[1]);
}

function equalParallel(lengthM: number, frequencyHz: number, dM: number, hM: number, what: string): Complex {
  const k = wavenumber(frequencyHz);
  dipoleGeometry('dipole', { centerM: [0, 0, 0], axis: [0, 0, 1], lengthM, radiusM: lengthM * 1e-9 }, k);
  const overlaps = Math.abs(hM) <= lengthM && dM <= 0;
  if (overlaps) {
    throw new CoincidentElementsError(`elements 0 and 1 (${what}): the wires overlap (separation ${dM} m, axial offset ${hM} m, length ${lengthM} m), so the mutual impedance is undefined; separate them.`, [0, 1]);
  }
  parallelMutualImpedanceInto(work, k, lengthM / 2, lengthM / 2, dM, hM);
  return new Complex(work[0], work[1]);
}

/**
 * Mutual impedance of two identical parallel dipoles side by side (centres on a
 * common normal to both axes) by the induced-EMF method.
 *
 * @remarks
 * Exact closed form in Si/Ci for sinusoidal filaments of any length (our
 * derivation; for l = λ/2 it reduces to Balanis, Antenna Theory, 4th ed., 2016,
 * eq. (8-68) (Carter 1932), from memory:
 * R = (η/4π)[2Ci(u₀) − Ci(u₁) − Ci(u₂)], X = −(η/4π)[2Si(u₀) − Si(u₁) − Si(u₂)],
 * u₀ = kd, u₁,₂ = k(√(d² + l²) ± l)). Terminal-referred (equal to the
 * current-maximum value for l = λ/2). Z₁₂ = Z₂₁ (reciprocity).
 *
 * @param lengthM - Length of each dipole [m].
 * @param separationM - Distance between the parallel axes [m], > 0.
 * @param frequencyHz - Frequency [Hz].
 * @returns Z₂₁ [Ω].
 * @throws {@link DomainError} for bad numbers; {@link CoincidentElementsError} for zero separation.
 * @category Elements
 */
export function sideBySideMutualImpedance(lengthM: number, separationM: number, frequencyHz: number): Complex {
  assertNonNegative('separationM', separationM, 'm');
  return equalParallel(lengthM, frequencyHz, separationM, 0, 'side by side');
}

/**
 * Mutual impedance of two identical collinear dipoles (on one line) by the
 * induced-EMF method.
 *
 * @remarks
 * Exact closed form in Si/Ci and a logarithm (the d → 0 limit of the parallel
 * form); for l = λ/2 this is Balanis, Antenna Theory, 4th ed., 2016, eq.
 * (8-69) (from memory). Terminal-referred.
 *
 * @param lengthM - Length of each dipole [m].
 * @param centerSpacingM - Distance between the feed points along the line [m], > lengthM.
 * @param frequencyHz - Frequency [Hz].
 * @returns Z₂₁ [Ω].
 * @throws {@link CoincidentElementsError} when the dipoles touch or overlap (spacing ≤ length).
 * @category Elements
 */
export function collinearMutualImpedance(lengthM: number, centerSpacingM: number, frequencyHz: number): Complex {
  assertNonNegative('centerSpacingM', centerSpacingM, 'm');
  return equalParallel(lengthM, frequencyHz, 0, centerSpacingM, 'collinear');
}

/**
 * Mutual impedance of two identical parallel dipoles in echelon (axes a
 * distance d apart, centres offset by h along the axes) by the induced-EMF
 * method.
 *
 * @remarks
 * Exact closed form in Si/Ci (for l = λ/2: Balanis, Antenna Theory, 4th ed.,
 * 2016, eqs. (8-70)–(8-71), from memory). Reduces to the side-by-side form at
 * h = 0 and to the collinear form as d → 0. Terminal-referred.
 *
 * @param lengthM - Length of each dipole [m].
 * @param separationM - Distance between the axes [m], ≥ 0.
 * @param axialOffsetM - Offset of the centres along the axis direction [m].
 * @param frequencyHz - Frequency [Hz].
 * @returns Z₂₁ [Ω].
 * @throws {@link CoincidentElementsError} when the wires overlap.
 * @category Elements
 */
export function echelonMutualImpedance(lengthM: number, separationM: number, axialOffsetM: number, frequencyHz: number): Complex {
  assertNonNegative('separationM', separationM, 'm');
  if (!Number.isFinite(axialOffsetM)) {
    throw new DomainError(`invalid argument "axialOffsetM": expected a finite number [m], received ${describeValue(axialOffsetM)}.`);
  }
  return equalParallel(lengthM, frequencyHz, separationM, axialOffsetM, 'in echelon');
}

/**
 * Mutual impedance of two thin sinusoidal dipoles of any lengths, positions and
 * orientations by the induced-EMF method, optionally over a PEC ground plane.
 *
 * @remarks
 * Z₂₁ = −(1/(I₁I₂)) ∫ E₁(t)·â₂ I₂(t) dt with terminal currents I₁, I₂
 * (Carter 1932; Balanis, Antenna Theory, 4th ed., 2016, eq. (8-55), from
 * memory). Parallel pairs use the exact Si/Ci closed form; other pairs integrate
 * the exact near field of the sinusoidal filament of `a` (E_z and E_ρ, Balanis
 * eqs. (8-53a,b), from memory) along `b` with composite Gauss–Legendre rules
 * (segments ≤ `maxSegmentWavelengths`·λ and ≤ the wire-to-wire distance; about
 * 1e-12 relative for 16 nodes per quarter wavelength at separations ≳ 0.05λ).
 * With a ground plane, Z = Z_free(a, b) + Z_free(a, image of b), the image
 * having the mirrored position and current 2(â·ẑ)ẑ − â.
 *
 * @param a - First dipole.
 * @param b - Second dipole.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Ground plane and integration controls.
 * @returns Z₁₂ = Z₂₁ [Ω].
 * @throws {@link CoincidentElementsError} when the wires overlap (names pair 0, 1).
 * @throws {@link DomainError} for bad dipoles or a dipole at or below the ground plane.
 * @category Elements
 */
export function dipoleMutualImpedance(a: WireDipole, b: WireDipole, frequencyHz: number, options: InducedEmfOptions = {}): Complex {
  const k = wavenumber(frequencyHz);
  const opts = integrationOptions(options);
  const ga = dipoleGeometry('a', a, k);
  const gb = dipoleGeometry('b', b, k);
  const out = new Float64Array(2);
  const plane = options.groundPlane;
  if (plane) {
    assertAboveGround('a', ga, plane);
    assertAboveGround('b', gb, plane);
  }
  freePairInto(out, ga, gb, k, opts, [0, 1], '');
  if (plane) {
    const img = new Float64Array(2);
    freePairInto(img, ga, imageGeometry(gb, plane), k, opts, [0, 1], ' (element 0 and the ground image of element 1)');
    out[0] += img[0]; out[1] += img[1];
  }
  return new Complex(out[0], out[1]);
}

/**
 * Open-addressing hash table from (shape pair, quantised offset) to a complex
 * value; keys are verified exactly, so hash collisions only cost a probe.
 */
class PairTable {
  private cap = 1024;
  private size = 0;
  private keys = new Float64Array(4 * this.cap);
  private vals = new Float64Array(2 * this.cap);
  private used = new Uint8Array(this.cap);

  private slot(a: number, x: number, y: number, z: number): number {
    let h = Math.imul(a | 0, 0x9e3779b1) ^ Math.imul(x | 0, 0x85ebca77) ^ Math.imul(y | 0, 0xc2b2ae3d) ^ Math.imul(z | 0, 0x27d4eb2f);
    h = Math.imul(h ^ (h >>> 15), 0x2c1b3c6d);
    h ^= (x / 4294967296) | 0;
    return (h ^ (h >>> 13)) & (this.cap - 1);
  }

  get(a: number, x: number, y: number, z: number, out: Float64Array): boolean {
    for (let i = this.slot(a, x, y, z); this.used[i]; i = (i + 1) & (this.cap - 1)) {
      const o = 4 * i;
      if (this.keys[o] === a && this.keys[o + 1] === x && this.keys[o + 2] === y && this.keys[o + 3] === z) {
        out[0] = this.vals[2 * i]; out[1] = this.vals[2 * i + 1];
        return true;
      }
    }
    return false;
  }

  set(a: number, x: number, y: number, z: number, v: Float64Array): void {
    if (2 * (this.size + 1) > this.cap) this.grow();
    let i = this.slot(a, x, y, z);
    while (this.used[i]) i = (i + 1) & (this.cap - 1);
    this.used[i] = 1;
    this.keys.set([a, x, y, z], 4 * i);
    this.vals[2 * i] = v[0]; this.vals[2 * i + 1] = v[1];
    this.size++;
  }

  private grow(): void {
    const { keys, vals, used, cap } = this;
    this.cap = 2 * cap;
    this.keys = new Float64Array(4 * this.cap);
    this.vals = new Float64Array(2 * this.cap);
    this.used = new Uint8Array(this.cap);
    this.size = 0;
    const v = new Float64Array(2);
    for (let i = 0; i < cap; i++) {
      if (!used[i]) continue;
      v[0] = vals[2 * i]; v[1] = vals[2 * i + 1];
      this.set(keys[4 * i], keys[4 * i + 1], keys[4 * i + 2], keys[4 * i + 3], v);
    }
  }
}

/**
 * Open-circuit impedance matrix Z [Ω] of an array of thin sinusoidal dipoles by
 * the induced-EMF method (V = Z I, terminal currents), optionally over a PEC
 * ground plane.
 *
 * @remarks
 * Diagonal: {@link dipoleSelfImpedance} (plus the coupling to the element's own
 * image over ground); off-diagonal: {@link dipoleMutualImpedance}. Only the
 * pairs i < j are computed and mirrored (Z is symmetric by reciprocity), and
 * pairs whose relative geometry (lengths, radii, axes and centre offset, the
 * latter to 1e-10 λ, either order) repeats are evaluated once — on a regular
 * lattice O(N) evaluations instead of N²/2. Under
 * the single-mode assumption an open-circuited dipole carries no current, so
 * these pairwise values are the exact N-port matrix of the model.
 *
 * @param dipoles - The N dipoles (any lengths, orientations, positions).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Ground plane and integration controls.
 * @returns Z, N×N complex symmetric [Ω].
 * @throws {@link CoincidentElementsError} naming the first overlapping pair.
 * @throws {@link DomainError} for an empty list, bad dipoles, or dipoles at or below the ground plane.
 * @example
 * ```ts
 * const d = (x: number) => ({ centerM: [x, 0, 0], axis: [0, 0, 1], lengthM: 0.5, radiusM: 1e-5 }) as const;
 * dipoleArrayImpedanceMatrix([d(0), d(0.5)], 299792458); // ≈ [73.1 + 42.5j, −12.5 − 29.9j, −12.5 − 29.9j, 73.1 + 42.5j] Ω
 * ```
 * @category Elements
 */
export function dipoleArrayImpedanceMatrix(dipoles: ReadonlyArray<WireDipole>, frequencyHz: number, options: InducedEmfOptions = {}): CMatrix {
  const k = wavenumber(frequencyHz);
  const opts = integrationOptions(options);
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of WireDipole, received ${describeValue(dipoles)}.`);
  }
  const n = dipoles.length;
  const plane = options.groundPlane;
  const geo = dipoles.map((d, i) => {
    const g = dipoleGeometry(`dipoles[${i}]`, d, k);
    if (plane) assertAboveGround(`dipoles[${i}]`, g, plane);
    return g;
  });
  const images = plane ? geo.map((g) => imageGeometry(g, plane)) : undefined;
  // Pairs with the same relative geometry (shapes, axes and offset equal to 1e-10 λ) share one
  // evaluation: on regular lattices this turns N²/2 evaluations into O(N).
  const quantum = (2 * Math.PI) / k * 1e-10;
  const shapeIds = new Map<string, number>();
  const shapeOf = (g: DipoleGeometry) => {
    const key = `${g.halfLengthM}:${g.radiusM}:${g.ax}:${g.ay}:${g.az}`;
    let id = shapeIds.get(key);
    if (id === undefined) { id = shapeIds.size; shapeIds.set(key, id); }
    return id;
  };
  const shapes = geo.map(shapeOf);
  const imageShapes = images ? images.map(shapeOf) : undefined;
  const cache = new PairTable();
  // i, j and `image` only name the pair in an error message (built only when one is thrown)
  const coupled = (a: DipoleGeometry, sa: number, b: DipoleGeometry, sb: number, i: number, j: number, image: boolean, out: Float64Array): void => {
    let qx = Math.round((b.cx - a.cx) / quantum), qy = Math.round((b.cy - a.cy) / quantum), qz = Math.round((b.cz - a.cz) / quantum);
    let s1 = sa, s2 = sb;
    // canonical order of the reciprocal pair: (a, b, Δ) ≡ (b, a, −Δ)
    if (sa > sb || (sa === sb && (qx < 0 || (qx === 0 && (qy < 0 || (qy === 0 && qz < 0)))))) {
      s1 = sb; s2 = sa; qx = -qx; qy = -qy; qz = -qz;
    }
    const shapePair = s1 * 1048576 + s2;
    if (cache.get(shapePair, qx, qy, qz, out)) return;
    const what = !image ? '' : i === j ? ' (element and its own ground image)' : ` (element ${i} and the ground image of element ${j})`;
    freePairInto(out, a, b, k, opts, [i, j], what);
    cache.set(shapePair, qx, qy, qz, out);
  };
  const data = new Float64Array(2 * n * n);
  const out = new Float64Array(2);
  for (let i = 0; i < n; i++) {
    freeSelfInto(out, geo[i], k);
    let zr = out[0], zi = out[1];
    if (images && imageShapes) {
      coupled(geo[i], shapes[i], images[i], imageShapes[i], i, i, true, out);
      zr += out[0]; zi += out[1];
    }
    data[2 * (i * n + i)] = zr;
    data[2 * (i * n + i) + 1] = zi;
    for (let j = i + 1; j < n; j++) {
      coupled(geo[i], shapes[i], geo[j], shapes[j], i, j, false, out);
      zr = out[0]; zi = out[1];
      if (images && imageShapes) {
        coupled(geo[i], shapes[i], images[j], imageShapes[j], i, j, true, out);
        zr += out[0]; zi += out[1];
      }
      data[2 * (i * n + j)] = zr; data[2 * (i * n + j) + 1] = zi;
    }
  }
  // Z is symmetric (reciprocity): the lower triangle is the transposed upper one
  mirrorTriangle(n, data, false, false);
  return matrixView(n, n, data);
}
