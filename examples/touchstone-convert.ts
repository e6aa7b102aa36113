/**
 * Example: read a version-1 Touchstone file of a two-port amplifier, look at it in impedance
 * and admittance form, renormalise it to 75 Ω, and write it back as version 2 with Z data.
 *
 * The file below is a demonstration of our own (a made-up low-noise amplifier), not a real part.
 * Run: npx tsx examples/touchstone-convert.ts
 */
import {
  parseTouchstone, formatTouchstone, convertMultiport, renormalizeMultiport, multiportMatrix, checkPassivity,
} from 'phasewise';

const text = `! demonstration two-port: a small-signal amplifier stage, 2.1–2.4 GHz
# GHz S MA R 50
2.1  0.42 -62   6.10 112   0.030 48   0.38 -41
2.25 0.40 -70   5.80 104   0.032 45   0.36 -47
2.4  0.39 -77   5.45  96   0.034 42   0.35 -53
! noise parameters: f, NFmin [dB], |Γopt|, ∠Γopt [deg], Rn/50
2.1  0.42 0.30 38  0.10
2.25 0.44 0.29 42  0.10
2.4  0.46 0.28 46  0.11
`;

const ts = parseTouchstone(text, { ports: 2 });
const net = ts.network;
console.log(`${net.ports}-port, ${net.frequencyHz.length} frequencies, parameter ${ts.parameter}, noise table: ${ts.noise ? 'yes' : 'no'}`);

const z = convertMultiport(net, 'impedance');
const y = convertMultiport(net, 'admittance');
const k = 1; // 2.25 GHz
const z0 = multiportMatrix(z, k), y0 = multiportMatrix(y, k);
const c = (m: typeof z0, i: number, j: number, unit: string) => {
  const o = 2 * (i * m.cols + j);
  return `${m.data[o].toPrecision(4)} ${m.data[o + 1] < 0 ? "−" : "+"} ${Math.abs(m.data[o + 1]).toPrecision(4)}j ${unit}`;
};
console.log(`at ${net.frequencyHz[k] / 1e9} GHz: Z11 = ${c(z0, 0, 0, 'Ω')}, Z21 = ${c(z0, 1, 0, 'Ω')}`);
console.log(`at ${net.frequencyHz[k] / 1e9} GHz: Y11 = ${c(y0, 0, 0, 'S')}`);

const s75 = renormalizeMultiport(net, 75);
const s = multiportMatrix(s75, k);
console.log(`S11 in 75 Ω: |S11| = ${Math.hypot(s.data[0], s.data[1]).toFixed(4)} (was 0.40 in 50 Ω)`);
const pass = checkPassivity(net);
console.log(`passive: ${pass.satisfied} (an amplifier has gain, so it is not)`);

const out = formatTouchstone(z, { version: 2, parameter: 'Z', format: 'RI', significantDigits: 6 });
console.log(out.split('\n').slice(0, 6).join('\n'));
