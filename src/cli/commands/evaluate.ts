/**
 * `phasewise evaluate <design.json> --out <folder>` and `phasewise merge`:
 * evaluates a design file across its band (on a worker pool, or one shard of
 * the band) and writes the report folder (report.html, figures.json, SVGs).
 * All physics is in the library's design module; this file reads, schedules
 * and writes.
 * @internal
 * @module
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { totalmem } from 'node:os';
import { basename, resolve } from 'node:path';
import { SingleBar, Presets } from 'cli-progress';
import {
  assembleDesignEvaluation, estimateDesignCost, frequencyBlock, parseDesign, prepareDesign, validateDesign,
  type Design, type DesignEvaluation, type FailedCheck, type FrequencyEvaluation,
} from '../../design/index.js';
import { CapacityError, ParseError } from '../../errors.js';
import { parseJsonText } from '../../internal/json.js';
import { UsageError } from '../errors.js';
import { outputFolder } from '../output.js';
import { num } from '../format.js';
import { designReader } from '../files.js';
import { defaultWorkers, evaluateFrequencies } from '../parallel.js';
import { reportFigureList } from '../report/figures.js';
import { reportHtml } from '../report/html.js';
import { VERSION } from '../../version.js';

/** Options of a report run. @internal */
export interface ReportRunOptions {
  /** Show a progress bar on stderr (only honoured when stderr is a terminal). */
  progress?: boolean;
  /** Worker threads for the frequency blocks. @defaultValue every core */
  workers?: number;
  /** Evaluate only shard `index` (1-based) of `count` and write a partial result. */
  shard?: { index: number; count: number };
  /** Print the estimate only. */
  dryRun?: boolean;
  /** Where notes for the user go (the estimate before a long job). */
  log?: (s: string) => void;
}

/** Fraction of the machine's memory a run may plan to use. */
const MEMORY_SHARE = 0.8;
/** Jobs estimated longer than this [s] print their estimate first. */
const ANNOUNCE_S = 10;

/** Result of a report run. @internal */
export interface ReportRun {
  /** Absolute path of the report folder. */
  folder: string;
  /** Files written, plain names. */
  files: string[];
  /** The band result (absent for a shard). */
  evaluation?: DesignEvaluation;
  /** The shard written, if any. */
  shard?: { index: number; count: number; frequencies: number };
  /** Failed physical checks of what was evaluated, with their frequencies. */
  failedChecks: FailedCheck[];
  /** The estimate (always computed; the whole output of --dry-run). */
  estimate: string;
  /** True for --dry-run: nothing was evaluated or written. */
  dryRun?: boolean;
}

/** The partial result of one shard (part-<i>-of-<n>.json). @internal */
export interface ShardPart {
  format: 'phasewise-shard';
  version: string;
  designHash: string;
  designFile: string;
  designText: string;
  shard: { index: number; count: number };
  frequencyIndices: number[];
  frequencies: FrequencyEvaluation[];
}

/** Parses `i/n` of --shard (1 ≤ i ≤ n). @internal */
export function parseShard(text: string): { index: number; count: number } {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const i = m ? Number(m[1]) : NaN, n = m ? Number(m[2]) : NaN;
  if (!m || !(n >= 1) || !(i >= 1) || i > n) {
    throw new UsageError(`option "--shard": expected i/n with 1 ≤ i ≤ n (shard i of n, counted from 1), received "${text}".`);
  }
  return { index: i, count: n };
}

function hashDesign(design: Design): string {
  return createHash('sha256').update(JSON.stringify(design)).digest('hex').slice(0, 16);
}

async function withProgress<T>(show: boolean, total: number, run: (tick: (done: number) => void) => Promise<T>): Promise<T> {
  if (!show || process.stderr.isTTY !== true || total <= 1) return run(() => undefined);
  const bar = new SingleBar({ stream: process.stderr, format: 'band [{bar}] {value}/{total} frequencies', hideCursor: true }, Presets.shades_classic);
  bar.start(total, 0);
  try {
    return await run((d) => bar.update(d));
  } finally {
    bar.stop();
  }
}

/** Writes the report of a band result. @internal */
function writeReport(ev: DesignEvaluation, designText: string, out: ReturnType<typeof outputFolder>): string[] {
  const figures = reportFigureList(ev);
  const files: [string, string][] = figures.map((f) => [f.file, f.svg]);
  files.push(['figures.json', JSON.stringify({ format: 'phasewise-report', version: VERSION, ...ev }, null, 1) + '\n']);
  files.push(['report.html', reportHtml(ev, figures, designText)]);
  return out.writeAll(files);
}

/**
 * Evaluates a validated design (or one shard of its band) and writes the report.
 * @internal
 */
export async function runDesign(design: Design, designFile: string, designText: string, outDir: string, options: ReportRunOptions = {}): Promise<ReportRun> {
  const fileName = basename(designFile);
  const prepared = prepareDesign(design, { fileName, readFile: designReader(designFile) });
  const count = prepared.frequenciesHz.length;
  const shard = options.shard;
  if (shard && shard.count > count) {
    throw new UsageError(`option "--shard": ${shard.count} shards for a band of ${count} frequencies; use at most ${count} shards.`);
  }
  const indices = shard ? frequencyBlock(count, shard.count, shard.index - 1) : Array.from({ length: count }, (_, i) => i);
  // Estimate first: refuse what cannot fit, announce what takes long, use fewer workers when memory asks for it.
  const cost = estimateDesignCost(prepared, indices);
  const memory = MEMORY_SHARE * totalmem();
  const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;
  const what = `a design of ${plural(prepared.layout.count, 'element')}, ${plural(prepared.beams.thetaRad.length, 'beam')} and ${plural(indices.length, 'frequency').replace(/frequencys$/, 'frequencies')}`;
  if (cost.peakBytes > memory) {
    throw new CapacityError(`${what} needs about ${gb(cost.peakBytes)} of memory per frequency and ${seconds(cost.totalS)} on one core (estimate), beyond the ${gb(memory)} this machine can give; reduce the number of elements.`, cost.peakBytes, memory);
  }
  let workers = Math.min(options.workers ?? defaultWorkers(), indices.length);
  const fitting = Math.max(1, Math.floor(memory / Math.max(cost.peakBytes, 1)));
  const note = workers > fitting ? ` (${workers} workers would need ${gb(workers * cost.peakBytes)}; using ${fitting})` : '';
  workers = Math.min(workers, fitting);
  const estimate = `estimate for ${what}: about ${seconds(cost.totalS)} on one core, ${seconds(cost.totalS / workers)} on ${workers} worker${workers > 1 ? 's' : ''}${note}; peak memory about ${gb(cost.peakBytes * workers)} (model constants from the development machine, ±50 %)`;
  if (options.dryRun) return { folder: '', files: [], failedChecks: [], estimate, dryRun: true };
  if (cost.totalS / workers > ANNOUNCE_S) options.log?.(`phasewise: ${estimate}\n`);
  const out = outputFolder(outDir);
  const task = { designData: design, designFile: resolve(designFile), fileName };
  const results = await withProgress(options.progress ?? true, indices.length, (tick) => evaluateFrequencies(task, indices, workers, tick));
  if (shard) {
    const part: ShardPart = {
      format: 'phasewise-shard', version: VERSION, designHash: hashDesign(design), designFile: resolve(designFile), designText,
      shard, frequencyIndices: indices, frequencies: results,
    };
    const name = `part-${shard.index}-of-${shard.count}.json`;
    out.writeAll([[name, JSON.stringify(part) + '\n']]);
    const failedChecks = results.flatMap((r) => r.checks.filter((c) => !c.passed).map((c) => ({ ...c, frequencyHz: r.frequencyHz })));
    return { folder: out.path, files: [name], shard: { ...shard, frequencies: indices.length }, failedChecks, estimate };
  }
  const ev = assembleDesignEvaluation(prepared, results);
  return { folder: out.path, files: writeReport(ev, designText, out), evaluation: ev, failedChecks: ev.failedChecks, estimate };
}

function gb(bytes: number): string {
  return bytes >= 1e9 ? `${(bytes / 1e9).toPrecision(3)} GB` : `${Math.max(1, Math.round(bytes / 1e6))} MB`;
}

function seconds(s: number): string {
  return s >= 120 ? `${(s / 60).toPrecision(3)} min` : `${s.toPrecision(2)} s`;
}

/**
 * One line naming the failed checks of a run (at most three, with their frequencies), or
 * undefined when every check passed.
 * @internal
 */
export function failedChecksText(r: ReportRun): string | undefined {
  const f = r.failedChecks;
  if (f.length === 0) return undefined;
  const names = [...new Set(f.map((c) => c.name))];
  const first = f.slice(0, 3).map((c) => `${c.name} = ${num(c.value, 4)} (limit ${c.comparison === 'atMost' ? '≤' : '≥'} ${num(c.limit, 4)}) at ${num(c.frequencyHz / 1e9, 6)} GHz`);
  return `${f.length} physical check${f.length > 1 ? 's' : ''} failed (${names.join(', ')}): ${first.join('; ')}${f.length > 3 ? '; …' : ''}`;
}

function readText(file: string, what: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    throw new UsageError(`cannot read the ${what} "${file}": ${(e as Error).message}`);
  }
}

/** Reads, validates and evaluates a design file. @internal */
export async function runEvaluate(designFile: string, outDir: string, options: ReportRunOptions = {}): Promise<ReportRun> {
  const text = readText(designFile, 'design file');
  return runDesign(parseDesign(text, basename(designFile)), designFile, text, outDir, options);
}

/** Evaluates design data that is already parsed (the demo). @internal */
export async function runDesignData(data: unknown, designFile: string, outDir: string, options: ReportRunOptions = {}): Promise<ReportRun> {
  const design = validateDesign(data, basename(designFile));
  return runDesign(design, designFile, JSON.stringify(data, null, 2), outDir, options);
}

/**
 * Merges shard parts into the report one run would write (identical figures.json).
 * @throws UsageError for unreadable parts, parts of different designs or shard counts,
 *   and missing or repeated shards.
 * @internal
 */
export async function runMerge(partFiles: readonly string[], outDir: string): Promise<ReportRun> {
  if (partFiles.length === 0) throw new UsageError('merge: expected one or more part files (part-<i>-of-<n>.json).');
  const parts = partFiles.map((f) => {
    const text = readText(f, 'part file');
    let p: ShardPart;
    try {
      p = parseJsonText(text, 'the part file') as ShardPart;
    } catch (e) {
      throw e instanceof ParseError ? new UsageError(e.inFile(f).message) : e;
    }
    if (p === null || typeof p !== 'object' || p.format !== 'phasewise-shard') throw new UsageError(`part file "${f}": expected a shard part written by "phasewise evaluate --shard i/n", received something else.`);
    return { file: f, part: p };
  });
  const first = parts[0];
  for (const { file, part } of parts) {
    if (part.designHash !== first.part.designHash) {
      throw new UsageError(`part file "${file}" comes from a different design than "${first.file}" (design ${part.designHash} vs ${first.part.designHash}); merge parts of one design only.`);
    }
    if (part.shard.count !== first.part.shard.count) throw new UsageError(`part file "${file}" is shard ${part.shard.index}/${part.shard.count}, but "${first.file}" belongs to a split into ${first.part.shard.count}.`);
    if (part.version !== first.part.version) throw new UsageError(`part file "${file}" was written by phasewise ${part.version}, "${first.file}" by ${first.part.version}; evaluate every shard with one version.`);
  }
  const n = first.part.shard.count;
  const seen = new Map<number, string>();
  for (const { file, part } of parts) {
    if (seen.has(part.shard.index)) throw new UsageError(`shard ${part.shard.index}/${n} is given twice ("${seen.get(part.shard.index)}" and "${file}").`);
    seen.set(part.shard.index, file);
  }
  const missing = Array.from({ length: n }, (_, i) => i + 1).filter((i) => !seen.has(i));
  if (missing.length > 0) throw new UsageError(`merge: shards ${missing.map((i) => `${i}/${n}`).join(', ')} are missing.`);
  const out = outputFolder(outDir);
  const design = parseDesign(first.part.designText, basename(first.part.designFile));
  const prepared = prepareDesign(design, { fileName: basename(first.part.designFile), readFile: designReader(first.part.designFile) });
  const byIndex = new Map<number, FrequencyEvaluation>();
  for (const { part } of parts) part.frequencyIndices.forEach((idx, j) => byIndex.set(idx, part.frequencies[j]));
  const results = Array.from(prepared.frequenciesHz, (_, i) => byIndex.get(i) as FrequencyEvaluation);
  const ev = assembleDesignEvaluation(prepared, results);
  return { folder: out.path, files: writeReport(ev, first.part.designText, out), evaluation: ev, failedChecks: ev.failedChecks, estimate: '' };
}

/** Console summary of a report run. @internal */
export function formatRun(r: ReportRun): string {
  if (r.dryRun) return r.estimate;
  if (r.shard || !r.evaluation) {
    return [`shard ${r.shard?.index}/${r.shard?.count}: ${r.shard?.frequencies} frequencies evaluated`, `  part written to ${r.folder}/${r.files[0]}`].join('\n');
  }
  const ev = r.evaluation;
  const nf = ev.frequenciesHz.length;
  // Best beam by band-average sensitivity, worst by its lowest sensitivity in the band.
  const s = ev.bandSummary;
  let best = 0, worst = 0;
  s.forEach((b, k) => { if (b.bandAverageSensitivityM2PerK > s[best].bandAverageSensitivityM2PerK) best = k; if (b.worstSensitivityM2PerK < s[worst].worstSensitivityM2PerK) worst = k; });
  const label = (k: number) => ev.beams.kind === 'plane' && ev.beams.scanAngleDeg ? `${ev.beams.scanAngleDeg[k]}°` : `θ ${num(ev.beams.thetaDeg[k], 4)}°, φ ${num(ev.beams.phiDeg[k], 4)}°`;
  const fText = (f: number) => `${num(f / 1e9, 6)} GHz`;
  const band = nf > 1;
  const lines = [
    `${ev.title}: ${ev.elementCount} elements, ${ev.beams.thetaDeg.length} beams (${ev.beamformer}), ${band ? `${nf} frequencies ${fText(ev.frequenciesHz[0])} – ${fText(ev.frequenciesHz[nf - 1])}` : fText(ev.frequenciesHz[0])}`,
    `  best beam  (${label(best)}): A_e/T_sys ${num(s[best].bandAverageSensitivityM2PerK, 4)} m²/K${band ? ' band average' : ''}, G/T ${num(s[best].worstGainOverTemperatureDbPerK, 4)} dB/K${band ? ' or better' : ''}`,
    `  worst beam (${label(worst)}): A_e/T_sys ${num(s[worst].worstSensitivityM2PerK, 4)} m²/K${band ? ` at ${fText(s[worst].worstFrequencyHz)}` : ''}, G/T ${num(s[worst].worstGainOverTemperatureDbPerK, 4)} dB/K, SEFD ${num(s[worst].worstSefdJy, 4)} Jy`,
    `  report written to ${r.folder}`,
    `  files: ${r.files.join(', ')}`,
  ];
  return lines.join('\n');
}
