import { bench, describe } from 'vitest';
import { createMultiport, type Multiport } from '../../src/network/multiport.js';
import { convertMultiport } from '../../src/network/convert.js';
import { terminatePorts, joinPorts } from '../../src/network/connect.js';
import { formatTouchstone, parseTouchstone } from '../../src/network/touchstone.js';
import { seededRandom } from '../../test/helpers/matchers.js';

function sink(x: { data: Float64Array }): void {
  if (Number.isNaN(x.data[0])) throw new Error('NaN result');
}

function randomNet(form: 'impedance' | 'scattering', n: number, nf: number, seed: number): Multiport {
  const rnd = seededRandom(seed);
  const data = new Float64Array(2 * nf * n * n);
  for (let q = 0; q < data.length; q++) data[q] = (form === 'scattering' ? 0.3 : 20) * (2 * rnd() - 1) / Math.sqrt(n);
  if (form === 'impedance') for (let k = 0; k < nf; k++) for (let i = 0; i < n; i++) data[2 * (k * n * n + i * n + i)] += 50;
  const f = Array.from({ length: nf }, (_, k) => 1e9 + 1e5 * k);
  return createMultiport(form, f, data);
}

describe('4-port Z → S, 10 000 frequencies (target ≤ 20 ms)', () => {
  const z = randomNet('impedance', 4, 10_000, 1);
  bench('convertMultiport(z, "scattering")', () => { sink(convertMultiport(z, 'scattering')); });
});

describe('parse a 64-port, 1001-frequency Touchstone file (target ≤ 1 s)', () => {
  const net = randomNet('scattering', 64, 1001, 2);
  const text = formatTouchstone(net, { version: 1, format: 'RI', significantDigits: 7 });
  parseTouchstone(text, { ports: 64 }); // warm-up
  const before = process.memoryUsage();
  const cpu0 = process.cpuUsage();
  const parsed = parseTouchstone(text, { ports: 64 });
  const cpu = process.cpuUsage(cpu0);
  const after = process.memoryUsage();
  // CPU time is reported beside the wall-clock bench because the bench machine is shared
  process.stdout.write(`[network bench] 64-port file: ${(text.length / 1e6).toFixed(1)} MB of text; result data ${(parsed.network.data.byteLength / 1e6).toFixed(1)} MB; heapUsed ${(before.heapUsed / 1e6).toFixed(0)} → ${(after.heapUsed / 1e6).toFixed(0)} MB, arrayBuffers ${(before.arrayBuffers / 1e6).toFixed(0)} → ${(after.arrayBuffers / 1e6).toFixed(0)} MB, rss ${(after.rss / 1e6).toFixed(0)} MB; CPU time of one parse ${((cpu.user + cpu.system) / 1000).toFixed(0)} ms\n`);
  bench('parseTouchstone (v1, RI, 7 digits)', () => { sink(parseTouchstone(text, { ports: 64 }).network); }, { iterations: 5, time: 0 });
});

describe('connect / terminate a 64-port, 101 frequencies', () => {
  const a = randomNet('scattering', 64, 101, 3);
  const b = randomNet('scattering', 64, 101, 4);
  const half = Array.from({ length: 32 }, (_, i) => 2 * i);
  const loads = half.map(() => ({ re: 50, im: 10 }));
  bench('terminatePorts: 32 of 64 ports in loads', () => { sink(terminatePorts(a, half, loads)); }, { iterations: 5, time: 0 });
  bench('joinPorts: port 63 of one 64-port to port 0 of another', () => { sink(joinPorts(a, 63, b, 0)); }, { iterations: 5, time: 0 });
});
