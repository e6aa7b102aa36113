/**
 * Public faces of the moment-method far field: the pattern of any port
 * excitation, and the receiving-array port description (open-circuit embedded
 * patterns + impedance matrix) that the reception module evaluates.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertCMatrix, assertFiniteArray, assertPositive, describeValue } from '../internal/validate.js';
import type { FarFieldResult } from '../element/farField.js';
import type { ArrayPortSource } from '../reception/ports.js';
import type { WireElementArray } from './array.js';
import { fillModelPatterns } from './farField.js';
import type { WireSolveOptions } from './model.js';
import { solutionInternals, solveWires, type WireSolution } from './solve.js';
import type { WireStructure } from './types.js';

function internalsOf(solution: WireSolution): NonNullable<ReturnType<typeof solutionInternals>> {
  const i = solution !== null && typeof solution === 'object' ? solutionInternals(solution) : undefined;
  if (!i) throw new DomainError(`invalid argument "solution": expected the result of solveWires, received ${describeValue(solution)}.`);
  return i;
}

/**
 * Far field f(r̂) [V] of a solved wire structure for given port currents.
 *
 * @remarks
 * The field radiated when the ports carry the RMS currents `portCurrentsA`
 * (into the ports; ports not driven are open, i.e. carry the given current 0)
 * is E(r) = f(r̂) e^{−jkr}/r, phase referred to the origin, time dependence
 * e^{+jωt}: f = −j(ηk/4π)[N − (N·r̂)r̂], N = ∫ J e^{jk r̂·r′} dl′, with the
 * radiation integral of each piecewise-sinusoidal half-mode in closed form
 * (C. A. Balanis, *Antenna Theory*, 4th ed., Wiley, 2016, §4.2 and §3.6,
 * from memory). With a ground plane the image currents are included and the
 * field is zero below the plane. Conventions: docs/conventions.md.
 * @param solution - Result of {@link solveWires}.
 * @param portCurrentsA - Port currents [A, RMS], P×1.
 * @param thetaRad - Polar angles [rad].
 * @param phiRad - Azimuths [rad], same length.
 * @returns θ̂ and φ̂ parts of f [V], each 1×M (one row, one column per direction: the element module's far-field shape).
 * @throws {@link DimensionError} for a current vector of the wrong size or unequal angle arrays.
 * @category Wire
 */
export function wireFarField(solution: WireSolution, portCurrentsA: CMatrix, thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>): FarFieldResult {
  const { model, openCoefficientsT } = internalsOf(solution);
  assertCMatrix('portCurrentsA', portCurrentsA);
  const np = solution.portNames.length, n = solution.unknowns;
  if (portCurrentsA.rows !== np || portCurrentsA.cols !== 1) {
    throw new DimensionError(`invalid argument "portCurrentsA": expected ${np}×1 (one current per port), received ${portCurrentsA.rows}×${portCurrentsA.cols}.`);
  }
  assertFiniteArray('thetaRad', thetaRad);
  assertFiniteArray('phiRad', phiRad);
  if (thetaRad.length !== phiRad.length) throw new DimensionError(`invalid arguments "thetaRad"/"phiRad": expected equal lengths, received ${thetaRad.length} and ${phiRad.length}.`);
  // basis coefficients c = Σ_p I_p · (column p of the open-circuit coefficients)
  const c = new Float64Array(2 * n), ic = portCurrentsA.data;
  for (let p = 0; p < np; p++) {
    const ir = ic[2 * p], ii = ic[2 * p + 1];
    if (ir === 0 && ii === 0) continue;
    for (let b = 0; b < n; b++) {
      const xr = openCoefficientsT[2 * (p * n + b)], xi = openCoefficientsT[2 * (p * n + b) + 1];
      c[2 * b] += xr * ir - xi * ii; c[2 * b + 1] += xr * ii + xi * ir;
    }
  }
  const m = thetaRad.length;
  const th = new Float64Array(2 * m), ph = new Float64Array(2 * m);
  const block = 2048;
  const bt = new Float64Array(2 * block), bp = new Float64Array(2 * block);
  for (let s = 0; s < m; s += block) {
    const cnt = Math.min(block, m - s);
    fillModelPatterns(model, c, 1, 1, thetaRad, phiRad, s, cnt, bt, bp, cnt);
    th.set(bt.subarray(0, 2 * cnt), 2 * s); ph.set(bp.subarray(0, 2 * cnt), 2 * s);
  }
  return { thetaComponentV: { rows: 1, cols: m, data: th }, phiComponentV: { rows: 1, cols: m, data: ph } };
}

/**
 * Options of {@link wireArrayPorts}.
 * @category Wire
 */
export interface WireArrayPortsOptions extends WireSolveOptions {
  /** RMS drive current the patterns are referred to [A]. @defaultValue 1 */
  driveCurrentA?: number;
}

/**
 * Result of {@link wireArrayPorts}: the reception module's port description plus the solution.
 * @category Wire
 */
export interface WireArrayPortSource extends ArrayPortSource {
  /** The moment-method solution the ports come from (currents, checks, timings). */
  readonly solution: WireSolution;
}

/**
 * Ports of a wire structure or array for the reception module: open-circuit
 * embedded patterns (filled block by block on demand) and the impedance
 * matrix, from one moment-method solution.
 *
 * @remarks
 * Same shape as the reception module's `dipoleArrayPorts`, so
 * `evaluateReceivingArray` takes moment-method elements exactly as it takes
 * analytic dipoles. Convention (docs/conventions.md, "embedded pattern"):
 * port n driven by the RMS current I₀, every other port open; the currents
 * induced on open neighbours are part of the pattern. Because Re Z is the
 * radiated power of the same filament currents (see docs/wire.md), the
 * brightness integral at a uniform temperature reproduces the Twiss result
 * 2k_B T B (Z + Zᴴ) to the sphere quadrature's accuracy.
 * @param structure - A wire structure or an element array ({@link placeWireElement}).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Solver options and the drive current.
 * @returns Pattern source, Z [Ω] and the full solution.
 * @throws As {@link solveWires}; {@link DomainError} for a bad drive current.
 * @example
 * ```ts
 * const dipole = { wires: [{ pointsM: [[-0.07, 0, 0], [0.07, 0, 0]], radiusM: 5e-4 }], ports: [{ wire: 0 }] };
 * const layout = rectangularGridLayout({ countX: 2, countY: 2, spacingXM: 0.15, spacingYM: 0.15 });
 * const ports = wireArrayPorts(placeWireElement(dipole, layout, { heightM: 0.075 }), 1e9, { groundPlane: { zM: 0 } });
 * ports.impedanceOhm.rows; // 4
 * ```
 * @category Wire
 */
export function wireArrayPorts(structure: WireStructure | WireElementArray, frequencyHz: number, options: WireArrayPortsOptions = {}): WireArrayPortSource {
  if (options === null || typeof options !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(options)}.`);
  const i0 = options.driveCurrentA ?? 1;
  assertPositive('options.driveCurrentA', i0, 'A');
  const solution = solveWires(structure, frequencyHz, options);
  const { model, openCoefficientsT } = internalsOf(solution);
  const np = solution.portNames.length;
  return {
    solution,
    impedanceOhm: solution.impedanceOhm,
    patterns: {
      portCount: np, driveCurrentA: i0, frequencyHz,
      fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
        fillModelPatterns(model, openCoefficientsT, np, i0, thetaRad, phiRad, start, count, outTheta, outPhi, ld);
      },
    },
  };
}
