import { describe, it, expect } from 'vitest';
import { ETA0_OHM, EPS0_F_PER_M, C0_M_PER_S } from '../../src/units/constants.js';
import { degToRad, powerToDb, dbToPower, amplitudeToDb, wavelengthM, janskyToSi } from '../../src/units/convert.js';
import { DomainError } from '../../src/errors.js';

describe('constants', () => {
  it('η0 and ε0 match CODATA 2018', () => {
    // CODATA 2018 recommended values: Z0 = 376.730 313 668(57) Ω, ε0 = 8.854 187 8128(13)e-12 F/m.
    expect(Math.abs(ETA0_OHM - 376.730313668)).toBeLessThan(1e-8);
    expect(Math.abs(EPS0_F_PER_M / 8.8541878128e-12 - 1)).toBeLessThan(1e-10);
    expect(C0_M_PER_S).toBe(299792458);
  });
});

describe('unit helpers', () => {
  it('round trips and known values', () => {
    expect(degToRad(180)).toBe(Math.PI);
    expect(powerToDb(dbToPower(-13.26))).toBeCloseTo(-13.26, 12);
    expect(amplitudeToDb(0.5)).toBeCloseTo(-6.0206, 4);
    expect(wavelengthM(C0_M_PER_S)).toBe(1);
    expect(janskyToSi(2)).toBe(2e-26);
    expect(powerToDb(0)).toBe(-Infinity);
  });
  it('bad input is typed', () => {
    expect(() => powerToDb(-1)).toThrow(DomainError);
    expect(() => wavelengthM(0)).toThrow(DomainError);
    expect(() => dbToPower(NaN)).toThrow(DomainError);
  });
});
