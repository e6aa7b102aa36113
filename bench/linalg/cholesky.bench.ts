import { bench, describe } from 'vitest';
import { choleskyFactor, choleskySolve } from '../../src/linalg/cholesky.js';
import { seededHpd, seededMatrix, sink } from './sink.js';

describe('Cholesky + 1000 right-hand sides, N = 128', () => {
  const a = seededHpd(128, 6), b = seededMatrix(128, 1000, 7);
  bench('choleskyFactor + choleskySolve', () => { sink(choleskySolve(choleskyFactor(a), b)); });
  const f = choleskyFactor(a);
  bench('choleskySolve only', () => { sink(choleskySolve(f, b)); });
  bench('choleskyFactor only', () => { sink(choleskyFactor(a).l); });
});
