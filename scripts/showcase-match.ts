/**
 * How the showcase designs choose their amplifiers' optimum source admittance: the broadside
 * active impedance of every element, Z_act,i = Σ_j Z_ij·a_j / a_i with the in-phase broadside
 * excitation a_j = 1 (Pozar, "Microwave Engineering", 4th ed., 2012, active impedance of a
 * coupled array; Warnick & Jensen, IEEE TAP 55(6), 2007: the receiver noise of a coupled array
 * is least when each amplifier sees its optimum source admittance through the array's active
 * impedance, from memory). Prints the spread over the elements, the mean admittance
 * Y = 1/Z_act (the value the designs use, rounded), and the broadside noise-matching and
 * aperture efficiencies with the design's own and with the matched Y_opt.
 *   npx tsx scripts/showcase-match.ts [design.json]   (default: the demo and the L-band feed)
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { designPortsAt, evaluateDesign, parseDesign, prepareDesign, validateDesign } from '../src/design/index.js';
import type { Design } from '../src/design/index.js';
import { demoDesign } from '../src/cli/commands/demo.js';

function report(name: string, design: Design): void {
  const prepared = prepareDesign(design);
  const f = prepared.frequenciesHz[0];
  const z = designPortsAt(prepared, f).impedanceOhm;
  const n = z.rows;
  let sumGre = 0, sumGim = 0, minG = Infinity, maxG = -Infinity, minB = Infinity, maxB = -Infinity;
  for (let i = 0; i < n; i++) {
    let re = 0, im = 0;
    for (let j = 0; j < n; j++) { re += z.data[2 * (i * n + j)]; im += z.data[2 * (i * n + j) + 1]; }
    const m = re * re + im * im, g = re / m, b = -im / m;
    sumGre += g; sumGim += b;
    minG = Math.min(minG, g); maxG = Math.max(maxG, g); minB = Math.min(minB, b); maxB = Math.max(maxB, b);
  }
  const y = { re: sumGre / n, im: sumGim / n };
  const zm = 1 / (y.re * y.re + y.im * y.im);
  console.log(`${name} at ${f / 1e9} GHz, ${n} elements`);
  console.log(`  broadside active admittance: G ${minG.toFixed(5)}…${maxG.toFixed(5)} S, B ${minB.toFixed(5)}…${maxB.toFixed(5)} S`);
  console.log(`  mean Y_act = ${y.re.toFixed(5)} ${y.im < 0 ? '−' : '+'} j${Math.abs(y.im).toFixed(5)} S  (Z = ${(y.re * zm).toFixed(1)} ${y.im > 0 ? '−' : '+'} j${Math.abs(y.im * zm).toFixed(1)} Ω)`);
  const rounded = { re: Number(y.re.toPrecision(2)), im: Number(y.im.toPrecision(2)) };
  for (const [label, yopt] of [['design Y_opt', undefined], ['matched Y_opt', rounded]] as const) {
    const amps = design.amplifiers as unknown as Record<string, unknown>;
    const d = yopt ? { ...design, amplifiers: { ...amps, optimumSourceAdmittanceS: yopt } } as Design : design;
    const ev = evaluateDesign(d);
    const beams = ev.frequencies[0].beams;
    const ang = ev.beams.scanAngleDeg ?? ev.beams.thetaDeg;
    const b0 = ang.findIndex((a) => Math.abs(a) < 1e-9);
    const fmt = (k: number) => `θ ${ang[k]}°: η_nm ${beams[k].noiseMatchingEfficiency?.toFixed(3)}, A_e/T_sys ${beams[k].sensitivityM2PerK.toFixed(4)} m²/K, η_ap ${beams[k].apertureEfficiency?.toFixed(3)}, T_rec ${beams[k].receiverTemperatureK.toFixed(1)} K`;
    const best = beams.reduce((a, b, k) => (b.sensitivityM2PerK > beams[a].sensitivityM2PerK ? k : a), 0);
    console.log(`  ${label} ${JSON.stringify(yopt ?? amps.optimumSourceAdmittanceS)}`);
    console.log(`    ${fmt(b0)}`);
    console.log(`    best ${fmt(best)}`);
    console.log(`    edge ${fmt(beams.length - 1)}`);
  }
}

const files = process.argv.slice(2);
if (files.length === 0) {
  report('demo', validateDesign(demoDesign(), 'demo-design.json'));
  report('l-band-feed', parseDesign(readFileSync('examples/designs/l-band-feed.json', 'utf8'), 'l-band-feed.json'));
} else {
  for (const file of files) report(basename(file), parseDesign(readFileSync(file, 'utf8'), basename(file)));
}
