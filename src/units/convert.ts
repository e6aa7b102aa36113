/**
 * Unit helpers at the edge of the API: degrees, decibels, wavelength, jansky.
 * The library itself works in radians and linear ratios.
 * @module
 */
import { assertFinite, assertPositive } from '../internal/validate.js';
import { DomainError } from '../errors.js';
import { C0_M_PER_S, JANSKY_W_PER_M2_HZ } from './constants.js';

/**
 * Degrees to radians.
 * @param deg - Angle [deg].
 * @returns Angle [rad].
 * @category Units
 */
export function degToRad(deg: number): number {
  return (deg * Math.PI) / 180;
}

/**
 * Radians to degrees.
 * @param rad - Angle [rad].
 * @returns Angle [deg].
 * @category Units
 */
export function radToDeg(rad: number): number {
  return (rad * 180) / Math.PI;
}

/**
 * Power ratio to decibels, 10·log10(p). Zero maps to −Infinity (a legitimate null).
 * @param p - Power ratio, ≥ 0 (linear).
 * @returns Power ratio [dB].
 * @throws {@link DomainError} if `p` is negative or NaN.
 * @category Units
 */
export function powerToDb(p: number): number {
  if (!(p >= 0)) throw new DomainError(`invalid argument "p": expected a power ratio ≥ 0, received ${p}.`);
  return 10 * Math.log10(p);
}

/**
 * Decibels to power ratio, 10^(dB/10).
 * @param db - Power ratio [dB].
 * @returns Linear power ratio.
 * @category Units
 */
export function dbToPower(db: number): number {
  if (Number.isNaN(db)) throw new DomainError('invalid argument "db": expected a number of decibels, received NaN.');
  return 10 ** (db / 10);
}

/**
 * Field (amplitude) ratio to decibels, 20·log10(|a|).
 * @param a - Field ratio (linear; sign ignored).
 * @returns Field ratio [dB].
 * @category Units
 */
export function amplitudeToDb(a: number): number {
  if (Number.isNaN(a)) throw new DomainError('invalid argument "a": expected a field ratio, received NaN.');
  return 20 * Math.log10(Math.abs(a));
}

/**
 * Decibels to field (amplitude) ratio, 10^(dB/20).
 * @param db - Field ratio [dB].
 * @returns Linear field ratio.
 * @category Units
 */
export function dbToAmplitude(db: number): number {
  if (Number.isNaN(db)) throw new DomainError('invalid argument "db": expected a number of decibels, received NaN.');
  return 10 ** (db / 20);
}

/**
 * Free-space wavelength λ = c0 / f.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns Wavelength [m].
 * @category Units
 */
export function wavelengthM(frequencyHz: number): number {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  return C0_M_PER_S / frequencyHz;
}

/**
 * Free-space wavenumber k = 2π f / c0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns Wavenumber [rad/m].
 * @category Units
 */
export function wavenumberRadPerM(frequencyHz: number): number {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  return (2 * Math.PI * frequencyHz) / C0_M_PER_S;
}

/**
 * Flux density in jansky to SI.
 * @param jy - Flux density [Jy].
 * @returns Flux density [W m⁻² Hz⁻¹].
 * @category Units
 */
export function janskyToSi(jy: number): number {
  assertFinite('jy', jy);
  return jy * JANSKY_W_PER_M2_HZ;
}

/**
 * Flux density in SI to jansky.
 * @param s - Flux density [W m⁻² Hz⁻¹].
 * @returns Flux density [Jy].
 * @category Units
 */
export function siToJansky(s: number): number {
  assertFinite('s', s);
  return s / JANSKY_W_PER_M2_HZ;
}
