import { bench, describe } from 'vitest';
import { multiply, multiplyInto } from '../../src/linalg/ops.js';
import { zeros } from '../../src/linalg/cmatrix.js';
import { seededMatrix, sink } from './sink.js';

for (const n of [32, 128, 256]) {
  describe(`complex product ${n}×${n}`, () => {
    const a = seededMatrix(n, n, 1), b = seededMatrix(n, n, 2);
    const out = zeros(n, n);
    bench('multiply (allocating)', () => { sink(multiply(a, b)); });
    bench('multiplyInto', () => { sink(multiplyInto(out, a, b)); });
  });
}
