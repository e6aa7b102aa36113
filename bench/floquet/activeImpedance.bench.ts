import { bench, describe } from 'vitest';
import { rectangularLattice } from '../../src/geometry/lattice.js';
import { type InfiniteDipoleArrayOptions, infiniteArrayActiveImpedanceInto, infiniteDipoleArray } from '../../src/floquet/infiniteDipoleArray.js';
import { seededRandom } from '../../test/helpers/matchers.js';

const F_HZ = 1e9;
const LAMBDA_M = 299792458 / F_HZ;
const N = 10_000;

function sink(d: Float64Array): void {
  for (let i = 0; i < d.length; i += 997) if (!Number.isFinite(d[i])) throw new Error('non-finite benchmark output');
}

// Seeded scan directions over the visible hemisphere θ < 85°, built outside timing.
const rnd = seededRandom(0x5eed);
const theta = new Float64Array(N), phi = new Float64Array(N);
for (let i = 0; i < N; i++) {
  theta[i] = Math.asin(Math.sqrt(rnd()) * Math.sin((85 * Math.PI) / 180));
  phi[i] = 2 * Math.PI * rnd();
}
const out = new Float64Array(2 * N);

const base = {
  lattice: rectangularLattice(0.5 * LAMBDA_M, 0.5 * LAMBDA_M),
  element: { lengthM: 0.4 * LAMBDA_M, widthM: 0.01 * LAMBDA_M },
  frequencyHz: F_HZ,
  relativeTolerance: 1e-6,
};
const cases: Array<[string, InfiniteDipoleArrayOptions]> = [
  ['free-standing', { ...base, backing: { kind: 'freeSpace' } }],
  ['grounded slab εr 2.55, t 0.06λ', { ...base, backing: { kind: 'groundedSlab', relativePermittivity: 2.55, thicknessM: 0.06 * LAMBDA_M } }],
];

for (const [name, options] of cases) {
  describe(`active impedance at ${N} scan points, ${name}, tolerance 1e-6`, () => {
    const prepared = infiniteDipoleArray(options);
    bench('prepared array: infiniteArrayActiveImpedanceInto', () => { sink(infiniteArrayActiveImpedanceInto(out, prepared, theta, phi)); }, { iterations: 5, warmupIterations: 1 });
    bench('including preparation (infiniteDipoleArray + Into)', () => { sink(infiniteArrayActiveImpedanceInto(out, infiniteDipoleArray(options), theta, phi)); }, { iterations: 5, warmupIterations: 1 });
  });
}
