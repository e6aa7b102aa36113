/**
 * Example: reduce a bench Y-factor measurement of a 4-channel receiver (liquid-nitrogen cold
 * load, room-temperature hot load), with first-order uncertainties, then turn an on/off
 * observation of a calibrator into A_e/T_sys and SEFD.
 *
 * Scenario and numbers are our own invention (a demonstration table, not a real instrument).
 * Run: npx tsx examples/yfactor-reduction.ts
 */
import { parseYFactorCsv, reduceYFactorTable, yFactorReceiverTemperature, onOffSensitivity, janskyToSi } from 'phasewise';

const table = `# demo bench run: powers in dBm from a power meter
channel,hot,cold
ch0,-41.20,-44.05
ch1,-41.05,-43.80
ch2,-41.40,-44.35
ch3,-40.95,-43.62
`;
const rows = parseYFactorCsv(table);
for (const r of reduceYFactorTable(rows, { hotTemperatureK: 296, coldTemperatureK: 77.4, powerScale: 'dB' })) {
  console.log(`${r.channel}: Y = ${r.yFactor.toFixed(4)}, T_rec = ${r.receiverTemperatureK.toFixed(1)} K, NF = ${r.noiseFigureDb.toFixed(2)} dB`);
}

// Uncertainty budget for one channel: 0.5 % power repeatability, ±1 K on the hot load, ±0.5 K on the cold load.
const u = yFactorReceiverTemperature({
  hotPower: 10 ** (-41.2 / 10), coldPower: 10 ** (-44.05 / 10), hotTemperatureK: 296, coldTemperatureK: 77.4,
  hotPowerRelativeSigma: 0.005, coldPowerRelativeSigma: 0.005, hotTemperatureSigmaK: 1, coldTemperatureSigmaK: 0.5,
});
console.log(`ch0: T_rec = ${u.receiverTemperatureK.toFixed(1)} ± ${u.receiverTemperatureSigmaK.toFixed(1)} K (1σ)`);

// On/off: the beam's power rises 3.1 % on a 20 Jy calibrator.
const s = onOffSensitivity({ onPower: 1.031, offPower: 1, fluxDensityWPerM2Hz: janskyToSi(20) });
console.log(`A_e/T_sys = ${s.aeOverTsysM2PerK.toFixed(3)} m²/K, SEFD = ${s.sefdJy.toFixed(0)} Jy`);
