/**
 * Assumed current of a thin strip dipole (along x) and its Fourier transform.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertPositive } from '../internal/validate.js';

/**
 * A thin strip (or wire) dipole along x, centre-fed, with an assumed current.
 *
 * @remarks
 * Current along the strip: `'piecewiseSinusoidal'` I(x) = I₀ sin(k_e(L/2 − |x|))/sin(k_e L/2), with
 * an effective wavenumber k_e (default k₀ in free space and over a ground plane, k₀√((εr + 1)/2)
 * on a slab, common practice); `'cosine'` I(x) = I₀ cos(πx/L) (the resonant entire-domain mode,
 * k_e = π/L). Both are normalised to the feed current I₀ at x = 0. Across the strip the current is
 * uniform, so a round wire of radius a corresponds to a strip of width w = a·e^{3/2} ≈ 4.48 a (the
 * strip's geometric mean distance w·e^{−3/2} equals the wire radius; the often-quoted w = 4a belongs
 * to the edge-singular strip current). The test suite checks this equivalence against the element
 * module's induced-EMF wire dipoles.
 * @category Floquet
 */
export interface StripDipole {
  /** Dipole length L [m], > 0. */
  readonly lengthM: number;
  /** Strip width w [m], > 0 (round wire of radius a: w = a·e^{3/2}). */
  readonly widthM: number;
  /** Current shape. @defaultValue 'piecewiseSinusoidal' */
  readonly current?: 'piecewiseSinusoidal' | 'cosine';
  /** Effective wavenumber of the piecewise-sinusoidal current [rad/m]; default as in the remarks. */
  readonly effectiveWavenumberRadPerM?: number;
}

/** Precomputed constants of the dipole spectrum. @internal */
export interface DipoleSpectrum {
  /** Effective wavenumber k_e [rad/m]. */
  readonly ke: number;
  /** Half length [m]. */
  readonly h: number;
  /** 4 k_e / sin(k_e h). */
  readonly c4: number;
  /** cos(k_e h). */
  readonly cosKeH: number;
  /** Half width w/2 [m]. */
  readonly hw: number;
}

/** @internal */
export function dipoleSpectrum(dipole: StripDipole, defaultKe: number): DipoleSpectrum {
  if (dipole === null || typeof dipole !== 'object') {
    throw new DomainError(`invalid argument "element": expected {lengthM, widthM, current?}, received ${String(dipole)}.`);
  }
  assertPositive('element.lengthM', dipole.lengthM, 'm');
  assertPositive('element.widthM', dipole.widthM, 'm');
  const kind = dipole.current ?? 'piecewiseSinusoidal';
  if (kind !== 'piecewiseSinusoidal' && kind !== 'cosine') {
    throw new DomainError(`invalid argument "element.current": expected 'piecewiseSinusoidal' or 'cosine', received ${String(kind)}.`);
  }
  let ke: number;
  if (kind === 'cosine') {
    ke = Math.PI / dipole.lengthM;
  } else {
    ke = dipole.effectiveWavenumberRadPerM ?? defaultKe;
    assertPositive('element.effectiveWavenumberRadPerM', ke, 'rad/m');
  }
  const h = dipole.lengthM / 2;
  const s = Math.sin(ke * h);
  if (!(ke * h < 0.95 * Math.PI) || s <= 0) {
    throw new DomainError(
      `invalid argument "element.lengthM": the piecewise-sinusoidal current needs k_e·L/2 < 0.95π so that the feed current is not near zero, received k_e·L/2 = ${ke * h}; use a dipole shorter than about one effective wavelength.`,
    );
  }
  return { ke, h, c4: (4 * ke) / s, cosKeH: Math.cos(ke * h), hw: dipole.widthM / 2 };
}

/**
 * Fourier transform F(k_x) = ∫ I(x)/I₀ e^{j k_x x} dx of the current along the dipole [m] (real, even).
 * F = 4k_e sin((a + k_e)h/2) sin((a − k_e)h/2) / ((a − k_e)(a + k_e) sin(k_e h)), a = |k_x|.
 * @internal
 */
export function currentSpectrum(sp: DipoleSpectrum, kx: number): number {
  const a = Math.abs(kx);
  const ke = sp.ke;
  const d = a - ke;
  const half = 0.5 * d * sp.h;
  const sincPart = Math.abs(half) < 1e-8 ? sp.h / 2 : Math.sin(half) / d;
  return (sp.c4 * Math.sin(0.5 * (a + ke) * sp.h) * sincPart) / (a + ke);
}

/** Transverse spectrum sinc(k_y w/2) of the uniform strip current (dimensionless). @internal */
export function widthSpectrum(sp: DipoleSpectrum, ky: number): number {
  const x = ky * sp.hw;
  return Math.abs(x) < 1e-8 ? 1 : Math.sin(x) / x;
}
