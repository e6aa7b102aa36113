/**
 * Node-only helper of the plot module: writing a figure to disk. Not re-exported from the
 * browser-safe entries; import from `phasewise/node`.
 * @module
 */
import { writeFileSync } from 'node:fs';
import { DomainError } from '../errors.js';
import type { Figure } from './figure.js';

/**
 * Writes a figure (or SVG markup) to an `.svg` file in one call.
 * @param fig - A figure from `figure` of `phasewise/plot`, or SVG markup.
 * @param path - File path, ending in `.svg`.
 * @returns `path`.
 * @throws `DomainError` (from the main entry) if `path` does not end in `.svg` or `fig` holds no SVG; Node file-system errors.
 * @category Plots
 */
export function writeFigure(fig: Figure | string, path: string): string {
  const svg = typeof fig === 'string' ? fig : fig?.svg;
  if (typeof svg !== 'string' || !svg.trimStart().startsWith('<svg')) throw new DomainError('invalid argument "fig": expected a Figure or SVG markup starting with <svg.');
  if (typeof path !== 'string' || !/\.svg$/i.test(path)) throw new DomainError(`invalid argument "path": expected a file name ending in .svg, received ${String(path)}.`);
  writeFileSync(path, svg, 'utf8');
  return path;
}
