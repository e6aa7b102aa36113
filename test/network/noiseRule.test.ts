/**
 * One realisability rule for amplifier noise parameters (issue 20): the network module's noise
 * functions, the reception module's coupled-amplifier noise and the design schema accept and
 * reject the same parameters, naming the same field. The rule itself is a physical bound:
 * T_min ≤ 4·T0·R_n·Re Y_opt, because the noise correlation matrix of a two-port is positive
 * semidefinite (Pospieszalski, IEEE Trans. MTT 37(9), 1989, from memory).
 */
import { describe, it, expect } from 'vitest';
import { noiseTemperatureK } from '../../src/network/noise.js';
import { receiverNoiseCorrelation } from '../../src/reception/amplifier.js';
import { validateDesign } from '../../src/design/schema.js';
import { identity } from '../../src/linalg/cmatrix.js';
import { DesignError, DomainError } from '../../src/errors.js';
import { T0_K } from '../../src/units/constants.js';

const design = (amplifiers: object) => ({
  frequencyHz: 1.4e9, bandwidthHz: 1e6,
  layout: { kind: 'line', count: 2, spacingM: 0.1, axis: 'x' },
  elements: { kind: 'dipole', lengthM: 0.1, radiusM: 0.001, axis: [1, 0, 0] },
  amplifiers, environment: { skyK: 5, groundK: 290 }, beams: { thetaDeg: [0] },
});

/** The field each of the three places names when it rejects `p`, or 'accepted'. */
function verdicts(p: { minimumNoiseTemperatureK: number; noiseResistanceOhm: number; optimumSourceAdmittanceS: number }): string[] {
  const field = (f: () => unknown, re: RegExp): string => {
    try { f(); return 'accepted'; } catch (e) {
      expect(e instanceof DomainError || e instanceof DesignError).toBe(true);
      return re.exec((e as Error).message)?.[1] ?? `unnamed: ${(e as Error).message}`;
    }
  };
  return [
    field(() => noiseTemperatureK(p, 0.02), /"params\.(\w+)"/),
    field(() => receiverNoiseCorrelation(identity(2), p, 1e6), /"amplifiers\.(\w+)"/),
    field(() => validateDesign(design(p), 'd.json'), /field "amplifiers\.(\w+)"/),
  ];
}

describe('one noise-parameter rule', () => {
  it('the three places agree on realisable, at-the-bound and unrealisable parameters', () => {
    const rn = 5, g = 0.02, bound = 4 * T0_K * rn * g; // 116 K
    expect(verdicts({ minimumNoiseTemperatureK: 35, noiseResistanceOhm: rn, optimumSourceAdmittanceS: g })).toEqual(['accepted', 'accepted', 'accepted']);
    expect(verdicts({ minimumNoiseTemperatureK: bound, noiseResistanceOhm: rn, optimumSourceAdmittanceS: g })).toEqual(['accepted', 'accepted', 'accepted']);
    expect(verdicts({ minimumNoiseTemperatureK: bound * 1.01, noiseResistanceOhm: rn, optimumSourceAdmittanceS: g })).toEqual(Array(3).fill('minimumNoiseTemperatureK'));
    // Re Y_opt = 0 was accepted by the network module alone before; now no place accepts it.
    expect(verdicts({ minimumNoiseTemperatureK: 0, noiseResistanceOhm: rn, optimumSourceAdmittanceS: 0 })).toEqual(Array(3).fill('optimumSourceAdmittanceS'));
    expect(verdicts({ minimumNoiseTemperatureK: -1, noiseResistanceOhm: rn, optimumSourceAdmittanceS: g })).toEqual(Array(3).fill('minimumNoiseTemperatureK'));
  });
});
