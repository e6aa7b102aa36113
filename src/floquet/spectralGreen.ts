/**
 * Spectral-domain Green's function of the layered media an infinite planar
 * array may sit in (free space, over a ground plane, printed on a grounded
 * dielectric slab) by the TE/TM transmission-line equivalent.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertPositive } from '../internal/validate.js';
import { ETA0_OHM } from '../units/constants.js';

/**
 * What is under (and over) the plane of the array's dipoles.
 *
 * @remarks
 * - `freeSpace`: dipoles in free space, radiating both ways.
 * - `groundPlane`: a perfectly conducting plane z = 0 with the dipoles at height `heightM` in free space.
 * - `groundedSlab`: a perfectly conducting plane at z = 0 under a lossless dielectric slab of
 *   relative permittivity `relativePermittivity` (εr ≥ 1) and thickness `thicknessM`; the dipoles
 *   are printed on the top face z = t; free space above.
 * @category Floquet
 */
export type ArrayBacking =
  | {
    /** Dipoles in free space. */
    readonly kind: 'freeSpace';
  }
  | {
    /** Dipoles over a PEC ground plane. */
    readonly kind: 'groundPlane';
    /** Height of the dipoles above the plane [m], > 0. */
    readonly heightM: number;
  }
  | {
    /** Dipoles printed on a grounded dielectric slab. */
    readonly kind: 'groundedSlab';
    /** Relative permittivity εr ≥ 1 (lossless). */
    readonly relativePermittivity: number;
    /** Slab thickness t [m], > 0. */
    readonly thicknessM: number;
  };

/** Validates a backing description. @internal */
export function assertBacking(backing: ArrayBacking): void {
  if (backing === null || typeof backing !== 'object') {
    throw new DomainError(`invalid argument "backing": expected {kind: 'freeSpace' | 'groundPlane' | 'groundedSlab', …}, received ${String(backing)}.`);
  }
  switch (backing.kind) {
    case 'freeSpace':
      return;
    case 'groundPlane':
      assertPositive('backing.heightM', backing.heightM, 'm');
      return;
    case 'groundedSlab':
      assertPositive('backing.thicknessM', backing.thicknessM, 'm');
      assertFinite('backing.relativePermittivity', backing.relativePermittivity);
      if (!(backing.relativePermittivity >= 1)) {
        throw new DomainError(`invalid argument "backing.relativePermittivity": expected a lossless dielectric with εr ≥ 1, received ${backing.relativePermittivity}.`);
      }
      return;
    default:
      throw new DomainError(`invalid argument "backing.kind": expected 'freeSpace', 'groundPlane' or 'groundedSlab', received ${String((backing as { kind: unknown }).kind)}.`);
  }
}

/**
 * Precomputed constants of the transmission-line model.
 * @internal
 */
export interface SpectralMedium {
  readonly kind: 0 | 1 | 2;
  readonly k0: number;
  readonly eta: number;
  /** Height (ground plane) or thickness (slab) [m]. */
  readonly d: number;
  readonly er: number;
  /** Large-|k_t| coefficient: Z_TM → −j η |k_t| / (c k0); c = 2 (free space, ground plane) or 1 + εr. */
  readonly cAsym: number;
}

/** @internal */
export function spectralMedium(backing: ArrayBacking, k0: number): SpectralMedium {
  switch (backing.kind) {
    case 'freeSpace':
      return { kind: 0, k0, eta: ETA0_OHM, d: 0, er: 1, cAsym: 2 };
    case 'groundPlane':
      return { kind: 1, k0, eta: ETA0_OHM, d: backing.heightM, er: 1, cAsym: 2 };
    default:
      return { kind: 2, k0, eta: ETA0_OHM, d: backing.thicknessM, er: backing.relativePermittivity, cAsym: 1 + backing.relativePermittivity };
  }
}

/**
 * Writes the TM and TE input impedances seen by a horizontal surface current at the source
 * plane, for transverse wavenumber β: out = [Re Z_TM, Im Z_TM, Re Z_TE, Im Z_TE] [Ω], plus the
 * impedances looking up (free space above): out[4..7] = [Re Z_TM,up, Im, Re Z_TE,up, Im].
 *
 * Transmission-line equivalent (e^{+jωt}): a shunt current source between the upward line
 * (free space, Z_up) and the downward network (free space, a shorted stub of length h, or the
 * slab line of length t ended in a short). Z = Z_up Z_down / (Z_up + Z_down).
 * @internal
 */
export function layeredImpedancesInto(out: Float64Array, med: SpectralMedium, beta: number): Float64Array {
  const k0 = med.k0;
  const eta = med.eta;
  // kz0 = sqrt(k0² − β²), Im ≤ 0.
  const d0 = k0 * k0 - beta * beta;
  const kzr = d0 > 0 ? Math.sqrt(d0) : 0;
  // At a grating-lobe onset (β = k0 exactly) the free-space TE impedance is infinite (Wood
  // anomaly); step 1e-12 k0 onto the evanescent side so the result is large but finite, not NaN.
  const kzi = d0 > 0 ? 0 : -Math.max(Math.sqrt(-d0), 1e-12 * k0);
  // Upward mode impedances: Z_TM,up = η kz0/k0, Z_TE,up = η k0/kz0.
  const tmUr = (eta * kzr) / k0, tmUi = (eta * kzi) / k0;
  const kz2 = kzr * kzr + kzi * kzi;
  const teUr = (eta * k0 * kzr) / kz2, teUi = (-eta * k0 * kzi) / kz2;
  out[4] = tmUr; out[5] = tmUi; out[6] = teUr; out[7] = teUi;
  if (med.kind === 0) {
    out[0] = tmUr / 2; out[1] = tmUi / 2; out[2] = teUr / 2; out[3] = teUi / 2;
    return out;
  }
  if (med.kind === 1) {
    // Image theory: Z = Z_mode (1 − e^{−2j kz0 h}) / 2.
    const h = med.d;
    const amp = Math.exp(2 * kzi * h);
    const er = 1 - amp * Math.cos(2 * kzr * h);
    const ei = amp * Math.sin(2 * kzr * h);
    // TM: Z_TM,up (1 − E)/2
    out[0] = (tmUr * er - tmUi * ei) / 2;
    out[1] = (tmUr * ei + tmUi * er) / 2;
    // TE: η k0 (1 − E)/(2 kz0); stable as kz0 → 0 where (1 − E)/kz0 → 2jh.
    if (Math.sqrt(kz2) * h < 1e-7) {
      out[2] = 0; out[3] = eta * k0 * h;
    } else {
      // (er + j ei)/(kzr + j kzi)
      const qr = (er * kzr + ei * kzi) / kz2;
      const qi = (ei * kzr - er * kzi) / kz2;
      out[2] = (eta * k0 * qr) / 2; out[3] = (eta * k0 * qi) / 2;
    }
    return out;
  }
  // Grounded slab of thickness t, εr; source on top.
  const t = med.d;
  const eps = med.er;
  const dd = eps * k0 * k0 - beta * beta;
  const kdr = dd >= 0 ? Math.sqrt(dd) : 0;
  const kdi = dd >= 0 ? 0 : -Math.sqrt(-dd);
  // E = exp(−2j kd t); T = (1 − E)/(1 + E) = j tan(kd t).
  const amp = Math.exp(2 * kdi * t);
  const Er = amp * Math.cos(2 * kdr * t);
  const Ei = -amp * Math.sin(2 * kdr * t);
  const nr = 1 - Er, ni = -Ei; // 1 − E
  const pr = 1 + Er, pi = Ei; // 1 + E
  const pp = pr * pr + pi * pi;
  const Tr = (nr * pr + ni * pi) / pp;
  const Ti = (ni * pr - nr * pi) / pp;
  // TM down: η kd T/(εr k0)
  const cd = eta / (eps * k0);
  const tmDr = cd * (kdr * Tr - kdi * Ti);
  const tmDi = cd * (kdr * Ti + kdi * Tr);
  // Z = Zu Zd/(Zu + Zd)
  {
    const numR = tmUr * tmDr - tmUi * tmDi;
    const numI = tmUr * tmDi + tmUi * tmDr;
    const sR = tmUr + tmDr, sI = tmUi + tmDi;
    const ss = sR * sR + sI * sI;
    out[0] = (numR * sR + numI * sI) / ss;
    out[1] = (numI * sR - numR * sI) / ss;
  }
  // TE admittances: Y_up = kz0/(η k0); Y_down = kd/(η k0 T) = kd (1 + E)/((1 − E) η k0).
  const ce = 1 / (eta * k0);
  let ydr: number, ydi: number;
  const kdAbs = Math.hypot(kdr, kdi);
  if (kdAbs * t < 1e-4) {
    // kd/(j tan(kd t)) ≈ −j/t · (1 − (kd t)²/3)
    const x2r = (kdr * kdr - kdi * kdi) * t * t, x2i = 2 * kdr * kdi * t * t;
    // −j(1 − x²/3)/t = −(x2i/3)/t − j(1 − x2r/3)/t
    ydr = (ce * (-x2i / 3)) / t;
    ydi = (ce * -(1 - x2r / 3)) / t;
  } else {
    const nn = nr * nr + ni * ni;
    // (1 + E)/(1 − E)
    const rr = (pr * nr + pi * ni) / nn;
    const ri = (pi * nr - pr * ni) / nn;
    ydr = ce * (kdr * rr - kdi * ri);
    ydi = ce * (kdr * ri + kdi * rr);
  }
  const yR = ce * kzr + ydr;
  const yI = ce * kzi + ydi;
  const yy = yR * yR + yI * yI;
  out[2] = yR / yy;
  out[3] = -yI / yy;
  return out;
}
