/**
 * The phasewise design file: a JSON description of a receiving array
 * (band, layout, elements, amplifiers, environment, beams), validated with
 * zod. Every error names the field path, what was expected and what was
 * found. The file is data only: nothing in it is ever evaluated as code.
 * Browser-safe: files the design names are read by the caller.
 * @module
 */
import { z } from 'zod';
import { T0_K } from '../units/constants.js';
import { noiseParameterProblem } from '../network/noise.js';
import { DesignError, ParseError } from '../errors.js';
import { parseJsonText } from '../internal/json.js';
import type { Design } from './types.js';

export type { Design } from './types.js';

const positive = (unit: string) => z.number().positive().describe(unit);
const finite = z.number();
const vector3 = z.tuple([finite, finite, finite]);

const complexValue = z.union([finite, z.strictObject({ re: finite, im: finite })], { error: 'expected a number or {"re": number, "im": number}' });

const lineLayout = z.strictObject({
  kind: z.literal('line'),
  count: z.number().int().min(1).max(10000),
  spacingM: positive('m'),
  axis: z.enum(['x', 'y']).optional(),
});
const rectangularLayout = z.strictObject({
  kind: z.literal('rectangular'),
  countX: z.number().int().min(1).max(1000),
  countY: z.number().int().min(1).max(1000),
  spacingXM: positive('m'),
  spacingYM: positive('m'),
});
const boundary = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('circle'), radiusM: positive('m') }),
  z.strictObject({ kind: z.literal('hexagon'), circumradiusM: positive('m'), rotationDeg: finite.optional() }),
]);
const triangularLayout = z.strictObject({
  kind: z.literal('triangular'),
  spacingM: positive('m'),
  boundary,
});
const positionsLayout = z.strictObject({
  kind: z.literal('positions'),
  positionsM: z.array(vector3).min(1).max(10000),
});
const layout = z.discriminatedUnion('kind', [lineLayout, rectangularLayout, triangularLayout, positionsLayout]);

const frequencyList = z.array(positive('Hz')).min(1).max(10000);
const frequencyRange = z.strictObject({
  fromHz: positive('Hz'),
  toHz: positive('Hz'),
  count: z.number().int().min(1).max(10000),
});
const frequency = z.union([positive('Hz'), frequencyList, frequencyRange], {
  error: 'expected a frequency [Hz], a list of frequencies [Hz] or {"fromHz", "toHz", "count"}',
});

const dipoleElements = z.strictObject({
  kind: z.literal('dipole'),
  lengthM: positive('m'),
  radiusM: positive('m'),
  axis: vector3.refine((v) => Math.hypot(v[0], v[1], v[2]) > 0, { message: 'expected a non-zero axis vector' }),
  groundPlaneHeightM: positive('m').optional(),
});
const crossedDipoleElements = z.strictObject({
  kind: z.literal('crossedDipole'),
  lengthM: positive('m'),
  radiusM: positive('m'),
  rotationDeg: finite.optional(),
  groundPlaneHeightM: positive('m').optional(),
});
const importedElements = z.strictObject({
  kind: z.literal('imported'),
  touchstoneFile: z.string().min(1),
  patternFile: z.union([z.string().min(1), z.array(z.string().min(1)).min(1).max(10000)], {
    error: 'expected a pattern file name or a list of them (one file per frequency)',
  }),
  interpolatePatterns: z.boolean().optional(),
});
const wireSpec = z.strictObject({
  pointsM: z.array(vector3).min(2).max(1000),
  radiusM: positive('m'),
  segments: z.number().int().min(1).max(10000).optional(),
});
const wireLoad = z.strictObject({
  wire: z.number().int().min(0),
  atFraction: z.number().min(0).max(1).optional(),
  resistanceOhm: z.number().min(0).optional(),
  inductanceH: z.number().min(0).optional(),
  capacitanceF: positive('F').optional(),
  connection: z.enum(['series', 'parallel']).optional(),
  impedanceOhm: complexValue.optional(),
});
const wireElements = z.strictObject({
  kind: z.literal('wire'),
  wires: z.array(wireSpec).min(1).max(1000),
  port: z.strictObject({ wire: z.number().int().min(0), atFraction: z.number().min(0).max(1).optional() }),
  loads: z.array(wireLoad).max(1000).optional(),
  groundPlaneHeightM: positive('m').optional(),
  maxSegmentWavelengths: z.number().gt(0).max(0.25).optional(),
}).superRefine((e, ctx) => {
  const check = (path: PropertyKey[], w: number) => {
    if (w >= e.wires.length) ctx.addIssue({ code: 'custom', path: [...path, 'wire'], input: w, message: `expected a wire index below ${e.wires.length} (the number of wires)` });
  };
  check(['port'], e.port.wire);
  e.loads?.forEach((l, i) => check(['loads', i], l.wire));
});
const elements = z.discriminatedUnion('kind', [dipoleElements, crossedDipoleElements, importedElements, wireElements]);

/** Realisable noise parameters: the network module's one rule ({@link noiseParameterProblem}). */
function checkRealisable(ctx: z.RefinementCtx, path: PropertyKey[], tMin: number, rn: number, y: number | { re: number; im: number }): void {
  const bad = noiseParameterProblem(tMin, rn, typeof y === 'number' ? y : y.re);
  if (bad) ctx.addIssue({ code: 'custom', path: [...path, bad.field], message: `expected ${bad.expected}`, input: bad.field === 'optimumSourceAdmittanceS' ? y : bad.field === 'noiseResistanceOhm' ? rn : tMin });
}
const backEnd = {
  gainDb: finite.optional(),
  secondStageTemperatureK: z.number().min(0).optional(),
};
const fixedAmplifiers = z.strictObject({
  minimumNoiseTemperatureK: z.number().min(0),
  noiseResistanceOhm: positive('Ω'),
  optimumSourceAdmittanceS: complexValue,
  ...backEnd,
}).superRefine((a, ctx) => checkRealisable(ctx, [], a.minimumNoiseTemperatureK, a.noiseResistanceOhm, a.optimumSourceAdmittanceS));
const tableAmplifiers = z.strictObject({
  table: z.strictObject({
    frequencyHz: z.array(positive('Hz')).min(2, { message: 'expected at least 2 rows (a noise table is interpolated linearly in frequency)' }).max(10000),
    minimumNoiseTemperatureK: z.array(z.number().min(0)),
    noiseResistanceOhm: z.array(positive('Ω')),
    optimumSourceAdmittanceS: z.array(complexValue),
  }),
  ...backEnd,
}).superRefine((a, ctx) => {
  const t = a.table, n = t.frequencyHz.length;
  for (const key of ['minimumNoiseTemperatureK', 'noiseResistanceOhm', 'optimumSourceAdmittanceS'] as const) {
    if (t[key].length !== n) {
      ctx.addIssue({ code: 'custom', path: ['table', key], input: t[key], message: `expected ${n} values (one per row of table.frequencyHz)` });
      return;
    }
  }
  for (let i = 1; i < n; i++) {
    if (!(t.frequencyHz[i] > t.frequencyHz[i - 1])) {
      ctx.addIssue({ code: 'custom', path: ['table', 'frequencyHz', i], input: t.frequencyHz[i], message: `expected frequencies in increasing order (row ${i + 1} must exceed ${t.frequencyHz[i - 1]} Hz)` });
      return;
    }
  }
  for (let i = 0; i < n; i++) checkRealisable(ctx, ['table', `row ${i + 1}`], t.minimumNoiseTemperatureK[i], t.noiseResistanceOhm[i], t.optimumSourceAdmittanceS[i]);
});
const fileAmplifiers = z.strictObject({
  touchstoneFile: z.string().min(1),
  ...backEnd,
});
const amplifiers = z.union([fixedAmplifiers, tableAmplifiers, fileAmplifiers], {
  error: 'expected fixed noise parameters {minimumNoiseTemperatureK, noiseResistanceOhm, optimumSourceAdmittanceS}, a table {"table": {...}} or a two-port Touchstone file {"touchstoneFile": …}',
});

const skyPowerLaw = z.strictObject({
  referenceK: z.number().min(0),
  referenceHz: positive('Hz'),
  spectralIndex: finite.optional(),
  backgroundK: z.number().min(0).optional(),
});

const environment = z.strictObject({
  skyK: z.union([z.number().min(0), skyPowerLaw], { error: 'expected a sky temperature [K] or a power law {"referenceK", "referenceHz", "spectralIndex", "backgroundK"}' }),
  groundK: z.number().min(0).optional(),
  tiltDeg: z.number().min(0).max(180).optional(),
  tiltAzimuthDeg: finite.optional(),
  physicalTemperatureK: z.number().min(0).optional(),
});

const angleList = z.array(z.number().min(-90).max(90)).min(1).max(2000);
const angleRange = z.strictObject({
  fromDeg: z.number().min(-90).max(90),
  toDeg: z.number().min(-90).max(90),
  count: z.number().int().min(1).max(2000),
});
const taper = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('uniform') }),
  z.strictObject({ kind: z.literal('cosine'), pedestal: z.number().min(0).max(1).optional() }),
  z.strictObject({ kind: z.literal('circular-taylor'), sidelobeDb: z.number().gt(0).max(200), nbar: z.number().int().min(1).max(100).optional() }),
]);
const pointing = z.strictObject({ thetaDeg: z.number().min(0).max(90), phiDeg: finite });
const cone = z.strictObject({
  maxThetaDeg: z.number().min(0).max(89),
  stepUV: z.number().min(0.005).max(2),
});
const beams = z.strictObject({
  planePhiDeg: finite.optional(),
  thetaDeg: z.union([angleList, angleRange], { error: 'expected a list of angles [deg] or {"fromDeg", "toDeg", "count"}' }).optional(),
  pointings: z.array(pointing).min(1).max(2000).optional(),
  cone: cone.optional(),
  beamformer: z.enum(['max-snr', 'conjugate-field', 'taper']).optional(),
  taper: taper.optional(),
}).superRefine((b, ctx) => {
  const given = (['thetaDeg', 'pointings', 'cone'] as const).filter((k) => b[k] !== undefined);
  if (given.length !== 1) {
    ctx.addIssue({
      code: 'custom', path: given.length === 0 ? ['thetaDeg'] : [given[1]], input: given.length === 0 ? undefined : b[given[1]],
      message: `expected exactly one of "thetaDeg" (a scan plane), "pointings" (a list of {thetaDeg, phiDeg}) or "cone" ({maxThetaDeg, stepUV})${given.length > 1 ? `, received ${given.join(' and ')}` : ''}`,
    });
  }
  if (b.planePhiDeg !== undefined && b.thetaDeg === undefined) {
    ctx.addIssue({ code: 'custom', path: ['planePhiDeg'], input: b.planePhiDeg, message: 'expected only with "thetaDeg" (it names the scan plane)' });
  }
  if (b.beamformer === 'taper' && b.taper === undefined) {
    ctx.addIssue({ code: 'custom', path: ['taper'], message: 'expected a taper {kind: "uniform" | "cosine" | "circular-taylor", …} when beamformer is "taper"', input: undefined });
  }
  if (b.taper !== undefined && b.beamformer !== 'taper') {
    ctx.addIssue({ code: 'custom', path: ['beamformer'], message: 'expected "taper" when a taper is given', input: b.beamformer });
  }
});

const report = z.strictObject({
  frequenciesHz: z.array(positive('Hz')).min(1).max(20).optional(),
});

const failures = z.strictObject({
  elements: z.array(z.number().int().min(0)).min(1).max(10000).optional(),
  fraction: z.number().min(0).max(1).optional(),
  seed: z.number().int().min(0).max(Number.MAX_SAFE_INTEGER).optional(),
  termination: z.enum(['open', 'matched', 'amplifier']),
  referenceOhm: positive('Ω').optional(),
  amplifierInputOhm: complexValue.optional(),
}).superRefine((f, ctx) => {
  if ((f.elements === undefined) === (f.fraction === undefined)) {
    ctx.addIssue({
      code: 'custom', path: f.elements === undefined ? ['elements'] : ['fraction'], input: f.fraction,
      message: 'expected exactly one of "elements" (a list of failed element indices) or "fraction" (with an optional "seed")',
    });
  }
  if (f.seed !== undefined && f.fraction === undefined) ctx.addIssue({ code: 'custom', path: ['seed'], input: f.seed, message: 'expected only with "fraction" (it seeds the random choice)' });
  const seen = new Set<number>();
  f.elements?.forEach((e, i) => {
    if (seen.has(e)) ctx.addIssue({ code: 'custom', path: ['elements', i], input: e, message: 'expected distinct element indices (this one is repeated)' });
    seen.add(e);
  });
  if (f.termination === 'amplifier' && f.amplifierInputOhm === undefined) {
    ctx.addIssue({ code: 'custom', path: ['amplifierInputOhm'], input: undefined, message: 'expected the dead amplifier\'s input impedance [Ω] (a number or {"re", "im"}) with termination "amplifier"' });
  }
  if (f.amplifierInputOhm !== undefined && f.termination !== 'amplifier') {
    ctx.addIssue({ code: 'custom', path: ['amplifierInputOhm'], input: f.amplifierInputOhm, message: 'expected only with termination "amplifier"' });
  }
  if (f.referenceOhm !== undefined && f.termination !== 'matched') {
    ctx.addIssue({ code: 'custom', path: ['referenceOhm'], input: f.referenceOhm, message: 'expected only with termination "matched"' });
  }
  const zl = f.amplifierInputOhm;
  if (zl !== undefined && (typeof zl === 'number' ? zl : zl.re) < 0) {
    ctx.addIssue({ code: 'custom', path: ['amplifierInputOhm'], input: zl, message: 'expected a passive load, real part ≥ 0 [Ω]' });
  }
});

const imperfections = z.strictObject({
  errors: z.strictObject({
    distribution: z.enum(['gaussian', 'uniform']).optional(),
    amplitudeDb: z.number().min(0).max(10).optional(),
    phaseDeg: z.number().min(0).max(180).optional(),
    positionM: z.number().min(0).max(10).optional(),
  }).optional(),
  failures: failures.optional(),
  phaseBits: z.number().int().min(1).max(16).optional(),
  weightBits: z.number().int().min(2).max(32).optional(),
  subarrays: z.strictObject({
    perX: z.number().int().min(1).max(10000),
    perY: z.number().int().min(1).max(1000).optional(),
  }).optional(),
  steering: z.enum(['phase', 'elementDelay', 'subarrayDelay']).optional(),
}).superRefine((m, ctx) => {
  if (m.steering === 'subarrayDelay' && m.subarrays === undefined) {
    ctx.addIssue({ code: 'custom', path: ['subarrays'], input: undefined, message: 'expected {perX, perY?} with steering "subarrayDelay" (time delay is applied between subarrays)' });
  }
});

const quadrature = z.strictObject({
  thetaCount: z.number().int().min(2).max(2000),
  phiCount: z.number().int().min(2).max(4000),
});

/** zod schema of a design file. @internal */
export const designSchema = z.strictObject({
  title: z.string().max(200).optional(),
  frequencyHz: frequency,
  bandwidthHz: positive('Hz'),
  layout,
  elements,
  amplifiers: amplifiers.optional(),
  environment,
  beams,
  physicalAreaM2: positive('m²').optional(),
  quadrature: quadrature.optional(),
  imperfections: imperfections.optional(),
  report: report.optional(),
});

// The documented types (types.ts) and the schema describe the same data, both ways.
type Parsed = z.infer<typeof designSchema>;
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const sameShape: Same<DeepReadonly<Parsed>, Design> = true;
void sameShape;
type DeepReadonly<T> = T extends object ? { readonly [K in keyof T]: DeepReadonly<T[K]> } : T;

function describeInput(v: unknown): string {
  if (v === undefined) return 'nothing (the field is missing)';
  if (v === null) return 'null';
  if (Array.isArray(v)) return `an array of length ${v.length}`;
  if (typeof v === 'object') return 'an object';
  if (typeof v === 'string') return `the string ${JSON.stringify(v.length > 60 ? v.slice(0, 57) + '…' : v)}`;
  return `${typeof v} ${String(v)}`;
}

/** Field path as text: `beams.thetaDeg[2]`. @internal */
export function fieldPath(path: ReadonlyArray<PropertyKey>): string {
  let s = '';
  for (const p of path) s += typeof p === 'number' ? `[${p}]` : (s === '' ? String(p) : `.${String(p)}`);
  return s === '' ? '(top level)' : s;
}

function issueText(issue: z.core.$ZodIssue): string {
  const found = 'input' in issue ? describeInput(issue.input) : 'nothing (the field is missing)';
  switch (issue.code) {
    case 'invalid_type':
      return `expected ${issue.expected === "int" ? "an integer" : issue.expected}, received ${found}`;
    case 'unrecognized_keys':
      return `unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')} (check the spelling and the unit suffix, e.g. frequencyHz, spacingM, thetaDeg)`;
    case 'invalid_union':
      if ('discriminator' in issue && issue.discriminator) {
        const opts = (issue as unknown as { options: unknown[] }).options.map((o) => JSON.stringify(o)).join(' | ');
        const input = issue.input as Record<string, unknown> | undefined;
        return `expected one of ${opts}, received ${describeInput(input?.[issue.discriminator as string])}`;
      }
      return `${issue.message.startsWith('expected') ? issue.message : 'expected one of the documented forms'}, received ${found}`;
    case 'too_small':
    case 'too_big': {
      const msg = issue.message.replace(/^Too (small|big): /, '');
      return `${msg}, received ${found}`;
    }
    case 'invalid_value':
      return `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(' | ')}, received ${found}`;
    default:
      return `${issue.message.replace(/^Invalid input: /, '')}, received ${found}`;
  }
}

/**
 * A failed union (e.g. the three amplifier forms) reports the problems of the form that came
 * closest — the unique branch with the fewest problems — so the message names the field
 * (`amplifiers.noiseResistanceOhm`) instead of "expected one of the forms".
 */
function closestBranch(issue: z.core.$ZodIssue): z.core.$ZodIssue[] {
  if (issue.code !== 'invalid_union' || ('discriminator' in issue && issue.discriminator) || !Array.isArray(issue.errors) || issue.errors.length === 0) return [issue];
  const sizes = issue.errors.map((e) => e.length);
  const min = Math.min(...sizes);
  if (sizes.filter((x) => x === min).length !== 1) return [issue];
  const best = issue.errors[sizes.indexOf(min)];
  return best.flatMap((i) => closestBranch({ ...i, path: [...issue.path, ...i.path] } as z.core.$ZodIssue));
}

/**
 * Parses and validates design-file text.
 * @param text - File content (JSON).
 * @param fileName - Name used in messages.
 * @returns The validated design.
 * @throws {@link DesignError} naming the field, what was expected and what was found
 *   (for malformed JSON: the line and column).
 * @category Design
 */
export function parseDesign(text: string, fileName: string): Design {
  let data: unknown;
  try {
    data = parseJsonText(text, 'the design file');
  } catch (e) {
    if (e instanceof ParseError) throw new DesignError(fileName, [{ field: '(top level)', message: e.message }]);
    throw e;
  }
  return validateDesign(data, fileName);
}

/**
 * Validates parsed design data (see {@link parseDesign}).
 * @param data - The parsed JSON value.
 * @param fileName - Name used in messages.
 * @returns The validated design.
 * @throws {@link DesignError} naming up to eight problems.
 * @category Design
 */
export function validateDesign(data: unknown, fileName: string): Design {
  const r = designSchema.safeParse(data, { reportInput: true });
  if (r.success) return r.data;
  const issues = r.error.issues.flatMap(closestBranch);
  const problems = issues.slice(0, 8).map((i) => ({ field: fieldPath(i.path), message: issueText(i) }));
  if (issues.length > 8) problems.push({ field: '…', message: `and ${issues.length - 8} more problems` });
  throw new DesignError(fileName, problems);
}

/** Error for one field whose value the library rejects (e.g. an inconsistent port count). @internal */
export function fieldError(fileName: string, path: string, message: string): DesignError {
  return new DesignError(fileName, [{ field: path, message }]);
}
