import { bench, describe } from 'vitest';
import { svd } from '../../src/linalg/svd.js';
import { polynomialRoots } from '../../src/linalg/roots.js';
import { seededMatrix, sink } from './sink.js';

describe('svd', () => {
  const a32 = seededMatrix(32, 32, 8), a64 = seededMatrix(64, 48, 9);
  bench('32×32', () => { sink(svd(a32).s); });
  bench('64×48', () => { sink(svd(a64).s); });
});

describe('polynomialRoots', () => {
  const c16 = seededMatrix(17, 1, 10), c64 = seededMatrix(65, 1, 11);
  bench('degree 16', () => { sink(polynomialRoots(c16)); });
  bench('degree 64', () => { sink(polynomialRoots(c64)); });
});
