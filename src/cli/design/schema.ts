/**
 * The phasewise design file: a JSON description of a receiving array
 * (frequency, layout, elements, amplifiers, environment, beams), validated
 * with zod. Every error names the field path, what was expected and what was
 * found. The file is data only: nothing in it is ever evaluated as code.
 * @internal
 * @module
 */
import { z } from 'zod';
import { T0_K } from '../../units/constants.js';
import { UsageError } from '../errors.js';

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

const dipoleElements = z.strictObject({
  kind: z.literal('dipole'),
  lengthM: positive('m'),
  radiusM: positive('m'),
  axis: vector3.refine((v) => Math.hypot(v[0], v[1], v[2]) > 0, { message: 'expected a non-zero axis vector' }),
  groundPlaneHeightM: positive('m').optional(),
});
const importedElements = z.strictObject({
  kind: z.literal('imported'),
  touchstoneFile: z.string().min(1),
  patternFile: z.string().min(1),
});
const elements = z.discriminatedUnion('kind', [dipoleElements, importedElements]);

const amplifiers = z.strictObject({
  minimumNoiseTemperatureK: z.number().min(0),
  noiseResistanceOhm: positive('Ω'),
  optimumSourceAdmittanceS: complexValue,
}).superRefine((a, ctx) => {
  const g = typeof a.optimumSourceAdmittanceS === 'number' ? a.optimumSourceAdmittanceS : a.optimumSourceAdmittanceS.re;
  if (!(g > 0)) {
    ctx.addIssue({ code: 'custom', path: ['optimumSourceAdmittanceS'], message: `expected a real part > 0 [S]`, input: a.optimumSourceAdmittanceS });
  } else if (a.minimumNoiseTemperatureK > 4 * T0_K * a.noiseResistanceOhm * g) {
    // A physical two-port has T_min ≤ 4 T0 R_n Re Y_opt (Pospieszalski, IEEE Trans. MTT 37(9), 1989, from memory).
    ctx.addIssue({
      code: 'custom', path: ['minimumNoiseTemperatureK'], input: a.minimumNoiseTemperatureK,
      message: `expected a physical amplifier, T_min ≤ 4·T0·R_n·Re(Y_opt) = ${(4 * T0_K * a.noiseResistanceOhm * g).toPrecision(4)} K`,
    });
  }
});

const environment = z.strictObject({
  skyK: z.number().min(0),
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
const beams = z.strictObject({
  planePhiDeg: finite.optional(),
  thetaDeg: z.union([angleList, angleRange], { error: 'expected a list of angles [deg] or {"fromDeg", "toDeg", "count"}' }),
  beamformer: z.enum(['max-snr', 'conjugate-field', 'taper']).optional(),
  taper: taper.optional(),
}).superRefine((b, ctx) => {
  if (b.beamformer === 'taper' && b.taper === undefined) {
    ctx.addIssue({ code: 'custom', path: ['taper'], message: 'expected a taper {kind: "uniform" | "cosine" | "circular-taylor", …} when beamformer is "taper"', input: undefined });
  }
  if (b.taper !== undefined && b.beamformer !== 'taper') {
    ctx.addIssue({ code: 'custom', path: ['beamformer'], message: 'expected "taper" when a taper is given', input: b.beamformer });
  }
});

const quadrature = z.strictObject({
  thetaCount: z.number().int().min(2).max(2000),
  phiCount: z.number().int().min(2).max(4000),
});

/** zod schema of a design file. @internal */
export const designSchema = z.strictObject({
  title: z.string().max(200).optional(),
  frequencyHz: positive('Hz'),
  bandwidthHz: positive('Hz'),
  layout,
  elements,
  amplifiers: amplifiers.optional(),
  environment,
  beams,
  physicalAreaM2: positive('m²').optional(),
  quadrature: quadrature.optional(),
});

/** A validated design file. @internal */
export type Design = z.infer<typeof designSchema>;

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
  const where = `field "${fieldPath(issue.path)}"`;
  const found = 'input' in issue ? describeInput(issue.input) : 'nothing (the field is missing)';
  switch (issue.code) {
    case 'invalid_type':
      return `${where}: expected ${issue.expected === "int" ? "an integer" : issue.expected}, received ${found}`;
    case 'unrecognized_keys':
      return `${where}: unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')} (check the spelling and the unit suffix, e.g. frequencyHz, spacingM, thetaDeg)`;
    case 'invalid_union':
      if ('discriminator' in issue && issue.discriminator) {
        const opts = (issue as unknown as { options: unknown[] }).options.map((o) => JSON.stringify(o)).join(' | ');
        const input = issue.input as Record<string, unknown> | undefined;
        return `${where}: expected one of ${opts}, received ${describeInput(input?.[issue.discriminator as string])}`;
      }
      return `${where}: ${issue.message.startsWith('expected') ? issue.message : 'expected one of the documented forms'}, received ${found}`;
    case 'too_small':
    case 'too_big': {
      const msg = issue.message.replace(/^Too (small|big): /, '');
      return `${where}: ${msg}, received ${found}`;
    }
    case 'invalid_value':
      return `${where}: expected one of ${issue.values.map((v) => JSON.stringify(v)).join(' | ')}, received ${found}`;
    default:
      return `${where}: ${issue.message.replace(/^Invalid input: /, '')}, received ${found}`;
  }
}

/**
 * Parses and validates design-file text.
 * @param text - File content.
 * @param fileName - Name used in messages.
 * @returns The design.
 * @throws UsageError naming the field, what was expected and what was found.
 * @internal
 */
export function parseDesign(text: string, fileName: string): Design {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new UsageError(`design file "${fileName}" is not valid JSON: ${(e as Error).message}`);
  }
  return validateDesign(data, fileName);
}

/** Validates parsed design data (see {@link parseDesign}). @internal */
export function validateDesign(data: unknown, fileName: string): Design {
  const r = designSchema.safeParse(data, { reportInput: true });
  if (r.success) return r.data;
  const lines = r.error.issues.slice(0, 8).map((i) => `  ${issueText(i)}`);
  if (r.error.issues.length > 8) lines.push(`  … and ${r.error.issues.length - 8} more`);
  throw new UsageError(`invalid design file "${fileName}":\n${lines.join('\n')}`);
}

/** Error for a field whose value the library rejects (e.g. an inconsistent port count). @internal */
export function fieldError(fileName: string, path: string, message: string): UsageError {
  return new UsageError(`invalid design file "${fileName}":\n  field "${path}": ${message}`);
}
