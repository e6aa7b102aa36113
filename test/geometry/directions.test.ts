import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  unitVectorFromAngles, unitVectorFromDegrees, anglesFromUnitVector, uvFromAngles, unitVectorFromUv, anglesFromUv,
  unitVectorFromAzEl, azElFromUnitVector, unitVectorsFromAngles,
} from '../../src/geometry/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';

describe('direction conversions', () => {
  it('θ, φ ↔ r̂ round trip (property)', () => {
    fc.assert(fc.property(fc.double({ min: 0.001, max: Math.PI - 0.001, noNaN: true }), fc.double({ min: -Math.PI + 1e-3, max: Math.PI, noNaN: true }), (t, p) => {
      const a = anglesFromUnitVector(unitVectorFromAngles(t, p));
      expect(a.thetaRad).toBeCloseTo(t, 12);
      expect(a.phiRad).toBeCloseTo(p, 12);
    }), { seed: 42 });
  });
  it('u, v ↔ angles and azimuth/elevation: definition u = cos el sin az, v = sin el', () => {
    const { u, v } = uvFromAngles(Math.PI / 6, Math.PI / 3);
    expect(u).toBeCloseTo(0.5 * 0.5, 15);
    expect(v).toBeCloseTo(0.5 * Math.sqrt(3) / 2, 15);
    const a = anglesFromUv(u, v);
    expect(a.thetaRad).toBeCloseTo(Math.PI / 6, 14);
    const r = unitVectorFromAzEl(0.3, 0.2);
    expect(r[0]).toBeCloseTo(Math.cos(0.2) * Math.sin(0.3), 15);
    expect(r[1]).toBeCloseTo(Math.sin(0.2), 15);
    const ae = azElFromUnitVector(r);
    expect(ae.azimuthRad).toBeCloseTo(0.3, 14);
    expect(ae.elevationRad).toBeCloseTo(0.2, 14);
    // broadside is (0, 0); pure azimuth stays in the xz-plane (φ = 0)
    expect(anglesFromUnitVector(unitVectorFromAzEl(0.4, 0)).phiRad).toBeCloseTo(0, 15);
    expect(unitVectorFromDegrees(90, 90)[1]).toBeCloseTo(1, 15);
    expect(unitVectorFromUv(0.6, 0, 'back')[2]).toBeCloseTo(-0.8, 15);
  });
  it('typed errors: |r̂| ≠ 1, u² + v² > 1, NaN angles, mismatched lists', () => {
    expect(() => anglesFromUnitVector([1, 1, 0])).toThrow(DomainError);
    expect(() => azElFromUnitVector([0, 0, 2])).toThrow(DomainError);
    expect(() => unitVectorFromUv(0.8, 0.8)).toThrow(DomainError);
    expect(() => anglesFromUv(1, 0.1)).toThrow(DomainError);
    expect(() => unitVectorFromAngles(NaN, 0)).toThrow(DomainError);
    expect(() => unitVectorsFromAngles([0, 1], [0])).toThrow(DimensionError);
    expect(() => unitVectorsFromAngles([0, NaN], [0, 0])).toThrow(DomainError);
    expect(unitVectorsFromAngles([Math.PI / 2], [Math.PI / 2])[1]).toBeCloseTo(1, 15);
  });
});
