/**
 * The current-sheet limit of an infinite array: infinitesimal x-directed elements, whose scan
 * resistance comes from the propagating Floquet modes alone.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import type { PlanarLattice } from '../geometry/lattice.js';
import { assertScan, propagatingFloquetModes, type ScanDirection } from './modes.js';
import { assertBacking, layeredImpedancesInto, spectralMedium, type ArrayBacking } from './spectralGreen.js';

/**
 * Options of {@link currentSheetScanResistance}.
 * @category Floquet
 */
export interface CurrentSheetOptions {
  /** Lattice of the elements (one per cell). */
  readonly lattice: PlanarLattice;
  /** What is under the plane of the elements (for a slab the elements lie on its top face). */
  readonly backing: ArrayBacking;
  /** Frequency [Hz], > 0. */
  readonly frequencyHz: number;
  /** Effective length L_eff of each element [m] (current moment per ampere of terminal current), > 0. @defaultValue 1 */
  readonly effectiveLengthM?: number;
}

/**
 * Result of {@link currentSheetScanResistance}.
 * @category Floquet
 */
export interface CurrentSheetResistance {
  /** Active (scan) resistance of one element, referred to its terminal current [Ω]. */
  readonly resistanceOhm: number;
  /** The resistance of each propagating mode (the main beam and any grating lobes), sorted by |k_t| [Ω]. */
  readonly modeResistanceOhm: Float64Array;
}

/**
 * Scan resistance of an infinite array of infinitesimal x-directed current elements: the
 * current-sheet limit of {@link infiniteDipoleArray} as the dipole length and width go to zero.
 *
 * @remarks
 * Each cell of area A holds a current moment I·L_eff along x̂; the array scanned to
 * (θ₀, φ₀) is the Floquet sum of sheet currents J = (I L_eff/A) x̂ e^{−j k_t·ρ}. A sheet current
 * meets the TE and TM input impedances Z_TE, Z_TM of the layered medium (the same
 * transmission-line model as the strip array, docs/floquet.md), so mode (m, n) takes
 * R_mn = (L_eff²/A)[cos²ψ Re Z_TM + sin²ψ Re Z_TE], ψ the angle of k_t from x̂. Only the
 * propagating modes (|k_t| < k₀) carry power; the reactance of an infinitesimal element is
 * infinite and is not returned. In free space with only the main beam,
 * R = (η L_eff²/(2A))(cos²φ₀ cos θ₀ + sin²φ₀ / cos θ₀): ∝ cos θ in the E-plane and sec θ in the
 * H-plane (H. A. Wheeler, "Simple relations derived from a phased-array antenna made of an
 * infinite current sheet", IEEE Trans. Antennas Propag. 13(4), 1965, from memory), to rounding.
 * Conventions: docs/conventions.md (e^{+jωt}, θ from +z, φ from +x, RMS).
 * @param options - Lattice, backing, frequency, effective length.
 * @param scan - Scan direction (θ ∈ [0, π/2); at θ = π/2 the H-plane resistance is infinite).
 * @returns The element's scan resistance and its split over the propagating modes [Ω].
 * @throws {@link DomainError} for a bad backing, frequency, length or a scan outside [0, π/2).
 * @example
 * ```ts
 * const lam = 0.1; // m at 2.998 GHz; λ/2 square cells, free space, L_eff = 0.01λ
 * const sheet = { lattice: rectangularLattice(lam / 2, lam / 2), backing: { kind: 'freeSpace' }, frequencyHz: 2.99792458e9, effectiveLengthM: 0.001 } as const;
 * currentSheetScanResistance(sheet, { thetaRad: 0, phiRad: 0 }).resistanceOhm; // ≈ 0.075346 Ω (= η L²/(2A))
 * ```
 * @category Floquet
 */
export function currentSheetScanResistance(options: CurrentSheetOptions, scan: ScanDirection): CurrentSheetResistance {
  if (options === null || typeof options !== 'object') throw new DomainError('invalid argument "options": expected {lattice, backing, frequencyHz, effectiveLengthM?}.');
  assertBacking(options.backing);
  const k0 = wavenumberRadPerM(options.frequencyHz);
  const len = options.effectiveLengthM ?? 1;
  assertPositive('options.effectiveLengthM', len, 'm');
  assertScan(scan, Math.PI / 2 - 1e-12);
  const area = options.lattice.cellAreaM2;
  const med = spectralMedium(options.backing, k0);
  const modes = propagatingFloquetModes(options.lattice, options.frequencyHz, scan);
  const z = new Float64Array(8);
  const out = new Float64Array(modes.length);
  let total = 0;
  modes.forEach((mode, i) => {
    layeredImpedancesInto(z, med, mode.ktRadPerM);
    const c2 = mode.ktRadPerM === 0 ? 1 : (mode.kxRadPerM / mode.ktRadPerM) ** 2;
    const r = ((len * len) / area) * (c2 * z[0] + (1 - c2) * z[2]);
    out[i] = r;
    total += r;
  });
  return { resistanceOhm: total, modeResistanceOhm: out };
}
