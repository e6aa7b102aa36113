/**
 * From a validated design file to the library's inputs: layout (geometry
 * builders), ports (reception builders on analytic dipoles or imported
 * Touchstone + pattern files), environment, amplifiers, beams and weights.
 * @internal
 * @module
 */
import { dirname, resolve } from 'node:path';
import { NumericError } from '../../errors.js';
import type { CMatrix } from '../../linalg/cmatrix.js';
import { zeros } from '../../linalg/cmatrix.js';
import { adjoint, multiply } from '../../linalg/ops.js';
import { degToRad } from '../../units/convert.js';
import {
  arrayLayout, rectangularGridLayout, triangularLatticeLayout, uniformLineLayout, layoutCentroid,
  sphereQuadrature, sphereQuadratureForLayout, type ArrayLayout, type SphereQuadrature,
} from '../../geometry/index.js';
import { planarLattice, rectangularLattice, type PlanarLattice } from '../../floquet/lattice.js';
import { readTouchstoneFile } from '../../network/node.js';
import { interpolateMultiport } from '../../network/interpolate.js';
import { convertMultiport } from '../../network/convert.js';
import { multiportMatrix } from '../../network/multiport.js';
import { readPatternFile } from '../../element/node.js';
import type { WireDipole } from '../../element/types.js';
import {
  dipoleArrayPorts, patternSetPorts, samplePatterns, skyAndGroundEnvironment,
  type ArrayPortSource, type ReceivingArrayDescription, type SampledPortPatterns,
} from '../../reception/index.js';
import { conjugateFieldWeights } from '../../beamform/index.js';
import { circularTaylorTaper, cosineDistribution, sampleRadialDistribution, uniformTaper } from '../../taper/index.js';
import type { NoiseParametersInput } from '../../network/noise.js';
import { fieldError, type Design } from './schema.js';

/** The library inputs of a design. @internal */
export interface BuiltDesign {
  /** The validated design. */
  readonly design: Design;
  /** Element positions [m] (dipole feed points are raised by the ground-plane height). */
  readonly layout: ArrayLayout;
  /** The layout's lattice for the grating-lobe diagram, when it has one. */
  readonly lattice?: PlanarLattice;
  /** Ports: patterns and Z [Ω]. */
  readonly ports: ArrayPortSource;
  /** Everything evaluateReceivingArray needs. */
  readonly description: ReceivingArrayDescription;
  /** Signed scan angles in the scan plane [deg]. */
  readonly scanAngleDeg: Float64Array;
  /** Azimuth of the scan plane [rad]. */
  readonly planePhiRad: number;
  /** The sphere rule used for the noise integrals. */
  readonly quadrature: SphereQuadrature;
}

/** Direction of a signed angle s in the plane φ = φp: θ = |s|, φ = φp (s ≥ 0) or φp + π. @internal */
export function scanPlaneDirections(angleDeg: ArrayLike<number>, planePhiRad: number): { thetaRad: Float64Array; phiRad: Float64Array } {
  const n = angleDeg.length;
  const thetaRad = new Float64Array(n), phiRad = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    thetaRad[i] = degToRad(Math.abs(angleDeg[i]));
    phiRad[i] = angleDeg[i] < 0 ? planePhiRad + Math.PI : planePhiRad;
  }
  return { thetaRad, phiRad };
}

function scanAngles(b: Design['beams']): Float64Array {
  const t = b.thetaDeg;
  if (Array.isArray(t)) return Float64Array.from(t);
  const out = new Float64Array(t.count);
  for (let i = 0; i < t.count; i++) out[i] = t.count === 1 ? t.fromDeg : t.fromDeg + ((t.toDeg - t.fromDeg) * i) / (t.count - 1);
  return out;
}

function wrap<T>(file: string, field: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof NumericError) throw fieldError(file, field, e.message);
    throw e;
  }
}

function buildLayout(d: Design, file: string): { layout: ArrayLayout; lattice?: PlanarLattice; spacingM?: number } {
  const l = d.layout;
  return wrap(file, 'layout', () => {
    switch (l.kind) {
      case 'line':
        return { layout: uniformLineLayout(l.count, l.spacingM, { axis: l.axis ?? 'x' }), spacingM: l.spacingM };
      case 'rectangular':
        return {
          layout: rectangularGridLayout({ countX: l.countX, countY: l.countY, spacingXM: l.spacingXM, spacingYM: l.spacingYM }),
          lattice: rectangularLattice(l.spacingXM, l.spacingYM), spacingM: Math.min(l.spacingXM, l.spacingYM),
        };
      case 'triangular': {
        const b = l.boundary;
        const boundary = b.kind === 'circle'
          ? { kind: 'circle' as const, radiusM: b.radiusM }
          : { kind: 'hexagon' as const, circumradiusM: b.circumradiusM, rotationRad: degToRad(b.rotationDeg ?? 0) };
        const dy = (l.spacingM * Math.sqrt(3)) / 2;
        return {
          layout: triangularLatticeLayout(l.spacingM, boundary),
          lattice: planarLattice([l.spacingM, 0], [l.spacingM / 2, dy]), spacingM: l.spacingM,
        };
      }
      case 'positions':
        return { layout: arrayLayout(l.positionsM) };
    }
  });
}

function buildPorts(d: Design, layout: ArrayLayout, file: string): ArrayPortSource {
  const e = d.elements;
  if (e.kind === 'dipole') {
    const h = e.groundPlaneHeightM ?? 0;
    const dipoles: WireDipole[] = [];
    for (let i = 0; i < layout.count; i++) {
      const p = layout.positionsM;
      dipoles.push({ centerM: [p[3 * i], p[3 * i + 1], p[3 * i + 2] + h], axis: e.axis, lengthM: e.lengthM, radiusM: e.radiusM });
    }
    return wrap(file, 'elements', () => dipoleArrayPorts(dipoles, d.frequencyHz, e.groundPlaneHeightM === undefined ? {} : { groundPlane: { zM: 0 } }));
  }
  const base = dirname(resolve(file));
  const ts = wrap(file, 'elements.touchstoneFile', () => readTouchstoneFile(resolve(base, e.touchstoneFile)));
  const at = wrap(file, 'frequencyHz', () => interpolateMultiport(ts.network, [d.frequencyHz]));
  const z = multiportMatrix(convertMultiport(at, 'impedance'), 0);
  const set = wrap(file, 'elements.patternFile', () => readPatternFile(resolve(base, e.patternFile)));
  if (set.portCount !== ts.network.ports) {
    throw fieldError(file, 'elements.patternFile', `expected patterns of ${ts.network.ports} ports (the Touchstone file's port count), received ${set.portCount}`);
  }
  if (Math.abs(set.frequencyHz - d.frequencyHz) > 1e-3 * d.frequencyHz) {
    throw fieldError(file, 'frequencyHz', `expected the pattern file's frequency ${set.frequencyHz} Hz (within 0.1 %), received ${d.frequencyHz} Hz`);
  }
  if (layout.count !== set.portCount) {
    throw fieldError(file, 'layout', `expected ${set.portCount} elements (the imported port count), received a layout of ${layout.count}`);
  }
  return wrap(file, 'elements', () => patternSetPorts(set, z));
}

/** The principal-polarization response a = F_θ c_θ + F_φ c_φ of beam k (largest |a|²). */
function principalResponse(p: SampledPortPatterns, k: number): CMatrix {
  const n = p.thetaComponentV.rows, m = p.thetaComponentV.cols;
  const t = p.thetaComponentV.data, f = p.phiComponentV.data;
  let gtt = 0, gff = 0, gre = 0, gim = 0; // Gram matrix [gtt g; g* gff], g = F_θᴴ F_φ
  for (let i = 0; i < n; i++) {
    const o = 2 * (i * m + k);
    gtt += t[o] ** 2 + t[o + 1] ** 2;
    gff += f[o] ** 2 + f[o + 1] ** 2;
    gre += t[o] * f[o] + t[o + 1] * f[o + 1];
    gim += t[o] * f[o + 1] - t[o + 1] * f[o];
  }
  // Principal eigenvector of the 2×2 Hermitian Gram matrix.
  const half = (gtt - gff) / 2, gAbs = Math.hypot(gre, gim);
  const lam = (gtt + gff) / 2 + Math.hypot(half, gAbs);
  let cT: [number, number], cF: [number, number];
  if (gAbs < 1e-300) { cT = gtt >= gff ? [1, 0] : [0, 0]; cF = gtt >= gff ? [0, 0] : [1, 0]; } else {
    cT = [gre, gim]; cF = [lam - gtt, 0];
    const s = Math.hypot(gre, gim, lam - gtt);
    cT = [cT[0] / s, cT[1] / s]; cF = [cF[0] / s, 0];
  }
  const a = zeros(n, 1);
  for (let i = 0; i < n; i++) {
    const o = 2 * (i * m + k);
    a.data[2 * i] = t[o] * cT[0] - t[o + 1] * cT[1] + f[o] * cF[0] - f[o + 1] * cF[1];
    a.data[2 * i + 1] = t[o] * cT[1] + t[o + 1] * cT[0] + f[o] * cF[1] + f[o + 1] * cF[0];
  }
  return a;
}

function taperAmplitudes(d: Design, layout: ArrayLayout, spacingM: number | undefined, file: string): Float64Array {
  const t = d.beams.taper;
  if (t === undefined || t.kind === 'uniform') return uniformTaper(layout.count);
  const [cx, cy] = layoutCentroid(layout);
  let rMax = 0;
  for (let i = 0; i < layout.count; i++) rMax = Math.max(rMax, Math.hypot(layout.positionsM[3 * i] - cx, layout.positionsM[3 * i + 1] - cy));
  // Aperture rim half a spacing beyond the outermost element (common practice).
  const radiusM = rMax + (spacingM ?? Math.max(rMax * 0.1, 1e-9)) / 2;
  const opts = { centreXM: cx, centreYM: cy };
  return wrap(file, 'beams.taper', () => {
    if (t.kind === 'cosine') {
      const g = cosineDistribution(t.pedestal ?? 0);
      return sampleRadialDistribution((rho) => g(rho / 2), layout, radiusM, opts);
    }
    return circularTaylorTaper(layout, radiusM, t.sidelobeDb, t.nbar ?? 5, opts).weights;
  });
}

/** Open-circuit weights of the conjugate-field or taper beamformers, N×K. @internal */
export function fixedWeights(beamPatterns: SampledPortPatterns, amplitude: Float64Array): CMatrix {
  const n = beamPatterns.thetaComponentV.rows, kCount = beamPatterns.thetaRad.length;
  const w = zeros(n, kCount);
  for (let k = 0; k < kCount; k++) {
    const a = principalResponse(beamPatterns, k);
    for (let i = 0; i < n; i++) { a.data[2 * i] *= amplitude[i]; a.data[2 * i + 1] *= amplitude[i]; }
    const wk = conjugateFieldWeights(a);
    for (let i = 0; i < n; i++) { w.data[2 * (i * kCount + k)] = wk.data[2 * i]; w.data[2 * (i * kCount + k) + 1] = wk.data[2 * i + 1]; }
  }
  return w;
}

/**
 * Builds the library inputs of a validated design.
 * @param design - The design.
 * @param file - The design file's path (relative paths inside it are resolved from its folder).
 * @returns Layout, ports and the evaluation description.
 * @throws UsageError naming the design field the library rejected.
 * @internal
 */
export function buildDesign(design: Design, file: string): BuiltDesign {
  const d = design;
  const { layout, lattice, spacingM } = buildLayout(d, file);
  const ports = buildPorts(d, layout, file);
  const env = d.environment;
  const environment = wrap(file, 'environment', () => skyAndGroundEnvironment({
    skyK: env.skyK, groundK: env.groundK ?? 290, tiltRad: degToRad(env.tiltDeg ?? 0), tiltAzimuthRad: degToRad(env.tiltAzimuthDeg ?? 0),
  }));
  const quadrature = wrap(file, 'quadrature', () => d.quadrature
    ? sphereQuadrature(d.quadrature.thetaCount, d.quadrature.phiCount)
    : sphereQuadratureForLayout(layout, d.frequencyHz, { tolerance: 1e-6 }));
  const planePhiRad = degToRad(d.beams.planePhiDeg ?? 0);
  const scanAngleDeg = scanAngles(d.beams);
  const beams = scanPlaneDirections(scanAngleDeg, planePhiRad);
  let weights: CMatrix | undefined;
  const kind = d.beams.beamformer ?? 'max-snr';
  if (kind !== 'max-snr') {
    const amp = kind === 'taper' ? taperAmplitudes(d, layout, spacingM, file) : uniformTaper(layout.count);
    weights = wrap(file, 'beams', () => fixedWeights(samplePatterns(ports.patterns, beams.thetaRad, beams.phiRad), amp));
  }
  const a = d.amplifiers;
  const amplifiers: NoiseParametersInput | undefined = a && {
    minimumNoiseTemperatureK: a.minimumNoiseTemperatureK, noiseResistanceOhm: a.noiseResistanceOhm,
    optimumSourceAdmittanceS: a.optimumSourceAdmittanceS,
  };
  const description: ReceivingArrayDescription = {
    ports, quadrature, bandwidthHz: d.bandwidthHz, environment, amplifiers,
    physicalTemperatureK: env.physicalTemperatureK ?? 290,
    loss: d.elements.kind === 'dipole' ? 'lossless' : 'fromPatterns',
    beams, weights, physicalAreaM2: d.physicalAreaM2,
  };
  return { design: d, layout, lattice, ports, description, scanAngleDeg, planePhiRad, quadrature };
}

/** Beam power patterns |wᴴF_θ|² + |wᴴF_φ|² [V²] of the columns of `w` at the sampled directions, K×M. @internal */
export function beamPowerPatterns(w: CMatrix, p: SampledPortPatterns): Float64Array[] {
  const wh = adjoint(w);
  const t = multiply(wh, p.thetaComponentV), f = multiply(wh, p.phiComponentV);
  const m = p.thetaRad.length;
  const out: Float64Array[] = [];
  for (let k = 0; k < w.cols; k++) {
    const row = new Float64Array(m);
    for (let j = 0; j < m; j++) {
      const o = 2 * (k * m + j);
      row[j] = t.data[o] ** 2 + t.data[o + 1] ** 2 + f.data[o] ** 2 + f.data[o + 1] ** 2;
    }
    out.push(row);
  }
  return out;
}
