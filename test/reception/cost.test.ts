import { describe, it, expect } from 'vitest';
import { CapacityError, DomainError } from '../../src/errors.js';
import { ARRAY_FIGURES_AUTO_MAX_PORTS, assertEvaluationFits, evaluationCost } from '../../src/reception/index.js';
import { arrayFiguresWanted } from '../../src/reception/cost.js';

describe('evaluationCost', () => {
  it('grows as N³ in the dense stages and as N²·M in the general brightness integral', () => {
    const a = evaluationCost({ portCount: 1000, directionCount: 1000, beamCount: 1 });
    const b = evaluationCost({ portCount: 2000, directionCount: 1000, beamCount: 1 });
    expect(b.stagesS.receiverNoise / a.stagesS.receiverNoise).toBeCloseTo(8, 12);
    expect(b.stagesS.beams / a.stagesS.beams).toBeGreaterThan(7);
    const c = evaluationCost({ portCount: 1000, directionCount: 4000, beamCount: 1 });
    expect(c.stagesS.brightness / a.stagesS.brightness).toBeCloseTo(4, 12);
    // the displacement path replaces N²·M by D·M + N²
    const d = evaluationCost({ portCount: 1000, directionCount: 4000, beamCount: 1, displacementCount: 4000 });
    expect(d.stagesS.brightness).toBeLessThan(c.stagesS.brightness / 3);
    expect(evaluationCost({ portCount: 1000, directionCount: 1000, beamCount: 1, arrayFigures: false }).stagesS.arrayFigures).toBe(0);
    // 22 complex N×N matrices of 16 bytes per entry
    expect(a.peakBytes).toBeGreaterThan(16 * 22 * 1e6);
  });
  it('a 1000 × 1000 layout is refused with a CapacityError naming the size; bad counts are DomainErrors', () => {
    const big = evaluationCost({ portCount: 1_000_000, directionCount: 1e5, beamCount: 25 });
    expect(() => assertEvaluationFits(big, 4e9, '1000 × 1000 rectangular layout')).toThrow(CapacityError);
    expect(() => assertEvaluationFits(big, 4e9, '1000 × 1000 rectangular layout')).toThrow(/1000 × 1000 rectangular layout needs about/);
    expect(() => assertEvaluationFits(evaluationCost({ portCount: 100, directionCount: 100, beamCount: 1 }), 4e9, 'x')).not.toThrow();
    expect(() => evaluationCost({ portCount: 0, directionCount: 1, beamCount: 1 })).toThrow(DomainError);
    expect(() => evaluationCost(null as never)).toThrow(DomainError);
    expect(() => assertEvaluationFits(big, -1, 'x')).toThrow(DomainError);
  });
  it("arrayFigures 'auto' (the default) computes the O(N³) array figures up to 1024 ports; true and false are kept; anything else is a DomainError", () => {
    expect(ARRAY_FIGURES_AUTO_MAX_PORTS).toBe(1024);
    expect(arrayFiguresWanted('o', undefined, 1024)).toBe(true);
    expect(arrayFiguresWanted('o', 'auto', 1025)).toBe(false);
    expect(arrayFiguresWanted('o', true, 5000)).toBe(true);
    expect(arrayFiguresWanted('o', false, 4)).toBe(false);
    expect(() => arrayFiguresWanted('description.arrayFigures', 'yes', 4)).toThrow(/"description.arrayFigures": expected true, false or 'auto', received/);
    // the estimate follows the same rule: the default at 2000 ports has no array-figure stage, at 1000 it has one
    expect(evaluationCost({ portCount: 2000, directionCount: 1000, beamCount: 1 }).stagesS.arrayFigures).toBe(0);
    expect(evaluationCost({ portCount: 1000, directionCount: 1000, beamCount: 1 }).stagesS.arrayFigures).toBeGreaterThan(0);
    expect(evaluationCost({ portCount: 2000, directionCount: 1000, beamCount: 1, arrayFigures: true }).stagesS.arrayFigures).toBeGreaterThan(0);
  });
});
