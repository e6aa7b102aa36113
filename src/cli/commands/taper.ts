/**
 * `phasewise taper`: weights and figures of a line-array taper.
 * @internal
 * @module
 */
import { binomialTaper, cosineSquaredTaper, cosineTaper, dolphChebyshevTaper, taylorTaper, uniformTaper, taperEfficiency, lineTaperFigures } from '../../taper/index.js';
import { linearArrayFigures } from '../../pattern/index.js';
import { fromParts } from '../../linalg/cmatrix.js';
import { C0_M_PER_S } from '../../units/constants.js';
import { radToDeg } from '../../units/convert.js';
import { UsageError } from '../errors.js';
import { num, table } from '../format.js';

/** Taper kinds offered on the command line. @internal */
export const TAPER_KINDS = ['uniform', 'binomial', 'cosine', 'cosine-squared', 'dolph-chebyshev', 'taylor'] as const;

/** Options of the taper calculator. @internal */
export interface TaperCommandOptions {
  kind: string;
  elements: number;
  sidelobeDb?: number;
  nbar?: number;
  pedestal?: number;
  spacingWavelengths: number;
}

/** Result of the taper calculator (also its JSON output). @internal */
export interface TaperCommandResult {
  kind: string;
  elements: number;
  spacingWavelengths: number;
  weights: number[];
  taperEfficiency: number;
  directivityLossDb: number;
  beamBroadening: number | null;
  achievedPeakSidelobeDb: number | null;
  halfPowerBeamwidthDeg: number | null;
  firstNullBeamwidthDeg: number | null;
  directivityDbi: number;
  warnings: string[];
}

/** Computes the taper and its figures. @internal */
export function runTaper(o: TaperCommandOptions): TaperCommandResult {
  const needLevel = o.kind === 'dolph-chebyshev' || o.kind === 'taylor';
  if (needLevel && o.sidelobeDb === undefined) throw new UsageError(`option "--sidelobe-db" is required for --kind ${o.kind} (e.g. --sidelobe-db 30).`);
  let w: Float64Array;
  const warnings: string[] = [];
  switch (o.kind) {
    case 'uniform': w = uniformTaper(o.elements); break;
    case 'binomial': w = binomialTaper(o.elements); break;
    case 'cosine': w = cosineTaper(o.elements, o.pedestal ?? 0); break;
    case 'cosine-squared': w = cosineSquaredTaper(o.elements, o.pedestal ?? 0); break;
    case 'dolph-chebyshev': w = dolphChebyshevTaper(o.elements, o.sidelobeDb as number); break;
    case 'taylor': {
      const r = taylorTaper(o.elements, o.sidelobeDb as number, o.nbar ?? 5);
      w = r.weights;
      for (const x of r.warnings) warnings.push(x.message);
      break;
    }
    default: throw new UsageError(`invalid option "--kind": expected one of ${TAPER_KINDS.join(', ')}, received "${o.kind}".`);
  }
  // Figures at λ = 1 m (frequency c0), so the spacing in wavelengths is the spacing in metres.
  const figs = linearArrayFigures(fromParts(w, null, w.length), o.spacingWavelengths, C0_M_PER_S);
  // Exact directivity loss and beam broadening against the uniform array at this spacing.
  const exact = lineTaperFigures(w, o.spacingWavelengths, C0_M_PER_S);
  return {
    kind: o.kind,
    elements: o.elements,
    spacingWavelengths: o.spacingWavelengths,
    weights: Array.from(w),
    taperEfficiency: taperEfficiency(w),
    directivityLossDb: exact.directivityLossDb,
    beamBroadening: exact.beamBroadening ?? null,
    achievedPeakSidelobeDb: figs.peakSidelobeDb ?? null,
    halfPowerBeamwidthDeg: figs.halfPowerWidth === undefined ? null : radToDeg(figs.halfPowerWidth),
    firstNullBeamwidthDeg: figs.firstNullWidth === undefined ? null : radToDeg(figs.firstNullWidth),
    directivityDbi: figs.directivityDb,
    warnings,
  };
}

/** Human-readable rendering. @internal */
export function formatTaper(r: TaperCommandResult): string {
  const rows = r.weights.map((v, i) => [String(i), num(v, 6)]);
  const figs = [
    ['taper efficiency', num(r.taperEfficiency, 5), ''],
    ['directivity loss vs uniform', num(r.directivityLossDb, 4), 'dB'],
    ['beam broadening vs uniform', r.beamBroadening === null ? 'n/a' : num(r.beamBroadening, 4), ''],
    ['peak sidelobe (achieved)', r.achievedPeakSidelobeDb === null ? 'none' : num(r.achievedPeakSidelobeDb, 4), 'dB'],
    ['half-power beamwidth', r.halfPowerBeamwidthDeg === null ? 'n/a' : num(r.halfPowerBeamwidthDeg, 4), 'deg'],
    ['first-null beamwidth', r.firstNullBeamwidthDeg === null ? 'n/a' : num(r.firstNullBeamwidthDeg, 4), 'deg'],
    ['directivity (isotropic elements)', num(r.directivityDbi, 4), 'dBi'],
  ];
  return [
    `${r.kind} taper, ${r.elements} elements, spacing ${r.spacingWavelengths} λ, broadside`,
    '',
    table(['element', 'weight'], rows),
    '',
    table(['figure', 'value', 'unit'], figs),
    ...r.warnings.map((w) => `warning: ${w}`),
  ].join('\n');
}
