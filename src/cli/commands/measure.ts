/**
 * The measurement commands: `phasewise yfactor` (receiver temperature per channel from a
 * hot/cold or noise-source table), `phasewise onoff` (A_e/T_sys and SEFD per beam from an
 * on/off table) and `phasewise receiver-noise` (the matrix Y-factor from hot and cold
 * correlation matrices). Physics lives in the measure module; this file reads files and formats.
 * @internal
 * @module
 */
import {
  beamReceiverTemperature, noiseSourceOnTemperature, receiverNoiseFromHotCold, reduceOnOffCsv, reduceYFactorCsv,
  type FluxCorrections, type HotColdCorrelationResult, type OnOffTableResult, type RejectedRow, type TableReduction, type YFactorTableResult,
} from '../../measure/index.js';
import { readCorrelationMatrixFile } from '../../measure/node.js';
import { parseTextFile } from '../../internal/node.js';
import { janskyToSi } from '../../units/convert.js';
import { identity } from '../../linalg/cmatrix.js';
import { column } from '../../linalg/ops.js';
import { num, table } from '../format.js';
import { UsageError } from '../errors.js';

/** Inputs of the yfactor command. @internal */
export interface YFactorCommand {
  file: string;
  hotTemperatureK: number;
  coldTemperatureK: number;
  db: boolean;
  powerRelativeSigma?: number;
  hotTemperatureSigmaK?: number;
  coldTemperatureSigmaK?: number;
}

/** Command-line users set the power scale with --db, not with the library's option name. */
const cliWording = (reason: string): string => reason
  .replace(/powerScale: 'dB'/g, '--db')
  .replace(/invalid argument "(hot|cold|on|off)Power"/g, 'column "$1"');

/** The rejected rows of a table as one message (`file:line: channel "x": reason` per row). */
function rejectedText(file: string, what: string, total: number, rejected: readonly RejectedRow[]): string {
  const rows = rejected.map((r) => `  ${file}:${r.line ?? `row ${r.row}`}: ${what} "${r.name}": ${cliWording(r.reason)}`);
  const others = rejected.length < total ? ' (the others are printed above)' : '';
  return `${rejected.length} of ${total} ${what}${total === 1 ? '' : 's'} could not be reduced${others}:\n${rows.join('\n')}`;
}

/**
 * Reduces a table file channel by channel.
 * @returns The reduction; rows that fail are in `rejected`, the table as a whole failing throws.
 * @internal
 */
export function runYFactor(c: YFactorCommand): TableReduction<YFactorTableResult> {
  return parseTextFile(c.file, (text) => reduceYFactorCsv(text, {
    hotTemperatureK: c.hotTemperatureK, coldTemperatureK: c.coldTemperatureK, powerScale: c.db ? 'dB' : 'linear',
    powerRelativeSigma: c.powerRelativeSigma, hotTemperatureSigmaK: c.hotTemperatureSigmaK, coldTemperatureSigmaK: c.coldTemperatureSigmaK,
  }));
}

/** Throws a UsageError (exit 2) listing the rejected rows, after the good ones were printed. @internal */
export function throwIfRejected<T>(r: TableReduction<T>, file: string, what: string): void {
  if (r.rejected.length > 0) throw new UsageError(rejectedText(file, what, r.results.length + r.rejected.length, r.rejected));
}

/** A noise source's setting as the reduction used it. @internal */
export interface NoiseSourceSetting { enrDb: number; enrReferenceTemperatureK: number; onTemperatureK: number; onTemperatureSigmaK: number }

/**
 * The on temperature T0·(1 + ENR) of a noise source, and its one-sigma from the ENR's
 * (σ_T = T0·ENR·ln10/10·σ_ENR[dB], first order). @internal
 */
export function noiseSourceSetting(enrDb: number, t0K: number, enrSigmaDb = 0): NoiseSourceSetting {
  const onTemperatureK = noiseSourceOnTemperature(enrDb, t0K);
  return { enrDb, enrReferenceTemperatureK: t0K, onTemperatureK, onTemperatureSigmaK: t0K * 10 ** (enrDb / 10) * (Math.LN10 / 10) * enrSigmaDb };
}

const withSigma = (v: number, s: number, digits: number): string => (s > 0 ? `${num(v, digits)} ± ${num(s, 2)}` : num(v, digits));

/** Human-readable rendering. @internal */
export function formatYFactor(rows: readonly YFactorTableResult[], hot: number, cold: number, source?: NoiseSourceSetting): string {
  return [
    source
      ? `Y-factor reduction, noise source ENR ${source.enrDb} dB: on at T_on = T0·(1 + ENR) = ${num(source.onTemperatureK, 6)} K (T0 = ${source.enrReferenceTemperatureK} K), off at ${cold} K`
      : `Y-factor reduction, loads at ${hot} K and ${cold} K`,
    '',
    table(['channel', 'Y', 'T_rec [K] (± 1σ)', 'NF [dB]'], rows.map((r) => [r.channel, num(r.yFactor, 5), withSigma(r.receiverTemperatureK, r.receiverTemperatureSigmaK, 5), num(r.noiseFigureDb, 4)])),
  ].join('\n');
}

/** Inputs of the onoff command. @internal */
export interface OnOffCommand {
  file: string;
  fluxJy: number;
  corrections?: FluxCorrections;
  powerRelativeSigma?: number;
  fluxRelativeSigma?: number;
}

/** Reduces an on/off table file beam by beam. @internal */
export function runOnOff(c: OnOffCommand): TableReduction<OnOffTableResult> {
  return parseTextFile(c.file, (text) => reduceOnOffCsv(text, {
    fluxDensityWPerM2Hz: janskyToSi(c.fluxJy), corrections: c.corrections, powerRelativeSigma: c.powerRelativeSigma, fluxDensityRelativeSigma: c.fluxRelativeSigma,
  }));
}

/** Human-readable rendering of an on/off reduction. @internal */
export function formatOnOff(rows: readonly OnOffTableResult[], fluxJy: number): string {
  const applied = rows[0] ? Object.entries(rows[0].appliedCorrections).map(([k, v]) => `${k} ×${num(v, 5)}`) : [];
  return [
    `On/off reduction, calibrator ${fluxJy} Jy${applied.length ? ` (corrections: ${applied.join(', ')}; flux used ${num(rows[0].effectiveFluxDensityWPerM2Hz / 1e-26, 6)} Jy)` : ''}`,
    '',
    table(['beam', 'P_on/P_off − 1', 'A_e/T_sys [m²/K] (± 1σ)', 'SEFD [Jy] (± 1σ)'], rows.map((r) => [
      r.beam, num(r.sourceToSystemRatio, 5), withSigma(r.aeOverTsysM2PerK, r.aeOverTsysSigmaM2PerK, 5), withSigma(r.sefdJy, r.sefdSigmaJy, 5),
    ])),
  ].join('\n');
}

/** One beam (or channel) of the matrix Y-factor. @internal */
export interface ReceiverNoiseBeam { beam: string; receiverTemperatureK: number }

/** Result of the receiver-noise command. @internal */
export interface ReceiverNoiseRun { channels: number; perChannel: ReceiverNoiseBeam[]; beams: ReceiverNoiseBeam[]; reduction: HotColdCorrelationResult }

/** Matrix Y-factor from two correlation-matrix files (and optional beam weights, one column per beam). @internal */
export function runReceiverNoise(hotFile: string, coldFile: string, hotK: number, coldK: number, weightsFile?: string): ReceiverNoiseRun {
  const hot = readCorrelationMatrixFile(hotFile), cold = readCorrelationMatrixFile(coldFile);
  const reduction = receiverNoiseFromHotCold({ hot, cold, hotTemperatureK: hotK, coldTemperatureK: coldK });
  const n = hot.rows;
  const eye = identity(n);
  const perChannel = Array.from({ length: n }, (_, i) => ({ beam: `channel ${i + 1}`, receiverTemperatureK: beamReceiverTemperature(reduction, column(eye, i)) }));
  let beams: ReceiverNoiseBeam[] = [];
  if (weightsFile !== undefined) {
    const w = readCorrelationMatrixFile(weightsFile);
    if (w.rows !== n) throw new UsageError(`${weightsFile}: expected weights with ${n} rows (one per channel, one column per beam), received ${w.rows}×${w.cols}.`);
    beams = Array.from({ length: w.cols }, (_, b) => ({ beam: `beam ${b + 1}`, receiverTemperatureK: beamReceiverTemperature(reduction, column(w, b)) }));
  }
  return { channels: n, perChannel, beams, reduction };
}

/** Human-readable rendering of the matrix Y-factor. @internal */
export function formatReceiverNoise(r: ReceiverNoiseRun, hotK: number, coldK: number): string {
  return [
    `Matrix Y-factor, ${r.channels} channels, environments at ${hotK} K and ${coldK} K`,
    '',
    table(['beam', 'T_rec [K]'], [...r.perChannel, ...r.beams].map((b) => [b.beam, num(b.receiverTemperatureK, 5)])),
  ].join('\n');
}
