/**
 * `phasewise yfactor`: receiver temperatures from a hot/cold CSV table.
 * @internal
 * @module
 */
import { reduceYFactorTable, type YFactorTableResult } from '../../measure/index.js';
import { readYFactorCsv } from '../../measure/node.js';
import { num, table } from '../format.js';

/** Reduces a table file. @internal */
export function runYFactor(path: string, hotTemperatureK: number, coldTemperatureK: number, db: boolean): YFactorTableResult[] {
  return reduceYFactorTable(readYFactorCsv(path), { hotTemperatureK, coldTemperatureK, powerScale: db ? 'dB' : 'linear' });
}

/** Human-readable rendering. @internal */
export function formatYFactor(rows: readonly YFactorTableResult[], hot: number, cold: number): string {
  return [
    `Y-factor reduction, loads at ${hot} K and ${cold} K`,
    '',
    table(['channel', 'Y', 'T_rec [K]', 'NF [dB]'], rows.map((r) => [r.channel, num(r.yFactor, 5), num(r.receiverTemperatureK, 5), num(r.noiseFigureDb, 4)])),
  ].join('\n');
}
