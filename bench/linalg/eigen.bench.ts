import { bench, describe } from 'vitest';
import { hermitianEigen, generalizedHermitianEigen } from '../../src/linalg/eigen.js';
import { seededHermitian, seededHpd, sink } from './sink.js';

for (const n of [32, 128, 256]) {
  describe(`Hermitian eigen ${n}×${n}`, () => {
    const a = seededHermitian(n, 3);
    bench('values + vectors', () => { sink(hermitianEigen(a).vectors!); });
    bench('values only', () => { sink(hermitianEigen(a, { valuesOnly: true }).values); });
  });
}

describe('generalized Hermitian eigen 64×64', () => {
  const a = seededHermitian(64, 4), b = seededHpd(64, 5);
  bench('values + vectors', () => { sink(generalizedHermitianEigen(a, b).vectors!); });
});
