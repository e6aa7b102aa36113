/**
 * `phasewise spacing`: the largest grating-lobe-free element spacing for a scan cone.
 * @internal
 * @module
 */
import { spacingForScanCone } from '../../geometry/gratingLobes.js';
import { degToRad } from '../../units/convert.js';
import { wavelengthM } from '../../units/convert.js';
import { num, table } from '../format.js';

/** Result of the spacing calculator. @internal */
export interface SpacingCommandResult {
  scanConeDeg: number;
  frequencyHz: number;
  wavelengthM: number;
  squareSpacingM: number;
  triangularSideM: number;
  squareSpacingWavelengths: number;
  triangularSideWavelengths: number;
  triangularElementSaving: number;
}

/** Computes the spacings. @internal */
export function runSpacing(scanConeDeg: number, frequencyHz: number): SpacingCommandResult {
  const r = spacingForScanCone(degToRad(scanConeDeg), frequencyHz);
  const lam = wavelengthM(frequencyHz);
  return {
    scanConeDeg,
    frequencyHz,
    wavelengthM: lam,
    squareSpacingM: r.squareSpacingM,
    triangularSideM: r.triangularSideM,
    squareSpacingWavelengths: r.squareSpacingM / lam,
    triangularSideWavelengths: r.triangularSideM / lam,
    triangularElementSaving: r.elementSaving,
  };
}

/** Human-readable rendering. @internal */
export function formatSpacing(r: SpacingCommandResult): string {
  return [
    `grating-lobe-free spacing for a ±${r.scanConeDeg}° scan cone at ${num(r.frequencyHz / 1e9, 6)} GHz (λ = ${num(r.wavelengthM * 1000, 5)} mm)`,
    '',
    table(['lattice', 'spacing [mm]', 'spacing [λ]'], [
      ['square', num(r.squareSpacingM * 1000, 5), num(r.squareSpacingWavelengths, 5)],
      ['equilateral triangular (side)', num(r.triangularSideM * 1000, 5), num(r.triangularSideWavelengths, 5)],
    ]),
    '',
    `the triangular lattice needs ${num(100 * r.triangularElementSaving, 3)} % fewer elements for the same aperture`,
  ].join('\n');
}
