import { describe, it, expect } from 'vitest';
import {
  paraboloidReflector, evaluateReflectorArrayFeed, feedEfficiencies, beamformedFeedPattern, rayHitsReflector,
  reflectorFeedQuadrature, analyticFeedSource, cosinePowerFeed,
} from '../../src/reflector/index.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { ETA0_OHM } from '../../src/units/constants.js';
import { dipoleArrayPorts } from '../../src/reception/ports.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { columnVector, zeros } from '../../src/linalg/cmatrix.js';
import { C0_M_PER_S } from '../../src/units/constants.js';
import type { WireDipole } from '../../src/element/types.js';
import { DimensionError, DomainError } from '../../src/errors.js';

// λ = 1 m. Feed: half-wave dipoles along x_f a quarter wave in front of a ground plane at z_f = −0.25.
const F = C0_M_PER_S;
const dipole = (x: number, y: number): WireDipole => ({ centerM: [x, y, 0], axis: [1, 0, 0], lengthM: 0.5, radiusM: 1e-4 });
const dish = paraboloidReflector({ diameterM: 20, focalLengthM: 6 }); // f/D = 0.3: the wide dipole-over-ground pattern needs a deep dish
const quad = sphereQuadrature(48, 64, { splitAtHorizon: true });

describe('rayHitsReflector', () => {
  it('a symmetric dish intercepts exactly the cone θ_f < θ0', () => {
    const t0 = dish.rimHalfAngleRad;
    expect(rayHitsReflector(dish, t0 - 1e-6, 1.3)).toBe(true);
    expect(rayHitsReflector(dish, t0 + 1e-6, 1.3)).toBe(false);
    expect(rayHitsReflector(dish, Math.PI, 0)).toBe(false);
  });
});

describe('evaluateReflectorArrayFeed', () => {
  const single = dipoleArrayPorts([dipole(0, 0)], F, { groundPlane: { zM: -0.25 } });
  const beams = { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) };

  it('isotropic surroundings at T give T_sys = T for a lossless feed with noiseless receivers (Twiss identity through the dish)', () => {
    const r = evaluateReflectorArrayFeed({
      dish, feed: single, feedQuadrature: quad, skyTemperatureK: 150, groundTemperatureK: 150, bandwidthHz: 1e6, beams, loss: 'lossless',
      weights: columnVector([1]),
    });
    // 1e-3: the feed-side quadrature integrates the ground-plane pattern's edge at θ_f = 90° (split rule) and the
    // analytic dipole's Twiss resistance differs from its pattern integral by the wire-radius term (~3e-5).
    // One result shape (issue 20): the reflector evaluation has the fields of every array evaluation.
    expect(r.beams).toBe(r.figures);
    expect(r.checks.map((c) => c.name)).toContain('radiationEfficiency');
    expect(r.checks.filter((c) => !c.passed)).toEqual([]);
    expect(r.units.systemTemperatureK).toBe('K');
    expect(r.quadrature.weightSr.length).toBeGreaterThan(0);
    expect(Math.abs(r.figures[0].systemTemperatureK / 150 - 1)).toBeLessThan(1e-3);
  });
  it('one feed port: spillover and aperture efficiency equal the Kildal factorisation of the same feed pattern', () => {
    const r = evaluateReflectorArrayFeed({
      dish, feed: single, feedQuadrature: reflectorFeedQuadrature(dish, 64, 96), skyTemperatureK: 5, groundTemperatureK: 290,
      bandwidthHz: 1e6, beams, loss: 'lossless', weights: columnVector([1]),
    });
    const k = feedEfficiencies(dish, beamformedFeedPattern(single.patterns, columnVector([1])), { thetaOrder: 200, phiOrder: 96 });
    const fig = r.figures[0];
    // Spillover: the reception module's sky-region fraction vs Kildal's η_s (different integrations, both split at the rim and the horizon).
    expect(Math.abs(fig.spilloverEfficiency - k.spillover)).toBeLessThan(1e-9);
    // Aperture efficiency A_e/A_phys (available-power effective area of a lossless port) vs Kildal's η_ap.
    expect(Math.abs(fig.apertureEfficiency! / k.aperture - 1)).toBeLessThan(5e-3);
    // T_sys splits into a sky part η_sp·T_sky and a spillover part (1 − η_sp)·T_ground.
    expect(fig.skyTemperatureK).toBeCloseTo(fig.spilloverEfficiency * 5, 6);
    expect(fig.spilloverTemperatureK).toBeCloseTo((1 - fig.spilloverEfficiency) * 290, 6);
  });
  it('seven-element feed: max-SNR beams are at least as sensitive as conjugate-field beams, on and off axis', () => {
    const hex: WireDipole[] = [dipole(0, 0)];
    for (let i = 0; i < 6; i++) hex.push(dipole(0.7 * Math.cos((i * Math.PI) / 3), 0.7 * Math.sin((i * Math.PI) / 3)));
    const feed = dipoleArrayPorts(hex, F, { groundPlane: { zM: -0.25 } });
    const multi = { thetaRad: Float64Array.of(0, 0.03, 0.03), phiRad: Float64Array.of(0, 0, Math.PI / 2) };
    const amps = { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: { re: 0.02, im: 0 } };
    const best = evaluateReflectorArrayFeed({ dish, feed, feedQuadrature: quad, skyTemperatureK: 10, groundTemperatureK: 290, bandwidthHz: 1e6, beams: multi, loss: 'lossless', amplifiers: amps });
    // Conjugate-field match to the θ̂ response (the co-polar one near the axis for x dipoles).
    const w = zeros(7, 3);
    for (let i = 0; i < 7; i++) for (let b = 0; b < 3; b++) {
      w.data[2 * (i * 3 + b)] = best.beamPatterns.thetaComponentV.data[2 * (i * 3 + b)];
      w.data[2 * (i * 3 + b) + 1] = best.beamPatterns.thetaComponentV.data[2 * (i * 3 + b) + 1];
    }
    const cf = evaluateReflectorArrayFeed({ dish, feed, feedQuadrature: quad, skyTemperatureK: 10, groundTemperatureK: 290, bandwidthHz: 1e6, beams: multi, loss: 'lossless', amplifiers: amps, weights: w });
    for (let b = 0; b < 3; b++) {
      expect(best.figures[b].sensitivityM2PerK).toBeGreaterThanOrEqual(cf.figures[b].sensitivityM2PerK * (1 - 1e-9));
      expect(best.figures[b].apertureEfficiency!).toBeLessThan(1);
    }
  });
  it('system temperature of a cosⁿ feed: the rim-split rule gives the closed form η_s = 1 − cos^{2n+1}θ0 (issue 23)', () => {
    // Lossless one-port cosⁿ feed with noiseless receivers: T_sys = η_s T_sky + (1 − η_s) T_ground with the captured
    // fraction of ∫cos^{2n}θ sinθ dθ (closed form). Twiss-consistent radiation resistance: R = ∮|f|²dΩ/η = 2π/((2n + 1)η).
    const n = 2;
    const feed = { patterns: analyticFeedSource([cosinePowerFeed(n)], F), impedanceOhm: fromRows([[(2 * Math.PI) / ((2 * n + 1) * ETA0_OHM)]]) };
    const etaS = 1 - Math.cos(dish.rimHalfAngleRad) ** (2 * n + 1);
    const expected = etaS * 10 + (1 - etaS) * 290;
    const base = { dish, feed, skyTemperatureK: 10, groundTemperatureK: 290, bandwidthHz: 1e6, beams, loss: 'lossless' as const, weights: columnVector([1]) };
    const byDefault = evaluateReflectorArrayFeed(base);
    expect(Math.abs(byDefault.figures[0].systemTemperatureK / expected - 1)).toBeLessThan(1e-12);
    const small = evaluateReflectorArrayFeed({ ...base, feedQuadrature: reflectorFeedQuadrature(dish, 8, 8) });
    expect(Math.abs(small.figures[0].systemTemperatureK / expected - 1)).toBeLessThan(1e-9);
    // A rule split only at the horizon, with as many θ nodes (24) as the small rim-split rule: the step at the rim falls between nodes.
    const horizonOnly = evaluateReflectorArrayFeed({ ...base, feedQuadrature: sphereQuadrature(12, 8, { splitAtHorizon: true }) });
    expect(Math.abs(horizonOnly.figures[0].systemTemperatureK / expected - 1)).toBeGreaterThan(1e-3);
    expect(() => reflectorFeedQuadrature(paraboloidReflector({ diameterM: 2, focalLengthM: 1, offsetM: 1.2 }))).toThrow(DomainError);
  });
  it('bad input', () => {
    expect(() => evaluateReflectorArrayFeed({ dish, feed: single, feedQuadrature: quad, skyTemperatureK: -1, groundTemperatureK: 290, bandwidthHz: 1e6, beams })).toThrow(DomainError);
    expect(() => evaluateReflectorArrayFeed({ dish, feed: { patterns: single.patterns, impedanceOhm: zeros(2, 2) }, feedQuadrature: quad, skyTemperatureK: 5, groundTemperatureK: 290, bandwidthHz: 1e6, beams })).toThrow(DimensionError);
    expect(() => evaluateReflectorArrayFeed({ dish, feed: single, feedQuadrature: quad, skyTemperatureK: 5, groundTemperatureK: 290, bandwidthHz: 1e6, beams, weights: zeros(1, 2) })).toThrow(DimensionError);
  });
});
