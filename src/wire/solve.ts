/**
 * The thin-wire moment-method solution at one frequency: port impedance
 * matrix, currents on every segment for each port driven (the others open),
 * and the result checks.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { physicalCheck, type PhysicalCheck } from '../checks.js';
import { luFactor, luSolve, inverse } from '../linalg/lu.js';
import { multiply } from '../linalg/ops.js';
import { hermitianEigenKernel } from '../linalg/eigen.js';
import { createMultiport, type Multiport } from '../network/multiport.js';
import type { WireElementArray } from './array.js';
import { fillImpedanceMatrix, type FillStats } from './fill.js';
import { wireLoadImpedance } from './loads.js';
import { SEG } from './mesh.js';
import { buildModel, type PlacedModel, type WireSolveOptions } from './model.js';
import type { WireStructure } from './types.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * The segments of a solved structure, in solver order (element by element,
 * wire by wire, along each wire from its first point).
 * @category Wire
 */
export interface WireSegments {
  /** Number of segments S. */
  readonly count: number;
  /** Start point of each segment [m], xyz-interleaved, length 3S. */
  readonly startM: Float64Array;
  /** End point of each segment [m], length 3S. */
  readonly endM: Float64Array;
  /** Radius of each segment [m], length S. */
  readonly radiusM: Float64Array;
  /** Wire index (within the structure or element template) of each segment. */
  readonly wire: Int32Array;
  /** Element index of each segment (0 for a plain structure). */
  readonly element: Int32Array;
}

/**
 * Wall-clock time of the solver stages [ms].
 * @category Wire
 */
export interface WireTimings {
  /** Geometry, segmentation and validation [ms]. */
  readonly model: number;
  /** Impedance matrix fill [ms]. */
  readonly fill: number;
  /** LU factorisation and the solves for every port [ms]. */
  readonly solve: number;
}

/**
 * Placement-pair blocks of the moment matrix: how many were filled and how many the matrix holds.
 * @category Wire
 */
export interface WireBlockCounts {
  /** Blocks filled (distinct relative placements). */
  readonly computed: number;
  /** Blocks in the upper triangle of the matrix, P(P + 1)/2 for P placements. */
  readonly used: number;
}

/**
 * Result of {@link solveWires}.
 * @category Wire
 */
export interface WireSolution {
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
  /** Port names (element-major for arrays: "element:port", one-based). */
  readonly portNames: readonly string[];
  /** Port impedance matrix Z [Ω], P×P, V = Z I with currents into the ports (docs/conventions.md). */
  readonly impedanceOhm: CMatrix;
  /** The same matrix as a one-frequency network (impedance form, 50 Ω references). */
  readonly network: Multiport;
  /** Number of moment-method unknowns (basis functions). */
  readonly unknowns: number;
  /** Matrix blocks computed / used (reuse of identical placement pairs). */
  readonly blocks: WireBlockCounts;
  /** The segments. */
  readonly segments: WireSegments;
  /**
   * Current [A, RMS] at the start (row 2s) and end (row 2s+1) of segment s along its
   * direction, 2S×P: column p with port p driven by 1 A and every other port open. Between
   * its ends the current is I₀ sin(k(d−t))/sin(kd) + I₁ sin(kt)/sin(kd) (t from the start).
   */
  readonly segmentCurrentsA: CMatrix;
  /** Warnings about the model's validity (also reported as failed checks). */
  readonly warnings: readonly string[];
  /** Reciprocity, passivity and thin-wire validity checks (the shared check record). */
  readonly checks: readonly PhysicalCheck[];
  /** Stage times [ms]. */
  readonly timings: WireTimings;
}

/** @internal What the pattern functions need from a solution. */
export interface SolutionInternals {
  readonly model: PlacedModel;
  /** Basis coefficients for unit port currents, others open: transposed, P×B row-major. */
  readonly openCoefficientsT: Float64Array;
}

const internals = new WeakMap<WireSolution, SolutionInternals>();

/** @internal The solver state behind a solution. */
export function solutionInternals(s: WireSolution): SolutionInternals | undefined {
  return internals.get(s);
}

/**
 * Solves a thin-wire structure or array by the method of moments at one frequency.
 *
 * @remarks
 * Galerkin method with piecewise-sinusoidal basis and testing functions
 * (reaction form): J. H. Richmond, "Radiation and scattering by thin-wire
 * structures in the complex frequency domain", NASA CR-2396, 1974; E. H.
 * Newman and D. M. Pozar, "Electromagnetic modeling of composite wire and
 * surface geometries", IEEE Trans. Antennas Propag. 26(6), 1978 (both from
 * memory). Reduced thin-wire kernel for the reactive part, exact filament
 * kernel for the resistive part; formulation, validity and convergence in
 * docs/wire.md. Delta-gap ports: port p's basis function carries the gap
 * voltage, so one LU factorisation of the symmetric moment matrix Z_mm and
 * one solve with P right-hand sides give the short-circuit admittance
 * Y = Pᵀ Z_mm⁻¹ P; the port impedance matrix is Y⁻¹ and the open-circuit
 * currents X Y⁻¹. Loads add their impedance to their basis function's
 * diagonal entry. The ground plane is handled by images (Balanis, *Antenna
 * Theory*, 4th ed., 2016, §4.7, from memory). Conventions: docs/conventions.md
 * (e^{+jωt}, RMS, V = Z I).
 *
 * Checks returned as data (the shared `PhysicalCheck` record): reciprocity of
 * the port Z (relative max |Z − Zᵀ|, ≤ 1e-9), passivity (smallest eigenvalue
 * of Re Z relative to the largest, ≥ −1e-9), and the thin-wire limits
 * (segment length ≥ 4 radii; k·a ≤ 0.1).
 *
 * @param structure - A wire structure, or an element array from {@link placeWireElement}.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Segment length, ground plane.
 * @returns Port impedances, segment currents, checks and timings.
 * @throws {@link WireGeometryError} for invalid geometry (naming wire and segment);
 * {@link DomainError} for other invalid input; {@link SingularMatrixError} if the moment matrix is singular.
 * @example
 * ```ts
 * const f = 1e9, lambda = 299792458 / f;
 * const dipole = { wires: [{ pointsM: [[-0.235 * lambda, 0, 0], [0.235 * lambda, 0, 0]], radiusM: 0.002 * lambda, segments: 12 }], ports: [{ wire: 0 }] };
 * solveWires(dipole, f).impedanceOhm.data; // ≈ Float64Array [70.2, −5.0] (Ω, one port)
 * ```
 * @category Wire
 */
export function solveWires(structure: WireStructure | WireElementArray, frequencyHz: number, options: WireSolveOptions = {}): WireSolution {
  const t0 = performance.now();
  const m = buildModel(structure, frequencyHz, options);
  const t1 = performance.now();
  const stats: FillStats = { blocksComputed: 0, blocksUsed: 0 };
  const z = fillImpedanceMatrix(m, stats);
  const L = m.basis.count, P = m.placements, n = P * L;
  const element = 'element' in structure ? structure.element : structure;
  const loads = element.loads ?? [];
  loads.forEach((ld, i) => {
    const [zr, zi] = wireLoadImpedance(ld, frequencyHz, `loads[${i}]`);
    for (let p = 0; p < P; p++) {
      const b = p * L + m.basis.loadBasis[i];
      z.data[2 * (b * n + b)] += zr; z.data[2 * (b * n + b) + 1] += zi;
    }
  });
  const t2 = performance.now();
  const np = m.basis.portBasis.length, nPorts = P * np;
  const rhs = new Float64Array(2 * n * nPorts);
  for (let p = 0; p < P; p++) {
    for (let i = 0; i < np; i++) {
      const b = p * L + m.basis.portBasis[i], c = p * np + i;
      rhs[2 * (b * nPorts + c)] = m.basis.portSign[i];
    }
  }
  const x = luSolve(luFactor(z), { rows: n, cols: nPorts, data: rhs });
  // short-circuit admittance Y = Pᵀ X
  const y = new Float64Array(2 * nPorts * nPorts);
  for (let p = 0; p < P; p++) {
    for (let i = 0; i < np; i++) {
      const b = p * L + m.basis.portBasis[i], r = p * np + i, sg = m.basis.portSign[i];
      for (let c = 0; c < nPorts; c++) {
        y[2 * (r * nPorts + c)] = sg * x.data[2 * (b * nPorts + c)];
        y[2 * (r * nPorts + c) + 1] = sg * x.data[2 * (b * nPorts + c) + 1];
      }
    }
  }
  const zPort = inverse({ rows: nPorts, cols: nPorts, data: y });
  const open = multiply(x, zPort); // n × nPorts
  const t3 = performance.now();
  const coeffT = new Float64Array(2 * n * nPorts);
  for (let b = 0; b < n; b++) {
    for (let c = 0; c < nPorts; c++) {
      coeffT[2 * (c * n + b)] = open.data[2 * (b * nPorts + c)];
      coeffT[2 * (c * n + b) + 1] = open.data[2 * (b * nPorts + c) + 1];
    }
  }
  const sol: WireSolution = {
    frequencyHz,
    portNames: m.portNames,
    impedanceOhm: zPort,
    network: createMultiport('impedance', [frequencyHz], [zPort], { portNames: m.portNames }),
    unknowns: n,
    blocks: { computed: stats.blocksComputed, used: stats.blocksUsed },
    segments: segmentsOf(m),
    segmentCurrentsA: segmentCurrents(m, open, nPorts),
    warnings: m.warnings.slice(),
    checks: checksOf(m, zPort),
    timings: { model: t1 - t0, fill: t2 - t1, solve: t3 - t2 },
  };
  internals.set(sol, { model: m, openCoefficientsT: coeffT });
  return sol;
}

function segmentsOf(m: PlacedModel): WireSegments {
  const S = m.template.segmentCount, total = S * m.placements, g = m.geo;
  const startM = new Float64Array(3 * total), endM = new Float64Array(3 * total), radiusM = new Float64Array(total);
  const wire = new Int32Array(total), element = new Int32Array(total);
  for (let s = 0; s < total; s++) {
    const o = s * SEG;
    for (let c = 0; c < 3; c++) { startM[3 * s + c] = g[o + c]; endM[3 * s + c] = g[o + c] + g[o + 6] * g[o + 3 + c]; }
    radiusM[s] = g[o + 7];
    wire[s] = m.template.segmentWire[s % S];
    element[s] = Math.floor(s / S);
  }
  return { count: total, startM, endM, radiusM, wire, element };
}

/** Segment end currents from basis coefficients (n × cols). */
function segmentCurrents(m: PlacedModel, coeff: CMatrix, cols: number): CMatrix {
  const S = m.template.segmentCount, L = m.basis.count, P = m.placements;
  const { halfStart, halfBasis, halfSign } = m.basis;
  const out = new Float64Array(2 * 2 * S * P * cols);
  for (let p = 0; p < P; p++) {
    for (let s = 0; s < S; s++) {
      for (let h = 0; h < 2; h++) {
        // rising half-mode ends at the segment end (row 2s+1); falling starts at the start (row 2s)
        const row = 2 * (p * S + s) + (h === 0 ? 1 : 0);
        for (let e = halfStart[2 * s + h]; e < halfStart[2 * s + h + 1]; e++) {
          const b = p * L + halfBasis[e], sg = halfSign[e];
          for (let c = 0; c < cols; c++) {
            out[2 * (row * cols + c)] += sg * coeff.data[2 * (b * cols + c)];
            out[2 * (row * cols + c) + 1] += sg * coeff.data[2 * (b * cols + c) + 1];
          }
        }
      }
    }
  }
  return matrixView(2 * S * P, cols, out);
}

function checksOf(m: PlacedModel, z: CMatrix): PhysicalCheck[] {
  const n = z.rows, d = z.data;
  let big = 0, asym = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const p = 2 * (i * n + j), q = 2 * (j * n + i);
    big = Math.max(big, Math.hypot(d[p], d[p + 1]));
    asym = Math.max(asym, Math.hypot(d[p] - d[q], d[p + 1] - d[q + 1]));
  }
  const ev = hermitianEigenKernel(z, true).values;
  const top = Math.max(Math.abs(ev[0]), Math.abs(ev[n - 1]));
  const minRel = top === 0 ? 0 : ev[0] / top;
  const lambda = (2 * Math.PI) / m.k;
  return [
    physicalCheck('wire.reciprocity', big === 0 ? 0 : asym / big, 'atMost', 1e-9,
      'max |Z − Zᵀ| / max |Z| of the port impedance matrix (dimensionless); a failure means the moment matrix or its solve is wrong', ['impedanceOhm']),
    physicalCheck('wire.passivity', minRel, 'atLeast', -1e-9,
      'smallest eigenvalue of Re Z over the largest |eigenvalue| (dimensionless); negative means the structure would generate power', ['impedanceOhm']),
    physicalCheck('elementModel.segmentLengthToRadius', m.minLengthToRadius, 'atLeast', 4,
      'shortest segment over its wire radius (dimensionless); below 4 the reduced thin-wire kernel loses accuracy', ['impedanceOhm', 'patterns']),
    physicalCheck('elementModel.wireRadius', m.k * m.maxRadiusM, 'atMost', 0.1,
      `k·a of the thickest wire (a = ${m.maxRadiusM} m, λ = ${lambda.toPrecision(4)} m, dimensionless); above 0.1 circumferential currents matter`, ['impedanceOhm', 'patterns']),
  ];
}
