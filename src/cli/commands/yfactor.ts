/**
 * `phasewise yfactor`: receiver temperatures from a hot/cold CSV table.
 * @internal
 * @module
 */
import { noiseSourceOnTemperature, reduceYFactorTable, type YFactorTableResult } from '../../measure/index.js';
import { readYFactorCsv } from '../../measure/node.js';
import { num, table } from '../format.js';
import { DomainError } from '../../errors.js';

/** Reduces a table file. @internal */
export function runYFactor(path: string, hotTemperatureK: number, coldTemperatureK: number, db: boolean): YFactorTableResult[] {
  try {
    return reduceYFactorTable(readYFactorCsv(path), { hotTemperatureK, coldTemperatureK, powerScale: db ? 'dB' : 'linear' });
  } catch (e) {
    // Command-line users set the power scale with --db, not the library's option name.
    if (e instanceof DomainError) throw new DomainError(e.message.replace(/powerScale: 'dB'/g, '--db'));
    throw e;
  }
}

/** A noise source's setting as the reduction used it. @internal */
export interface NoiseSourceSetting { enrDb: number; enrReferenceTemperatureK: number; onTemperatureK: number }

/** The on temperature T0·(1 + ENR) of a noise source. @internal */
export function noiseSourceSetting(enrDb: number, t0K: number): NoiseSourceSetting {
  return { enrDb, enrReferenceTemperatureK: t0K, onTemperatureK: noiseSourceOnTemperature(enrDb, t0K) };
}

/** Human-readable rendering. @internal */
export function formatYFactor(rows: readonly YFactorTableResult[], hot: number, cold: number, source?: NoiseSourceSetting): string {
  return [
    source
      ? `Y-factor reduction, noise source ENR ${source.enrDb} dB: on at T_on = T0·(1 + ENR) = ${num(source.onTemperatureK, 6)} K (T0 = ${source.enrReferenceTemperatureK} K), off at ${cold} K`
      : `Y-factor reduction, loads at ${hot} K and ${cold} K`,
    '',
    table(['channel', 'Y', 'T_rec [K]', 'NF [dB]'], rows.map((r) => [r.channel, num(r.yFactor, 5), num(r.receiverTemperatureK, 5), num(r.noiseFigureDb, 4)])),
  ].join('\n');
}
