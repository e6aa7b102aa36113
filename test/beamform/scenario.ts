/** Shared seeded scenario pieces for the beamforming tests: a half-wave line along x. */
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { uniformLineLayout } from '../../src/geometry/builders.js';
import { unitVectorFromUv } from '../../src/geometry/directions.js';
import { steeringMatrix } from '../../src/pattern/steering.js';
import { wavelengthM, wavenumberRadPerM } from '../../src/units/convert.js';

export const FREQUENCY_HZ = 1.5e9;
export const LAMBDA_M = wavelengthM(FREQUENCY_HZ);
export const K_RAD_PER_M = wavenumberRadPerM(FREQUENCY_HZ);

/** N-element line along x with spacing d (metres), centred on the origin. */
export function line(n: number, spacingM = LAMBDA_M / 2) {
  return uniformLineLayout(n, spacingM, { axis: 'x' });
}

/** Steering matrix of the line for direction cosines u = r̂·x̂ (directions in the xz-plane, front hemisphere). */
export function lineSteering(n: number, u: ArrayLike<number>, spacingM = LAMBDA_M / 2): CMatrix {
  const dirs = new Float64Array(3 * u.length);
  for (let i = 0; i < u.length; i++) dirs.set(unitVectorFromUv(u[i], 0), 3 * i);
  return steeringMatrix(line(n, spacingM), dirs, FREQUENCY_HZ);
}

/** ∂a/∂u = j k xₙ aₙ for the same line (derivative of the steering vectors in direction cosine). */
export function lineSteeringDerivative(n: number, u: ArrayLike<number>, spacingM = LAMBDA_M / 2): CMatrix {
  const a = lineSteering(n, u, spacingM);
  const pos = line(n, spacingM).positionsM;
  const out = { rows: a.rows, cols: a.cols, data: new Float64Array(a.data.length) };
  for (let i = 0; i < a.rows; i++) {
    const kx = K_RAD_PER_M * pos[3 * i];
    for (let j = 0; j < a.cols; j++) {
      const p = 2 * (i * a.cols + j);
      out.data[p] = -kx * a.data[p + 1];
      out.data[p + 1] = kx * a.data[p];
    }
  }
  return out;
}

/** Evenly spaced grid from lo to hi inclusive. */
export function grid(lo: number, hi: number, count: number): Float64Array {
  return Float64Array.from({ length: count }, (_, i) => lo + ((hi - lo) * i) / (count - 1));
}
