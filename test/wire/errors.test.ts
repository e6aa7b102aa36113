import { describe, it, expect } from 'vitest';
import { placeWireElement, solveWires, WireGeometryError, wireLoadImpedance, type WireStructure } from '../../src/wire/index.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import { DomainError } from '../../src/errors.js';

const F = 299792458; // λ = 1 m
type V3 = [number, number, number];
const wire = (a: V3, b: V3, radiusM = 1e-3, segments?: number) => ({ pointsM: [a, b], radiusM, segments });

function geometryError(s: WireStructure, opts = {}): WireGeometryError {
  try { solveWires(s, F, opts); } catch (e) { if (e instanceof WireGeometryError) return e; throw e; }
  throw new Error('expected a WireGeometryError');
}

describe('wire input validation', () => {
  it('crossing wires that are not joined: names both wires and segments', () => {
    const e = geometryError({ wires: [wire([-0.25, 0, 0], [0.25, 0, 0]), wire([0, -0.25, 0], [0, 0.25, 0])], ports: [{ wire: 0 }] });
    expect(e.wire).toBe(0); expect(e.otherWire).toBe(1);
    expect(e.segment).toBeGreaterThanOrEqual(0); expect(e.otherSegment).toBeGreaterThanOrEqual(0);
    expect(e.message).toMatch(/wire 0 segment \d+ and wire 1 segment \d+/);
  });
  it('overlapping parallel wires closer than the sum of radii', () => {
    const e = geometryError({ wires: [wire([0, 0, -0.25], [0, 0, 0.25]), wire([0.0015, 0, -0.2], [0.0015, 0, 0.2])], ports: [{ wire: 0 }] });
    expect(e.otherWire).toBe(1);
  });
  it('a wire ending on the interior of another (not joined end to end)', () => {
    const e = geometryError({ wires: [wire([0, 0, -0.25], [0, 0, 0.25]), wire([0, 0, 0.1], [0.2, 0, 0.1])], ports: [{ wire: 0 }] });
    expect(e.otherWire === 1 || e.wire === 1).toBe(true);
  });
  it('zero-length piece and zero radius', () => {
    expect(geometryError({ wires: [{ pointsM: [[0, 0, 0], [0, 0, 0], [0, 0, 0.5]], radiusM: 1e-3 }], ports: [{ wire: 0 }] }).message).toMatch(/zero-length/);
    expect(geometryError({ wires: [wire([0, 0, 0], [0, 0, 0.5], 0)], ports: [{ wire: 0 }] }).wire).toBe(0);
  });
  it('segment shorter than its radius names wire and segment', () => {
    const e = geometryError({ wires: [wire([0, 0, -0.25], [0, 0, 0.25]), wire([1, 0, 0], [1, 0, 0.5], 0.01, 60)], ports: [{ wire: 0 }] });
    expect(e.wire).toBe(1); expect(e.segment).toBe(0);
  });
  it('feed on a junction of three wires, and at a free end', () => {
    const star: WireStructure = {
      wires: [wire([0, 0, 0], [0.25, 0, 0]), wire([0, 0, 0], [0, 0.25, 0]), wire([0, 0, 0], [0, 0, 0.25])],
      ports: [{ wire: 0, atFraction: 0 }],
    };
    expect(geometryError(star).message).toMatch(/junction of 3/);
    expect(geometryError({ wires: [wire([0, 0, -0.25], [0, 0, 0.25])], ports: [{ wire: 0, atFraction: 1 }] }).message).toMatch(/free last end/);
  });
  it('wire below the ground plane; placements touching the ground differently', () => {
    expect(geometryError({ wires: [wire([0, 0, -0.1], [0, 0, 0.4])], ports: [{ wire: 0 }] }, { groundPlane: { zM: 0 } }).wire).toBe(0);
    const mono: WireStructure = { wires: [wire([0, 0, 0], [0, 0, 0.25])], ports: [{ wire: 0, atFraction: 0 }] };
    const layout = arrayLayout([[0, 0, 0], [1, 0, 0.1]]);
    expect(() => solveWires(placeWireElement(mono, layout), F, { groundPlane: { zM: 0 } })).toThrow(WireGeometryError);
  });
  it('loads: bad values and active impedances are DomainErrors; series RLC value', () => {
    expect(() => wireLoadImpedance({ wire: 0, impedanceOhm: { re: -1, im: 0 } }, F)).toThrow(DomainError);
    expect(() => wireLoadImpedance({ wire: 0 }, F)).toThrow(DomainError);
    expect(() => wireLoadImpedance({ wire: 0, resistanceOhm: 1, impedanceOhm: 5 }, F)).toThrow(DomainError);
    const w = 2 * Math.PI * 1e9;
    const [r, x] = wireLoadImpedance({ wire: 0, resistanceOhm: 50, inductanceH: 1e-9, capacitanceF: 1e-12 }, 1e9);
    expect(r).toBe(50);
    expect(Math.abs(x - (w * 1e-9 - 1 / (w * 1e-12)))).toBeLessThan(1e-12);
    // parallel R ∥ L: Z = jωLR/(R + jωL)
    const [pr, px] = wireLoadImpedance({ wire: 0, resistanceOhm: 100, inductanceH: 1e-8, connection: 'parallel' }, 1e9);
    const xl = w * 1e-8, den = 100 * 100 + xl * xl;
    expect(Math.abs(pr - (100 * xl * xl) / den)).toBeLessThan(1e-9);
    expect(Math.abs(px - (100 * 100 * xl) / den)).toBeLessThan(1e-9);
  });
  it('thin-wire limits broken but not rejected: reported as failed checks and warnings', () => {
    // segments 2 radii long (limit 4, common practice for the reduced kernel) and k·a = 0.19 (limit 0.1)
    const s = solveWires({ wires: [wire([0, 0, -0.25], [0, 0, 0.25], 0.03, 8)], ports: [{ wire: 0 }] }, F);
    const failed = s.checks.filter((c) => !c.passed).map((c) => c.name).sort();
    expect(failed).toEqual(['elementModel.segmentLengthToRadius', 'elementModel.wireRadius']);
    expect(s.warnings.length).toBe(2);
  });
  it('bad frequency, segment option and port index', () => {
    const d: WireStructure = { wires: [wire([0, 0, -0.25], [0, 0, 0.25])], ports: [{ wire: 0 }] };
    expect(() => solveWires(d, 0)).toThrow(DomainError);
    expect(() => solveWires(d, F, { maxSegmentWavelengths: 0.5 })).toThrow(DomainError);
    expect(() => solveWires({ ...d, ports: [{ wire: 3 }] }, F)).toThrow(DomainError);
  });
});
