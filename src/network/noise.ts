/**
 * Noise of linear networks: two-port noise parameters, noise correlation
 * matrices in impedance, admittance and chain form (Hillbrand & Russer 1976),
 * noise temperature and figure, Friis cascades, thermal noise of passive
 * networks (Twiss 1955) and noise waves carried by a {@link Multiport}.
 *
 * Conventions: RMS phasors; correlation matrices are E[s sᴴ] over a bandwidth
 * B (required everywhere, as in the reception module; pass 1 for per-hertz values). Chain form: the noisy two-port is a
 * noiseless one preceded by a series voltage source u and a shunt current
 * source i at its input (noiseless input voltage = V₁ + u, current = I₁ + i),
 * C_A = E[[u; i][u; i]ᴴ] = 4 k_B B [[T0·R_n, T_min/2 − T0·R_n·Y_opt*],
 * [T_min/2 − T0·R_n·Y_opt, T0·R_n·|Y_opt|²]], so that a source admittance
 * Y_s sees T = T_min + T0·R_n·|Y_s − Y_opt|²/Re Y_s.
 * @module
 */
import { hzText } from '../internal/text.js';
import { Complex } from 'complex.js';
import { DimensionError, DomainError, SingularMatrixError } from '../errors.js';
import { type CMatrix, type ComplexLike, complexParts, identity, matrixView } from '../linalg/cmatrix.js';
import { add, adjoint, hermitianPart, multiply, scale, subtract } from '../linalg/ops.js';
import { inverse } from '../linalg/lu.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../units/constants.js';
import { assertFiniteCMatrix, assertNonNegative, assertPositive, assertShape, assertSquare, describeValue } from '../internal/validate.js';
import { convertMultiport, powerScatteringStack } from './convert.js';
import { type Multiport, assertMultiport, waveCoefficients, withFields } from './multiport.js';
import { displayable } from '../display/attach.js';

/**
 * Noise parameters of a two-port (IRE/IEEE convention).
 * @category Network
 */
export interface TwoPortNoiseParameters {
  /** Minimum noise temperature T_min [K], ≥ 0 (F_min = 1 + T_min/T0). */
  readonly minimumNoiseTemperatureK: number;
  /** Equivalent noise resistance R_n [Ω], ≥ 0. */
  readonly noiseResistanceOhm: number;
  /** Optimum source admittance Y_opt [S]. */
  readonly optimumSourceAdmittanceS: Complex;
}

/**
 * Noise parameters as accepted by the noise functions (Y_opt as any complex-like value).
 * @category Network
 */
export interface NoiseParametersInput {
  /** Minimum noise temperature T_min [K], ≥ 0. */
  readonly minimumNoiseTemperatureK: number;
  /** Equivalent noise resistance R_n [Ω], ≥ 0. */
  readonly noiseResistanceOhm: number;
  /** Optimum source admittance Y_opt [S], real part > 0, with T_min ≤ 4·T0·R_n·Re Y_opt (realisability). */
  readonly optimumSourceAdmittanceS: ComplexLike;
}

/**
 * Noise parameters as numbers, validated (see {@link parseNoiseParameters}).
 * @internal
 */
export interface ParsedNoiseParameters { tMin: number; rn: number; gOpt: number; bOpt: number }

/**
 * What makes a set of noise parameters unrealisable, or undefined when they are realisable: the
 * one rule of the library, used by the network and reception modules and the design schema.
 * A physical two-port has T_min ≥ 0, R_n ≥ 0, Re Y_opt > 0 and T_min ≤ 4·T0·R_n·Re Y_opt (the
 * noise correlation matrix is positive semidefinite; M. W. Pospieszalski, IEEE Trans. MTT 37(9),
 * 1989, from memory), the last with a relative tolerance of 1e-12 for rounding.
 * @param tMin - T_min [K].
 * @param rn - R_n [Ω].
 * @param gOpt - Re Y_opt [S].
 * @returns The offending field and what it should be, or undefined.
 * @internal
 */
export function noiseParameterProblem(tMin: number, rn: number, gOpt: number): { field: 'minimumNoiseTemperatureK' | 'noiseResistanceOhm' | 'optimumSourceAdmittanceS'; expected: string } | undefined {
  if (!(Number.isFinite(tMin) && tMin >= 0)) return { field: 'minimumNoiseTemperatureK', expected: 'a temperature ≥ 0 [K]' };
  if (!(Number.isFinite(rn) && rn >= 0)) return { field: 'noiseResistanceOhm', expected: 'a resistance ≥ 0 [Ω]' };
  if (!(Number.isFinite(gOpt) && gOpt > 0)) return { field: 'optimumSourceAdmittanceS', expected: 'a real part > 0 [S] (a passive optimum source)' };
  const bound = 4 * T0_K * rn * gOpt;
  if (tMin > bound * (1 + 1e-12)) {
    return { field: 'minimumNoiseTemperatureK', expected: `a physical amplifier, T_min ≤ 4·T0·R_n·Re(Y_opt) = ${bound.toPrecision(4)} K (else the noise correlation matrix is indefinite; check the units of R_n [Ω] and Y_opt [S])` };
  }
  return undefined;
}

/**
 * Reads and validates noise parameters with {@link noiseParameterProblem}.
 * @param name - Argument name for messages.
 * @param p - The parameters.
 * @returns T_min [K], R_n [Ω], G_opt and B_opt [S].
 * @throws {@link DomainError} naming the field for unrealisable or malformed parameters.
 * @internal
 */
export function parseNoiseParameters(name: string, p: NoiseParametersInput): ParsedNoiseParameters {
  if (p === null || typeof p !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected {minimumNoiseTemperatureK, noiseResistanceOhm, optimumSourceAdmittanceS}, received ${describeValue(p)}.`);
  }
  const tMin = p.minimumNoiseTemperatureK, rn = p.noiseResistanceOhm;
  const [gOpt, bOpt] = complexParts(`${name}.optimumSourceAdmittanceS`, p.optimumSourceAdmittanceS);
  const bad = noiseParameterProblem(typeof tMin === 'number' ? tMin : Number.NaN, typeof rn === 'number' ? rn : Number.NaN, gOpt);
  if (bad) {
    const given = bad.field === 'optimumSourceAdmittanceS' ? `${gOpt} + ${bOpt}j` : describeValue(p[bad.field]);
    throw new DomainError(`invalid argument "${name}.${bad.field}": expected ${bad.expected}, received ${given}.`);
  }
  return { tMin, rn, gOpt, bOpt };
}

/**
 * Noise temperature of a two-port driven from a source admittance Y_s.
 *
 * @remarks
 * T = T_min + T0·R_n·|Y_s − Y_opt|² / Re Y_s, T0 = 290 K.
 * Source: H. Rothe and W. Dahlke, "Theory of noisy fourpoles", Proc. IRE 44(6), 1956
 * (from memory); IRE Subcommittee 7.9, "Representation of noise in linear twoports",
 * Proc. IRE 48(1), 1960 (from memory).
 * @param params - Noise parameters (T_min [K], R_n [Ω], Y_opt [S]).
 * @param sourceAdmittanceS - Source admittance Y_s [S], real part > 0.
 * @returns Noise temperature [K].
 * @throws {@link DomainError} on invalid parameters or Re Y_s ≤ 0.
 * @category Network
 */
export function noiseTemperatureK(params: NoiseParametersInput, sourceAdmittanceS: ComplexLike): number {
  const { tMin, rn, gOpt, bOpt } = parseNoiseParameters('params', params);
  const [gs, bs] = complexParts('sourceAdmittanceS', sourceAdmittanceS);
  if (!(gs > 0)) throw new DomainError(`invalid argument "sourceAdmittanceS": expected a real part > 0 [S], received ${gs}.`);
  return tMin + (T0_K * rn * ((gs - gOpt) ** 2 + (bs - bOpt) ** 2)) / gs;
}

/**
 * Noise figure of a two-port driven from a source admittance Y_s: 10·log10(1 + T/T0).
 * @param params - Noise parameters (T_min [K], R_n [Ω], Y_opt [S]).
 * @param sourceAdmittanceS - Source admittance [S], real part > 0.
 * @returns Noise figure [dB] (power ratio).
 * @throws {@link DomainError} as {@link noiseTemperatureK}.
 * @category Network
 */
export function noiseFigureDb(params: NoiseParametersInput, sourceAdmittanceS: ComplexLike): number {
  return 10 * Math.log10(1 + noiseTemperatureK(params, sourceAdmittanceS) / T0_K);
}

/**
 * Noise parameters from the data-sheet form: F_min [dB], R_n, and Γ_opt against a real reference.
 *
 * @remarks
 * T_min = T0·(10^{F_min/10} − 1); Y_opt = (1 − Γ_opt)/(Z_ref (1 + Γ_opt)).
 * @param minimumNoiseFigureDb - F_min [dB], ≥ 0.
 * @param noiseResistanceOhm - R_n [Ω], ≥ 0.
 * @param optimumReflection - Γ_opt (dimensionless, |Γ_opt| < 1) against `referenceOhm`.
 * @param referenceOhm - Real reference resistance [Ω], > 0.
 * @returns The parameters.
 * @throws {@link DomainError} on out-of-range values.
 * @category Network
 */
export function noiseParametersFromFigure(
  minimumNoiseFigureDb: number, noiseResistanceOhm: number, optimumReflection: ComplexLike, referenceOhm: number,
): TwoPortNoiseParameters {
  assertNonNegative('minimumNoiseFigureDb', minimumNoiseFigureDb, 'dB');
  assertNonNegative('noiseResistanceOhm', noiseResistanceOhm, 'Ω');
  assertPositive('referenceOhm', referenceOhm, 'Ω');
  const [gr, gi] = complexParts('optimumReflection', optimumReflection);
  if (!(gr * gr + gi * gi < 1)) throw new DomainError(`invalid argument "optimumReflection": expected |Γ_opt| < 1, received ${Math.hypot(gr, gi)}.`);
  const g = new Complex(gr, gi);
  return displayable<TwoPortNoiseParameters>({
    minimumNoiseTemperatureK: T0_K * (10 ** (minimumNoiseFigureDb / 10) - 1),
    noiseResistanceOhm,
    optimumSourceAdmittanceS: new Complex(1).sub(g).div(g.add(1).mul(referenceOhm)),
  }, 'TwoPortNoiseParameters');
}

/**
 * Chain-form noise correlation matrix C_A of a two-port from its noise parameters.
 *
 * @remarks
 * C_A = 4 k_B B [[T0 R_n, T_min/2 − T0 R_n Y_opt*], [T_min/2 − T0 R_n Y_opt, T0 R_n |Y_opt|²]]
 * (RMS phasors; module notes). Source: H. Hillbrand and P. H. Russer, "An efficient method
 * for computer aided noise analysis of linear amplifier networks", IEEE Trans. CAS 23(4),
 * 1976, eq. (25) (from memory; their matrices are per unit bandwidth with 2kT, i.e. peak
 * phasors — ours carry 4kT for RMS phasors).
 * @param params - Noise parameters.
 * @param bandwidthHz - Bandwidth B [Hz], > 0 (required; 1 gives per-hertz values).
 * @returns C_A, 2×2: [[V², V·A], [A·V, A²]].
 * @throws {@link DomainError} on invalid parameters.
 * @category Network
 */
export function chainNoiseCorrelation(params: NoiseParametersInput, bandwidthHz: number): CMatrix {
  const { tMin, rn, gOpt, bOpt } = parseNoiseParameters('params', params);
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  const k4 = 4 * K_BOLTZMANN_J_PER_K * bandwidthHz;
  const cross = (sign: number): [number, number] => [k4 * (tMin / 2 - T0_K * rn * gOpt), k4 * (-T0_K * rn * sign * bOpt)];
  const [c12r, c12i] = cross(-1);
  const [c21r, c21i] = cross(1);
  return {
    rows: 2, cols: 2,
    data: Float64Array.of(k4 * T0_K * rn, 0, c12r, c12i, c21r, c21i, k4 * T0_K * rn * (gOpt * gOpt + bOpt * bOpt), 0),
  };
}

/**
 * Noise parameters from a chain-form correlation matrix (inverse of {@link chainNoiseCorrelation}).
 *
 * @remarks
 * R_n = C_uu/(4k_B T0 B), Y_cor = C_iu/C_uu, G_u = (C_ii − |C_iu|²/C_uu)/(4k_B T0 B),
 * B_opt = −Im Y_cor, G_opt = √(G_u/R_n + (Re Y_cor)²), T_min = 2 T0 R_n (G_opt + Re Y_cor).
 * Source: Hillbrand & Russer 1976 (from memory).
 * @param chainCorrelation - C_A, 2×2 Hermitian positive semidefinite [V², V·A; A·V, A²].
 * @param bandwidthHz - Bandwidth B of `chainCorrelation` [Hz], > 0 (required; 1 for per-hertz values).
 * @returns The noise parameters.
 * @throws {@link DimensionError} unless 2×2; {@link DomainError} if C_uu ≤ 0 (no series noise:
 *   R_n = 0 leaves Y_opt undefined) or non-finite.
 * @category Network
 */
export function noiseParametersFromChainCorrelation(chainCorrelation: CMatrix, bandwidthHz: number): TwoPortNoiseParameters {
  assertShape('chainCorrelation', chainCorrelation, 2, 2);
  assertFiniteCMatrix('chainCorrelation', chainCorrelation);
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  const d = chainCorrelation.data;
  const cuu = d[0], cii = d[6];
  if (!(cuu > 0)) {
    throw new DomainError(`invalid argument "chainCorrelation": C_uu = ${cuu} must be > 0 (a two-port without series noise voltage has no finite Y_opt).`);
  }
  const k = 4 * K_BOLTZMANN_J_PER_K * T0_K * bandwidthHz;
  const ciuR = d[4], ciuI = d[5];
  const rn = cuu / k;
  const ycR = ciuR / cuu, ycI = ciuI / cuu;
  const gu = Math.max(0, cii - (ciuR * ciuR + ciuI * ciuI) / cuu) / k;
  const gOpt = Math.sqrt(Math.max(0, gu / rn + ycR * ycR));
  return displayable<TwoPortNoiseParameters>({
    minimumNoiseTemperatureK: 2 * T0_K * rn * (gOpt + ycR),
    noiseResistanceOhm: rn,
    optimumSourceAdmittanceS: new Complex(gOpt, -ycI),
  }, 'TwoPortNoiseParameters');
}

/**
 * Form of a two-port noise correlation matrix: impedance (V = Z I + v, C_Z = E[v vᴴ]),
 * admittance (I = Y V + i, C_Y = E[i iᴴ]) or chain (C_A, module notes).
 * @category Network
 */
export type NoiseCorrelationForm = 'impedance' | 'admittance' | 'chain';

/** Transformation matrix T with C_chain = T C_form Tᴴ (Hillbrand & Russer 1976, Table I). */
function toChainMatrix(form: NoiseCorrelationForm, a: CMatrix): CMatrix {
  const d = a.data;
  const c = (re: number, im: number): Complex => new Complex(re, im);
  const A11 = c(d[0], d[1]), A12 = c(d[2], d[3]), A21 = c(d[4], d[5]), A22 = c(d[6], d[7]);
  const m = (x: Complex[]): CMatrix => ({ rows: 2, cols: 2, data: Float64Array.from(x.flatMap((z) => [z.re, z.im])) });
  if (form === 'chain') return identity(2);
  if (form === 'impedance') return m([c(1, 0), A11.neg(), c(0, 0), A21.neg()]);
  return m([c(0, 0), A12, c(1, 0), A22]);
}

/**
 * Converts a two-port noise correlation matrix between impedance, admittance and chain form.
 *
 * @remarks
 * C_to = T C_from Tᴴ with the transformation matrices of Hillbrand & Russer 1976, Table I
 * (from memory): Z → chain [[1, −A₁₁], [0, −A₂₁]], Y → chain [[0, A₁₂], [1, A₂₂]], and
 * their inverses (chain → Z [[1, −Z₁₁], [0, −Z₂₁]], chain → Y [[−Y₁₁, 1], [−Y₂₁, 0]]).
 * @param correlation - 2×2 correlation matrix in form `from` (units per form, any bandwidth).
 * @param from - Its form.
 * @param to - Target form.
 * @param chainMatrix - The two-port's chain matrix [[A, B], [C, D]] (A, D dimensionless, B [Ω], C [S]).
 * @returns The 2×2 correlation matrix in form `to` (same bandwidth).
 * @throws {@link DimensionError} unless both matrices are 2×2; {@link SingularMatrixError} if
 *   the transformation is singular (e.g. Z form of a network with C = 0).
 * @category Network
 */
export function convertNoiseCorrelation(correlation: CMatrix, from: NoiseCorrelationForm, to: NoiseCorrelationForm, chainMatrix: CMatrix): CMatrix {
  assertShape('correlation', correlation, 2, 2);
  assertFiniteCMatrix('correlation', correlation);
  assertShape('chainMatrix', chainMatrix, 2, 2);
  assertFiniteCMatrix('chainMatrix', chainMatrix);
  for (const [nm, v] of [['from', from], ['to', to]] as const) {
    if (v !== 'impedance' && v !== 'admittance' && v !== 'chain') {
      throw new DomainError(`invalid argument "${nm}": expected 'impedance', 'admittance' or 'chain', received ${describeValue(v)}.`);
    }
  }
  const t1 = toChainMatrix(from, chainMatrix);
  const cA = multiply(multiply(t1, correlation), adjoint(t1));
  if (to === 'chain') return cA;
  const t2 = inverse(toChainMatrix(to, chainMatrix));
  return multiply(multiply(t2, cA), adjoint(t2));
}

/**
 * One stage of a Friis cascade.
 * @category Network
 */
export interface CascadeStage {
  /** Noise temperature of the stage for the source it sees [K], ≥ 0. */
  readonly noiseTemperatureK: number;
  /** Available power gain of the stage for the source it sees (linear), > 0. */
  readonly availableGain: number;
}

/**
 * Noise temperature of a cascade (Friis): T = T₁ + T₂/G₁ + T₃/(G₁G₂) + ….
 *
 * @remarks
 * Each Tₖ and Gₖ must be evaluated for the source impedance that stage actually sees (the
 * output impedance of the preceding chain). Source: H. T. Friis, "Noise figures of radio
 * receivers", Proc. IRE 32(7), 1944 (from memory).
 * @param stages - Stages in signal order.
 * @returns Cascade noise temperature [K].
 * @throws {@link DomainError} on negative temperatures or non-positive gains; {@link DimensionError} if empty.
 * @category Network
 */
export function cascadeNoiseTemperatureK(stages: ReadonlyArray<CascadeStage>): number {
  if (!Array.isArray(stages) || stages.length === 0) {
    throw new DimensionError(`invalid argument "stages": expected a non-empty array of stages, received ${describeValue(stages)}.`);
  }
  let t = 0, g = 1;
  stages.forEach((s, i) => {
    assertNonNegative(`stages[${i}].noiseTemperatureK`, s.noiseTemperatureK, 'K');
    assertPositive(`stages[${i}].availableGain`, s.availableGain);
    t += s.noiseTemperatureK / g;
    g *= s.availableGain;
  });
  return t;
}

/**
 * Open-circuit thermal noise correlation of a passive network at uniform temperature T:
 * E[v vᴴ] = 2 k_B T B (Z + Zᴴ).
 *
 * @remarks
 * RMS phasors (docs/conventions.md). Source: R. Q. Twiss, "Nyquist's and Thevenin's theorems
 * generalized for nonreciprocal linear networks", J. Appl. Phys. 26(5), 1955 (from memory).
 * @param impedanceOhm - Z [Ω], N×N.
 * @param temperatureK - Physical temperature T [K], ≥ 0.
 * @param bandwidthHz - Bandwidth B [Hz], > 0 (required; 1 gives per-hertz values).
 * @returns C_Z [V²], N×N Hermitian.
 * @throws {@link DimensionError} unless square; {@link DomainError} on bad T or B.
 * @category Network
 */
export function thermalImpedanceNoise(impedanceOhm: CMatrix, temperatureK: number, bandwidthHz: number): CMatrix {
  assertSquare('impedanceOhm', impedanceOhm);
  assertFiniteCMatrix('impedanceOhm', impedanceOhm);
  assertNonNegative('temperatureK', temperatureK, 'K');
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  // 2k_B T B (Z + Zᴴ) = 4k_B T B · hermitianPart(Z), scaled in place (one N×N array, not three)
  const h = hermitianPart(impedanceOhm), c = 4 * K_BOLTZMANN_J_PER_K * temperatureK * bandwidthHz;
  for (let k = 0; k < h.data.length; k++) h.data[k] *= c;
  return h;
}

/**
 * Thermal noise-wave correlation of a passive network at temperature T, power waves:
 * E[c cᴴ] = k_B T B (I − S Sᴴ), for b = S a + c.
 *
 * @remarks
 * Source: H. Bosma, "On the theory of linear noisy systems", Philips Res. Rep. Suppl. 10,
 * 1967 (from memory); equal to the Twiss form mapped to waves by c = (I − S)F v.
 * @param scattering - Power-wave S (dimensionless), N×N.
 * @param temperatureK - Physical temperature T [K], ≥ 0.
 * @param bandwidthHz - Bandwidth B [Hz], > 0 (required; 1 gives per-hertz values).
 * @returns C_S [W], N×N Hermitian.
 * @throws {@link DimensionError} unless square; {@link DomainError} on bad T or B.
 * @category Network
 */
export function thermalNoiseWaves(scattering: CMatrix, temperatureK: number, bandwidthHz: number): CMatrix {
  assertSquare('scattering', scattering);
  assertFiniteCMatrix('scattering', scattering);
  assertNonNegative('temperatureK', temperatureK, 'K');
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  const n = scattering.rows;
  return scale(subtract(identity(n), multiply(scattering, adjoint(scattering))), K_BOLTZMANN_J_PER_K * temperatureK * bandwidthHz);
}

function stackMatrix(stack: Float64Array, n: number, k: number): CMatrix {
  return matrixView(n, n, stack.slice(2 * k * n * n, 2 * (k + 1) * n * n));
}

/** (I − S)·F per frequency (power waves, the network's references). */
function waveFromVoltageMaps(net: Multiport): CMatrix[] {
  const s = powerScatteringStack(net);
  const { f } = waveCoefficients(net.referenceOhm, 'power');
  const n = net.ports;
  const out: CMatrix[] = [];
  for (let k = 0; k < net.frequencyHz.length; k++) {
    const m = stackMatrix(s, n, k);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const q = 2 * (i * n + j);
      m.data[q] = ((i === j ? 1 : 0) - m.data[q]) * f[j];
      m.data[q + 1] = -m.data[q + 1] * f[j];
    }
    out.push(m);
  }
  return out;
}

/**
 * Attaches noise given in impedance form (open-circuit noise voltages) to a network.
 *
 * @remarks
 * V = Z I + v with E[v vᴴ] = C_Z maps to noise waves c = (I − S)F v (power waves,
 * F = diag 1/(2√R_r)), so the stored noise-wave correlation is (I − S)F C_Z F(I − S)ᴴ.
 * Works also where Z does not exist, as long as the given C_Z is finite.
 * @param net - The network.
 * @param impedanceCorrelation - One N×N C_Z per frequency, per hertz [V²/Hz].
 * @returns The network with `noiseWaves` set.
 * @throws {@link DimensionError} on a wrong count or shape.
 * @category Network
 */
export function withImpedanceNoise(net: Multiport, impedanceCorrelation: ReadonlyArray<CMatrix>): Multiport {
  assertMultiport('net', net);
  const n = net.ports, nf = net.frequencyHz.length;
  if (!Array.isArray(impedanceCorrelation) || impedanceCorrelation.length !== nf) {
    throw new DimensionError(`invalid argument "impedanceCorrelation": expected ${nf} matrices (one per frequency), received ${describeValue(impedanceCorrelation)}.`);
  }
  const maps = waveFromVoltageMaps(net);
  const out = new Float64Array(2 * nf * n * n);
  impedanceCorrelation.forEach((c, k) => {
    assertShape(`impedanceCorrelation[${k}]`, c, n, n);
    assertFiniteCMatrix(`impedanceCorrelation[${k}]`, c);
    out.set(multiply(multiply(maps[k], c), adjoint(maps[k])).data, 2 * k * n * n);
  });
  return withFields(net, { data: net.data.slice(), noiseWaves: out });
}

/**
 * The impedance-form noise correlation of a network with noise waves: C_Z = M⁻¹ C_S M⁻ᴴ,
 * M = (I − S)F (inverse of {@link withImpedanceNoise}).
 * @param net - A network with `noiseWaves`.
 * @returns One N×N C_Z per frequency [V²/Hz].
 * @throws {@link DomainError} if the network carries no noise; {@link SingularMatrixError} where Z does not exist.
 * @category Network
 */
export function impedanceNoiseOf(net: Multiport): CMatrix[] {
  assertMultiport('net', net);
  const noise = requireNoise(net);
  const n = net.ports;
  return waveFromVoltageMaps(net).map((m, k) => {
    let mi: CMatrix;
    try { mi = inverse(m); } catch (e) {
      if (e instanceof SingularMatrixError) throw new SingularMatrixError(`the network has no impedance matrix at frequency index ${k} (${hzText(net.frequencyHz[k])}), so no impedance-form noise.`, k);
      throw e;
    }
    return multiply(multiply(mi, stackMatrix(noise, n, k)), adjoint(mi));
  });
}

function requireNoise(net: Multiport): Float64Array {
  if (!net.noiseWaves) throw new DomainError('invalid argument "net": it carries no noise waves; attach noise with withThermalNoise, withImpedanceNoise or withTwoPortNoise.');
  return net.noiseWaves;
}

/**
 * Attaches the thermal noise of a passive network at uniform temperature: noise waves
 * k_B T (I − S Sᴴ) per hertz (see {@link thermalNoiseWaves}).
 * @param net - The network (passive, for the result to be physical).
 * @param temperatureK - Physical temperature [K], ≥ 0.
 * @returns The network with `noiseWaves` set [W/Hz].
 * @throws {@link DomainError} on a bad temperature.
 * @category Network
 */
export function withThermalNoise(net: Multiport, temperatureK: number): Multiport {
  assertMultiport('net', net);
  assertNonNegative('temperatureK', temperatureK, 'K');
  const s = powerScatteringStack(net);
  const n = net.ports;
  const out = new Float64Array(s.length);
  for (let k = 0; k < net.frequencyHz.length; k++) out.set(thermalNoiseWaves(stackMatrix(s, n, k), temperatureK, 1).data, 2 * k * n * n);
  return withFields(net, { data: net.data.slice(), noiseWaves: out });
}

/**
 * Map M (2×2) from chain-form noise sources to noise waves: c = M s_A, where the chain
 * form reads [V₁; I₁] = A [V₂; −I₂] + s_A and both ports are closed in their reference
 * impedances (a = 0).
 */
function chainToWaveMaps(net: Multiport): CMatrix[] {
  const chain = convertMultiport(net, 'chain');
  const { f, g, h } = waveCoefficients(net.referenceOhm, 'power');
  const c = (re: number, im: number): Complex => new Complex(re, im);
  const g1 = c(g[0], g[1]), g2 = c(g[2], g[3]);
  const k1 = c(g[0] + h[0], g[1] + h[1]).mul(-f[0]), k2 = c(g[2] + h[2], g[3] + h[3]).mul(-f[1]);
  const out: CMatrix[] = [];
  for (let k = 0; k < net.frequencyHz.length; k++) {
    const d = chain.data.subarray(8 * k, 8 * k + 8);
    const A = c(d[0], d[1]), B = c(d[2], d[3]), C = c(d[4], d[5]), D = c(d[6], d[7]);
    // I2 = (s_v + g1 s_i)/Δ, Δ = A g2 + B + g1 (C g2 + D); I1 = −(C g2 + D) I2 + s_i
    const delta = A.mul(g2).add(B).add(g1.mul(C.mul(g2).add(D)));
    if (delta.abs() === 0) throw new SingularMatrixError(`the two-port closed in its references has no solution at frequency index ${k}.`, k);
    const i2v = c(1, 0).div(delta), i2i = g1.div(delta);
    const e = C.mul(g2).add(D).neg();
    const i1v = e.mul(i2v), i1i = e.mul(i2i).add(1);
    const m = [k1.mul(i1v), k1.mul(i1i), k2.mul(i2v), k2.mul(i2i)];
    out.push({ rows: 2, cols: 2, data: Float64Array.from(m.flatMap((z) => [z.re, z.im])) });
  }
  return out;
}

/**
 * Attaches two-port noise given by noise parameters (one set per frequency).
 *
 * @remarks
 * The chain-form correlation ({@link chainNoiseCorrelation}) is mapped to noise waves by
 * solving the two-port closed in its reference impedances (a = 0) for the waves the chain
 * sources produce. Requires the chain form to exist (S21 ≠ 0).
 * @param net - A two-port.
 * @param params - One parameter set per frequency.
 * @returns The network with `noiseWaves` set [W/Hz].
 * @throws {@link DimensionError} unless a two-port with one parameter set per frequency.
 * @category Network
 */
export function withTwoPortNoise(net: Multiport, params: ReadonlyArray<NoiseParametersInput>): Multiport {
  assertMultiport('net', net);
  if (net.ports !== 2) throw new DimensionError(`invalid argument "net": expected a two-port, received a ${net.ports}-port.`);
  const nf = net.frequencyHz.length;
  if (!Array.isArray(params) || params.length !== nf) {
    throw new DimensionError(`invalid argument "params": expected ${nf} parameter sets (one per frequency), received ${describeValue(params)}.`);
  }
  const maps = chainToWaveMaps(net);
  const out = new Float64Array(8 * nf);
  params.forEach((p, k) => {
    const cA = chainNoiseCorrelation(p, 1);
    out.set(multiply(multiply(maps[k], cA), adjoint(maps[k])).data, 8 * k);
  });
  return withFields(net, { data: net.data.slice(), noiseWaves: out });
}

/**
 * Noise parameters of a two-port that carries noise waves (one set per frequency).
 * @param net - A two-port with `noiseWaves`.
 * @returns One parameter set per frequency.
 * @throws {@link DimensionError} unless a two-port; {@link DomainError} without noise or with
 *   no series noise voltage at some frequency.
 * @category Network
 */
export function twoPortNoiseOf(net: Multiport): TwoPortNoiseParameters[] {
  assertMultiport('net', net);
  if (net.ports !== 2) throw new DimensionError(`invalid argument "net": expected a two-port, received a ${net.ports}-port.`);
  const noise = requireNoise(net);
  return chainToWaveMaps(net).map((m, k) => {
    const mi = inverse(m);
    const cA = multiply(multiply(mi, stackMatrix(noise, 2, k)), adjoint(mi));
    // symmetrise rounding
    cA.data[1] = 0; cA.data[7] = 0;
    return noiseParametersFromChainCorrelation(cA, 1);
  });
}
