/**
 * `phasewise evaluate <design.json> --out <folder>`: evaluates a design file
 * and writes the report folder (report.html, figures.json, SVGs).
 * @internal
 * @module
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { SingleBar, Presets } from 'cli-progress';
import { evaluateReceivingArray, type ReceivingArrayEvaluation } from '../../reception/index.js';
import { UsageError } from '../errors.js';
import { NumericError } from '../../errors.js';
import { outputFolder } from '../output.js';
import { num } from '../format.js';
import { parseDesign, validateDesign, type Design } from '../design/schema.js';
import { buildDesign, type BuiltDesign } from '../design/build.js';
import { reportFigures, reportSvgs, type ReportFigures } from '../report/figures.js';
import { reportHtml } from '../report/html.js';

/** Options of a report run. @internal */
export interface ReportRunOptions {
  /** Show a progress bar on stderr (only honoured when stderr is a terminal). */
  progress?: boolean;
}

/** Result of a report run. @internal */
export interface ReportRun {
  /** Absolute path of the report folder. */
  folder: string;
  /** Files written, plain names. */
  files: string[];
  /** The figures (also figures.json). */
  figures: ReportFigures;
  /** The library inputs. */
  built: BuiltDesign;
  /** The library result. */
  evaluation: ReceivingArrayEvaluation;
}

function evaluateWithProgress(built: BuiltDesign, progress: boolean): ReceivingArrayEvaluation {
  const show = progress && process.stderr.isTTY === true;
  if (!show) return evaluateReceivingArray(built.description);
  const bar = new SingleBar({ stream: process.stderr, format: 'scan sweep [{bar}] {value}/{total} beams', hideCursor: true }, Presets.shades_classic);
  let started = false;
  try {
    return evaluateReceivingArray({
      ...built.description,
      onProgress: (stage, done, total) => {
        if (!started) { bar.start(total, 0); started = true; }
        if (stage === 'beams') bar.update(done);
      },
    });
  } finally {
    if (started) bar.stop();
  }
}

/**
 * Evaluates a validated design and writes the report.
 * @param design - Validated design.
 * @param designFile - Path of the design file (relative paths resolve from its folder; named in the report).
 * @param designText - Text of the design (copied into the report).
 * @param outDir - Report folder.
 * @internal
 */
export function writeReport(design: Design, designFile: string, designText: string, outDir: string, options: ReportRunOptions = {}): ReportRun {
  const built = buildDesign(design, designFile);
  let evaluation: ReceivingArrayEvaluation;
  try {
    evaluation = evaluateWithProgress(built, options.progress ?? true);
  } catch (e) {
    // The library names its own argument; say which design it was and keep the error family (exit 2).
    if (e instanceof NumericError) {
      const hint = design.elements.kind === 'imported' ? ' (field "elements.patternFile": the noise integrals need embedded patterns over the whole sphere, θ from 0 to 180°)' : '';
      throw new UsageError(`cannot evaluate design file "${designFile}": ${e.message}${hint}`);
    }
    throw e;
  }
  const figures = reportFigures(built, evaluation, basename(designFile));
  const svgs = reportSvgs(figures);
  const out = outputFolder(outDir);
  const files: string[] = [];
  for (const [name, svg] of svgs) { out.write(name, svg); files.push(name); }
  out.write('figures.json', JSON.stringify(figures, null, 1) + '\n');
  files.push('figures.json');
  out.write('report.html', reportHtml(figures, svgs, designText));
  files.push('report.html');
  return { folder: out.path, files, figures, built, evaluation };
}

/** Reads, validates and evaluates a design file. @internal */
export function runEvaluate(designFile: string, outDir: string, options: ReportRunOptions = {}): ReportRun {
  let text: string;
  try {
    text = readFileSync(designFile, 'utf8');
  } catch (e) {
    throw new UsageError(`cannot read the design file "${designFile}": ${(e as Error).message}`);
  }
  return writeReport(parseDesign(text, designFile), designFile, text, outDir, options);
}

/** Evaluates design data that is already parsed (the demo). @internal */
export function runDesignData(data: unknown, designFile: string, outDir: string, options: ReportRunOptions = {}): ReportRun {
  const design = validateDesign(data, basename(designFile));
  return writeReport(design, designFile, JSON.stringify(data, null, 2), outDir, options);
}

/** Console summary of a report run. @internal */
export function formatRun(r: ReportRun): string {
  const b = r.figures.beams;
  const best = b.reduce((p, q) => (q.sensitivityM2PerK > p.sensitivityM2PerK ? q : p));
  const worst = b.reduce((p, q) => (q.sensitivityM2PerK < p.sensitivityM2PerK ? q : p));
  return [
    `${r.figures.title}: ${r.figures.elementCount} elements, ${b.length} beams (${r.figures.beamformer})`,
    `  A_e/T_sys ${num(best.sensitivityM2PerK, 4)} m²/K at ${best.scanAngleDeg}° (T_sys ${num(best.systemTemperatureK, 4)} K), ` +
      `${num(worst.sensitivityM2PerK, 4)} m²/K at ${worst.scanAngleDeg}° (T_sys ${num(worst.systemTemperatureK, 4)} K)`,
    `  report written to ${r.folder}`,
    `  files: ${r.files.join(', ')}`,
  ].join('\n');
}
