/**
 * Shared design-file fixtures of the tests: an invented 1.4 GHz line of four half-wave dipoles
 * over ground, evaluated across a three-point band.
 */
/** Speed of light [m/s] (exact, SI). */
export const C0 = 299792458;
/** Centre frequency [Hz] and the line's dimensions [m]. */
export const F0 = 1.4e9, L0 = C0 / F0, D = 0.5 * L0, LEN = 0.47 * L0, A = L0 / 300, H = L0 / 4;

/** The four-dipole line design (plain data for validateDesign), with fields overridden by `extra`. */
export function fourDipoleLine(extra: Record<string, unknown> = {}): any {
  return {
    title: 'four dipoles over ground across a band',
    frequencyHz: [0.9 * F0, F0, 1.1 * F0],
    bandwidthHz: 1e6,
    layout: { kind: 'line', count: 4, spacingM: D },
    elements: { kind: 'dipole', lengthM: LEN, radiusM: A, axis: [0, 1, 0], groundPlaneHeightM: H },
    amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: { re: 0.02, im: 0 } },
    environment: { skyK: 8, groundK: 290, physicalTemperatureK: 290 },
    beams: { thetaDeg: [-30, 0, 30] },
    physicalAreaM2: 4 * D * D,
    quadrature: { thetaCount: 20, phiCount: 40 },
    ...extra,
  };
}
