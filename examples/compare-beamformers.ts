/**
 * Example: compare beamformers on a 4×4 ground-terminal array tracking a satellite at
 * θ = 25° while two terrestrial transmitters leak in near the horizon.
 *
 * Scenario of our own: 2.25 GHz, half-wave square grid, isotropic elements, unit white
 * noise per element, desired signal 0 dB per element, interferers 25 and 35 dB per element.
 * Beams: conjugate field (phase steering), phase steering with a separable 25 dB
 * Dolph–Chebyshev taper, maximum SNR (R_n⁻¹a), and projection onto the interferers' null space.
 * Run: npx tsx examples/compare-beamformers.ts
 */
import {
  rectangularGridLayout, unitVectorFromAngles, steeringVector, wavelengthM, add, multiply, adjoint, scale, identity,
  concatColumns, hadamard, fromParts, conjugateFieldWeights, maxSnrWeights, projectionWeights, beamSnr,
  interferenceRejection, whiteNoiseGain, dolphChebyshevTaper, separableTaper, powerToDb, degToRad,
} from 'phasewise';

const f = 2.25e9, d = wavelengthM(f) / 2;
const layout = rectangularGridLayout({ countX: 4, countY: 4, spacingXM: d, spacingYM: d });
const look = steeringVector(layout, unitVectorFromAngles(degToRad(25), degToRad(40)), f);
const i1 = steeringVector(layout, unitVectorFromAngles(degToRad(85), degToRad(200)), f);
const i2 = steeringVector(layout, unitVectorFromAngles(degToRad(80), degToRad(-30)), f);
const interferers = concatColumns([i1, i2]);
// R_n = I + 10^2.5 i1 i1ᴴ + 10^3.5 i2 i2ᴴ (noise plus interference, per-element powers).
const rn = add(identity(16), add(scale(multiply(i1, adjoint(i1)), 10 ** 2.5), scale(multiply(i2, adjoint(i2)), 10 ** 3.5)));

const cheb = dolphChebyshevTaper(4, 25);
const taper = separableTaper(cheb, cheb);
const beams = {
  'conjugate field': conjugateFieldWeights(look),
  'Chebyshev 25 dB taper': conjugateFieldWeights(hadamard(look, fromParts(taper, null, 16))),
  'maximum SNR': maxSnrWeights(look, rn),
  'projection': projectionWeights(look, interferers).weights,
};

console.log('beam                    SNR [dB]  rejection 1 [dB]  rejection 2 [dB]  white-noise gain');
for (const [name, w] of Object.entries(beams)) {
  const rej = interferenceRejection(w, look, interferers).rejectionDb;
  console.log(`${name.padEnd(22)}  ${powerToDb(beamSnr(w, look, rn)).toFixed(2).padStart(8)}  ${Math.min(rej[0], 300).toFixed(1).padStart(16)}  ${Math.min(rej[1], 300).toFixed(1).padStart(16)}  ${whiteNoiseGain(w, look).toFixed(3).padStart(16)}`);
}
// Maximum SNR is the Rayleigh-quotient optimum: no weight vector does better for this R_n.
// Rejections above 300 dB are exact nulls to rounding and are shown as 300.
