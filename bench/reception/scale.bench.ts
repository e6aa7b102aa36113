import { bench, describe } from 'vitest';
import { triangularLatticeLayout } from '../../src/geometry/builders.js';
import type { WireDipole } from '../../src/element/types.js';
import { wavelengthM } from '../../src/units/convert.js';
import { dipoleArrayPorts, evaluateReceivingArray, skyAndGroundEnvironment, type ReceivingArrayEvaluation } from '../../src/reception/index.js';

// Issue 17's benchmark: λ/2-spaced half-wave dipoles λ/4 over a PEC ground, one frequency,
// 25 max-SNR beams in the xz-plane, the adaptive sphere rule (which must pass its own checks).
// Everything is inside the timing: impedance matrix, noise budget on the rule and on the
// refinement rule, weights, figures, array figures, checks. Select cases with
// SCALE_CASES=line600,line1200,hex1200,tri3000 (default: all) and SCALE_ARRAY_FIGURES=0 to skip
// T_rec,min and the embedded element efficiencies.
const f = 1.4e9, lambda = wavelengthM(f), d = lambda / 2;

function line(n: number): [number, number][] {
  return Array.from({ length: n }, (_, i): [number, number] => [(i - (n - 1) / 2) * d, 0]);
}
/** Triangular lattice (rows along x) inside a hexagon holding at least n elements. */
function hexagon(n: number): [number, number][] {
  let r = 0;
  while (3 * r * (r + 1) + 1 < n) r++;
  const lay = triangularLatticeLayout(d, { kind: 'hexagon', circumradiusM: r * d * (1 + 1e-9) });
  return Array.from({ length: lay.count }, (_, i): [number, number] => [lay.positionsM[3 * i], lay.positionsM[3 * i + 1]]);
}

const cases: Record<string, [number, number][]> = {
  line600: line(600), line1200: line(1200), hex1200: hexagon(1200), tri3000: hexagon(3000),
};
const wanted = (process.env.SCALE_CASES ?? Object.keys(cases).join(',')).split(',');
// SCALE_ARRAY_FIGURES=1 forces T_rec,min and the embedded element efficiencies, 0 skips them; the
// default is the evaluation's own default, 'auto' (computed up to 1024 ports).
const arrayFigures = process.env.SCALE_ARRAY_FIGURES === '1' ? true : process.env.SCALE_ARRAY_FIGURES === '0' ? false : 'auto' as const;
const th = Float64Array.from({ length: 25 }, (_, k) => (k - 12) * 0.04);
const ph = new Float64Array(25);

for (const name of Object.keys(cases).filter((c) => wanted.includes(c))) {
  const xy = cases[name];
  const dipoles = xy.map(([x, y]): WireDipole => ({ centerM: [x, y, lambda / 4], axis: [0, 1, 0], lengthM: 0.48 * lambda, radiusM: lambda / 400 }));
  let last: ReceivingArrayEvaluation | undefined;
  let ms = 0;
  let failed: string[] = [];
  describe(`${name}: ${xy.length} dipoles over ground, 25 max-SNR beams, adaptive rule, array figures ${arrayFigures}`, () => {
    bench('dipoleArrayPorts + evaluateReceivingArray', () => {
      const t0 = performance.now();
      const ports = dipoleArrayPorts(dipoles, f, { groundPlane: { zM: 0 } });
      last = evaluateReceivingArray({
        ports, quadrature: 'adaptive', bandwidthHz: 1e6, loss: 'lossless', arrayFigures,
        environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290 }),
        amplifiers: { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: { re: 0.014, im: -0.002 } },
        beams: { thetaRad: th, phiRad: ph },
      });
      ms = performance.now() - t0;
      failed = last.checks.filter((c) => !c.passed).map((c) => c.name);
      // vitest's bench runner does not report an exception thrown here, so a failed check is
      // printed by the teardown and sets the exit code.
      if (failed.length > 0) process.exitCode = 1;
    }, {
      iterations: 1, warmupIterations: 0,
      teardown: () => {
        if (!last) return;
        const stages = Object.fromEntries(Object.entries(last.timingsMs).map(([k, v]) => [k, Math.round(v)]));
        if (failed.length > 0) process.stdout.write(`${name}: FAILED CHECKS ${failed.join(', ')} (the timing below does not count)\n`);
        process.stdout.write(`${name} N=${xy.length} directions=${last.quadrature.thetaRad.length} total=${Math.round(ms)} ms arrayFigures=${last.arrayFiguresComputed} stages ${JSON.stringify(stages)} rss=${(process.memoryUsage().rss / 1e9).toFixed(2)} GB\n`);
      },
    });
  });
}
