import { describe, it, expect } from 'vitest';
import {
  createMultiport, convertMultiport, renormalizeMultiport, keepPorts, addSeriesImpedance, addShuntAdmittance, combineMultiports,
  withTwoPortNoise, impedanceNoiseOf, convertNoiseCorrelation, noiseParametersFromChainCorrelation, thermalNoiseWaves,
  thermalImpedanceNoise, withImpedanceNoise, formatTouchstone, parseTouchstone, multiportMatrix, loadResponse, nortonFromThevenin,
  activeReflection, chainNoiseCorrelation,
} from '../../src/index.js';
import { fromRows, identity, zeros, columnVector } from '../../src/linalg/index.js';
import { DimensionError, DomainError, ParseError, SingularMatrixError } from '../../src/errors.js';

const two = createMultiport('impedance', [1e9, 2e9], [fromRows([[50, 5], [5, 60]]), fromRows([[55, 5], [5, 65]])]);

describe('bad input is a typed error', () => {
  it('construction and conversion', () => {
    expect(() => createMultiport('bogus' as never, [1], [identity(1)])).toThrow(DomainError);
    expect(() => createMultiport('impedance', [1], [identity(2)], { portNames: ['a'] })).toThrow(DimensionError);
    expect(() => createMultiport('impedance', [1], [identity(1)], { waves: 'other' as never })).toThrow(DomainError);
    expect(() => createMultiport('impedance', [1], new Float64Array(3))).toThrow(DimensionError);
    expect(() => createMultiport('impedance', [], [])).toThrow(DimensionError);
    expect(() => convertMultiport(two, 'bogus' as never)).toThrow(DomainError);
    expect(() => convertMultiport({} as never, 'scattering')).toThrow(DimensionError);
    expect(() => renormalizeMultiport(two, 50, 'other' as never)).toThrow(DomainError);
    expect(() => multiportMatrix(two, 2)).toThrow(DomainError);
    // Y → Z of an all-zero admittance: singular at index 0
    const y0 = createMultiport('admittance', [1], [zeros(2)]);
    expect(() => convertMultiport(y0, 'impedance')).toThrow(SingularMatrixError);
  });
  it('port operations and elements', () => {
    expect(() => keepPorts(two, [0], 'loose' as never)).toThrow(DomainError);
    expect(() => addSeriesImpedance(two, 0, [1, 2, 3])).toThrow(DimensionError);
    expect(() => addShuntAdmittance(two, 5, 0.01)).toThrow(DomainError);
    expect(() => combineMultiports([])).toThrow(DimensionError);
  });
  it('sources', () => {
    expect(() => nortonFromThevenin({ impedanceOhm: zeros(2), openCircuitVoltageV: columnVector([1, 1]) })).toThrow(SingularMatrixError);
    expect(() => loadResponse({ impedanceOhm: identity(2), openCircuitVoltageV: columnVector([1]) }, identity(2))).toThrow(DimensionError);
    expect(() => activeReflection(two, columnVector([1, 1, 1]))).toThrow(DimensionError);
  });
  it('noise', () => {
    const three = createMultiport('impedance', [1], [identity(3)]);
    const p = { minimumNoiseTemperatureK: 30, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.02 };
    expect(() => withTwoPortNoise(three, [p])).toThrow(DimensionError);
    expect(() => withTwoPortNoise(two, [p])).toThrow(DimensionError);
    expect(() => impedanceNoiseOf(two)).toThrow(DomainError);
    expect(() => convertNoiseCorrelation(identity(2), 'wave' as never, 'chain', identity(2))).toThrow(DomainError);
    expect(() => convertNoiseCorrelation(identity(3), 'chain', 'impedance', identity(2))).toThrow(DimensionError);
    expect(() => noiseParametersFromChainCorrelation(fromRows([[0, 0], [0, 1]]), 1)).toThrow(DomainError);
    expect(() => thermalNoiseWaves(identity(2), -1, 1)).toThrow(DomainError);
    expect(() => thermalImpedanceNoise(identity(2), 290, 0)).toThrow(DomainError);
    // One bandwidth rule (issue 23): required, as in the reception module; a missing bandwidth is a typed error, not 1 Hz.
    expect(() => thermalImpedanceNoise(identity(2), 290, undefined as unknown as number)).toThrow(/bandwidthHz/);
    expect(() => withImpedanceNoise(two, [identity(2)])).toThrow(DimensionError);
    expect(() => chainNoiseCorrelation({ ...p, optimumSourceAdmittanceS: { re: -1, im: 0 } }, 1)).toThrow(DomainError);
  });
  it('Touchstone writer options and parser input', () => {
    expect(() => formatTouchstone(two, { version: 3 as never })).toThrow(DomainError);
    expect(() => formatTouchstone(two, { parameter: 'H' as never })).toThrow(DomainError);
    expect(() => formatTouchstone(two, { format: 'XY' as never })).toThrow(DomainError);
    expect(() => formatTouchstone(two, { frequencyUnit: 'THz' as never })).toThrow(DomainError);
    expect(() => formatTouchstone(two, { significantDigits: 0 })).toThrow(DomainError);
    expect(() => formatTouchstone(two, { version: 1, matrixFormat: 'lower' })).toThrow(DomainError);
    expect(() => parseTouchstone(42 as never)).toThrow(ParseError);
    expect(() => parseTouchstone('# GHz S RI\n1 0 0\n', { ports: 0 })).toThrow(DomainError);
  });
});
