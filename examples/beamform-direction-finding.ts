/**
 * Example: beams and direction finding on a 10-element half-wave line at 1.5 GHz.
 * Part 1 compares beamformers against a 30 dB interferer; part 2 simulates 200 seeded
 * snapshots of two sources, counts them (MDL) and locates them (MUSIC, Capon, root-MUSIC)
 * beside the Cramér–Rao bound. Scenario of our own invention; the numbers appear in docs/beamform.md.
 * Run: npx tsx examples/beamform-direction-finding.ts
 */
import {
  uniformLineLayout, unitVectorFromUv, steeringVector, steeringMatrix, wavelengthM, wavenumberRadPerM,
  add, multiply, adjoint, scale, identity,
  conjugateFieldWeights, maxSnrWeights, minimumVarianceWeights, projectionWeights,
  beamSnr, interferenceRejection, whiteNoiseGain,
  simulateSnapshots, sampleCorrelation, estimateSourceCount, musicSpectrum, caponSpectrum, findSpectrumPeaks, rootMusic,
  deterministicCramerRaoBound,
} from 'phasewise';

const frequencyHz = 1.5e9;
const spacingM = wavelengthM(frequencyHz) / 2;
const layout = uniformLineLayout(10, spacingM, { axis: 'x' });

// Part 1: desired signal at u = 0.342 (0 dB per element), interferer at u = −0.5 (30 dB), unit white noise.
const a = steeringVector(layout, unitVectorFromUv(0.342, 0), frequencyHz);
const b = steeringVector(layout, unitVectorFromUv(-0.5, 0), frequencyHz);
const noise = add(identity(10), scale(multiply(b, adjoint(b)), 1000));
const total = add(noise, multiply(a, adjoint(a)));
const beams = {
  'conjugate field': conjugateFieldWeights(a),
  'maximum SNR': maxSnrWeights(a, noise),
  'MVDR (R = Rs + Rn)': minimumVarianceWeights(a, total),
  'projection': projectionWeights(a, b).weights,
};
for (const [name, w] of Object.entries(beams)) {
  const snrDb = 10 * Math.log10(beamSnr(w, a, noise));
  const rej = interferenceRejection(w, a, b).rejectionDb[0];
  console.log(`${name.padEnd(20)} SNR ${snrDb.toFixed(3)} dB, rejection ${rej.toFixed(2)} dB, WNG ${whiteNoiseGain(w, a).toFixed(3)}`);
}

// Part 2: two unit sources at u = −0.35 and 0.1, noise power 0.1, 200 snapshots, seed 2024.
const uTrue = [-0.35, 0.1];
const dirs = new Float64Array([...unitVectorFromUv(uTrue[0], 0), ...unitVectorFromUv(uTrue[1], 0)]);
const sources = steeringMatrix(layout, dirs, frequencyHz);
const { snapshots } = simulateSnapshots({ steering: sources, sourcePowers: [1, 1], noisePower: 0.1, snapshotCount: 200, seed: 2024 });
const r = sampleCorrelation(snapshots);
const count = estimateSourceCount(r, 200);
console.log(`MDL: ${count.count} sources; eigenvalues ${Array.from(count.eigenvalues, (x) => x.toFixed(3)).join(' ')}`);

const u = Float64Array.from({ length: 1001 }, (_, i) => -1 + 0.002 * i);
const scanDirs = new Float64Array(3 * u.length);
u.forEach((x, i) => scanDirs.set(unitVectorFromUv(x, 0), 3 * i));
const scan = steeringMatrix(layout, scanDirs, frequencyHz);
const peaks = (p: Float64Array) => findSpectrumPeaks(p, u, { maxPeaks: count.count, refineOn: 'reciprocal' })
  .map((q) => q.position).sort((x, y) => x - y).map((x) => x.toFixed(5)).join(', ');
console.log(`MUSIC peaks u = ${peaks(musicSpectrum(r, scan, count.count))}`);
console.log(`Capon peaks u = ${peaks(caponSpectrum(r, scan))}`);
console.log(`root-MUSIC u = ${Array.from(rootMusic(r, count.count, { spacingM, frequencyHz }).directionCosines, (x) => x.toFixed(5)).join(', ')}`);

// CRB in u: ∂aₙ/∂u = j k xₙ aₙ for a line along x.
const k = wavenumberRadPerM(frequencyHz);
const d = { rows: 10, cols: 2, data: new Float64Array(40) };
for (let i = 0; i < 10; i++) for (let j = 0; j < 2; j++) {
  const p = 2 * (i * 2 + j), kx = k * layout.positionsM[3 * i];
  d.data[p] = -kx * sources.data[p + 1];
  d.data[p + 1] = kx * sources.data[p];
}
const crb = deterministicCramerRaoBound(sources, d, [1, 1], 0.1, 200);
console.log(`CRB standard deviation in u: ${Array.from(crb.standardDeviation, (x) => x.toExponential(2)).join(', ')}`);
