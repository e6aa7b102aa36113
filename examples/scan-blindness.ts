/**
 * Example: find the scan blindness of an infinite array of printed dipoles on a grounded
 * dielectric slab, and compare it with the angle where a Floquet mode phase-matches the
 * slab's surface wave.
 *
 * Scenario of our own: an X-band tile of printed dipoles (0.39 λ long, 0.02 λ wide) on a
 * 0.19 λ slab of relative permittivity 2.55, square lattice of 0.5 λ, scanned in the E-plane.
 * Run: npx tsx examples/scan-blindness.ts
 */
import { rectangularLattice, infiniteDipoleArray, findScanBlindness, groundedSlabSurfaceWaves, wavelengthM, radToDeg, degToRad } from 'phasewise';

const frequencyHz = 10e9;
const lambda = wavelengthM(frequencyHz);
const slab = { kind: 'groundedSlab' as const, relativePermittivity: 2.55, thicknessM: 0.19 * lambda };

const array = infiniteDipoleArray({
  lattice: rectangularLattice(0.5 * lambda, 0.5 * lambda),
  element: { lengthM: 0.39 * lambda, widthM: 0.02 * lambda },
  backing: slab,
  frequencyHz,
  relativeTolerance: 1e-4,
});

// The slab's own surface waves (independent solve of the dispersion equations).
for (const sw of groundedSlabSurfaceWaves(slab.relativePermittivity, slab.thicknessM, frequencyHz)) {
  console.log(`surface wave ${sw.name}: β/k0 = ${(sw.betaRadPerM / (2 * Math.PI / lambda)).toFixed(4)}`);
}

// E-plane (φ = 0, along the dipoles) scan from broadside to 80°, matched at broadside.
const r = findScanBlindness(array, 0, { stepRad: degToRad(1), thetaMaxRad: degToRad(80), threshold: 0.9 });
for (const b of r.blindAngles) {
  console.log(`blind angle: θ = ${radToDeg(b.thetaRad).toFixed(2)}°, |Γ_a| = ${b.reflectionMagnitude.toFixed(4)}, embedded gain = ${b.embeddedGain.toExponential(2)}`);
}
for (const p of r.predictions) {
  console.log(`phase-matching prediction: θ = ${radToDeg(p.thetaRad).toFixed(2)}° (Floquet mode (${p.m}, ${p.n}) on ${p.surfaceWave})`);
}
if (r.blindAngles.length === 0) console.log('no blindness above |Γ_a| = 0.9 up to 80°');
