/**
 * Element factors for pattern multiplication.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive, describeValue } from '../internal/validate.js';
import type { ArrayLayout } from '../geometry/layout.js';
import { assertDirections } from '../geometry/directions.js';
import { arrayFactor } from './arrayFactor.js';

/**
 * An element factor (field amplitude, real) used in the pattern-multiplication approximation.
 *
 * @remarks
 * - `isotropic`: f = 1 everywhere.
 * - `cosine`: f = (cosθ)^q for cosθ > 0 and 0 behind the array (z < 0), q > 0
 *   (q ≈ 1–1.5 for a patch or a dipole over a ground plane is common practice).
 * - `custom`: f = `amplitude(x, y, z)` for the unit vector (x, y, z); must return a finite real.
 * @category Pattern
 */
export type ElementFactor = IsotropicElementFactor | CosineElementFactor | CustomElementFactor;

/**
 * f = 1 in every direction.
 * @category Pattern
 */
export interface IsotropicElementFactor {
  /** Discriminant. */
  readonly kind: 'isotropic';
}

/**
 * f = (cosθ)^q in front (z > 0), 0 behind.
 * @category Pattern
 */
export interface CosineElementFactor {
  /** Discriminant. */
  readonly kind: 'cosine';
  /** q > 0 (dimensionless). */
  readonly exponent: number;
}

/**
 * f given by a function of the unit vector.
 * @category Pattern
 */
export interface CustomElementFactor {
  /** Discriminant. */
  readonly kind: 'custom';
  /** Field amplitude at the unit vector (x, y, z); must return a finite real. */
  readonly amplitude: (x: number, y: number, z: number) => number;
}

/** @internal Throws unless `element` is a well-formed element factor. */
export function assertElementFactor(element: ElementFactor): void {
  if (!element || typeof element !== 'object') throw new DomainError(`invalid argument "element": expected {kind: 'isotropic' | 'cosine' | 'custom', …}, received ${describeValue(element)}.`);
  if (element.kind === 'isotropic') return;
  if (element.kind === 'cosine') { assertPositive('element.exponent', element.exponent); return; }
  if (element.kind === 'custom' && typeof element.amplitude === 'function') return;
  throw new DomainError(`invalid argument "element": unknown kind ${describeValue((element as { kind: unknown }).kind)}; use 'isotropic', 'cosine' or 'custom' with an amplitude function.`);
}

/** @internal Element factor at one unit vector (element already validated). */
export function elementFactorAt(element: ElementFactor, x: number, y: number, z: number): number {
  if (element.kind === 'isotropic') return 1;
  if (element.kind === 'cosine') return z > 0 ? z ** element.exponent : 0;
  const f = element.amplitude(x, y, z);
  if (typeof f !== 'number' || !Number.isFinite(f)) {
    throw new DomainError(`invalid argument "element.amplitude": returned ${describeValue(f)} at direction (${x}, ${y}, ${z}); the element factor must be a finite real number.`);
  }
  return f;
}

/**
 * Values of an element factor at directions.
 * @param element - The element factor.
 * @param directions - M unit vectors, xyz-interleaved.
 * @returns f(r̂ₘ), length M (field amplitude, dimensionless).
 * @throws {@link DomainError} for a bad exponent, an unknown kind, or a custom function returning a non-finite value.
 * @category Pattern
 */
export function elementFactorValues(element: ElementFactor, directions: Float64Array): Float64Array {
  assertDirections('directions', directions);
  assertElementFactor(element);
  const m = directions.length / 3;
  const out = new Float64Array(m);
  for (let i = 0; i < m; i++) out[i] = elementFactorAt(element, directions[3 * i], directions[3 * i + 1], directions[3 * i + 2]);
  return out;
}

/**
 * Total pattern by pattern multiplication: F(r̂) = f(r̂)·AF(r̂).
 *
 * @remarks
 * The pattern-multiplication approximation: every element is assumed to have
 * the same pattern f, unchanged by its neighbours — mutual coupling, edge
 * effects and element rotation are ignored (C. A. Balanis, *Antenna Theory*,
 * 4th ed., Wiley, 2016, §6.2, eq. 6-5 — from memory). For coupled arrays use
 * embedded element patterns instead.
 * @param layout - Element positions.
 * @param weights - N×1 weights.
 * @param directions - M unit vectors, xyz-interleaved.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param element - The common element factor.
 * @returns F, M×1 complex (dimensionless).
 * @throws {@link DimensionError} / {@link DomainError} as {@link arrayFactor} and {@link elementFactorValues}.
 * @category Pattern
 */
export function totalPattern(layout: ArrayLayout, weights: CMatrix, directions: Float64Array, frequencyHz: number, element: ElementFactor): CMatrix {
  const f = elementFactorValues(element, directions);
  const af = arrayFactor(layout, weights, directions, frequencyHz);
  for (let i = 0; i < f.length; i++) {
    af.data[2 * i] *= f[i];
    af.data[2 * i + 1] *= f[i];
  }
  return af;
}
