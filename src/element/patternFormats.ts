/**
 * phasewise's own file layouts for embedded-pattern sets (JSON and CSV):
 * browser-safe parsing from strings and formatting to strings.
 *
 * @remarks
 * **JSON layout, version 1** (one object):
 * ```
 * {
 *   "format": "phasewise-embedded-patterns", "version": 1,
 *   "frequencyHz": 1.4e9,
 *   "excitation": { "kind": "open-circuit-current", "driveCurrentA": 1 },
 *       // or { "kind": "short-circuit-voltage", "driveVoltageV": 1 }
 *       // or { "kind": "loaded-voltage", "driveVoltageV": 1, "loadOhm": [{ "re": 50, "im": 0 }, …] }
 *   "thetaDeg": [0, 5, …, 180],          // ascending, within [0, 180]
 *   "phiDeg": [0, 5, …, 355],            // uniform over 360°
 *   "ports": [
 *     { "label": "x1", "phaseCenterM": [0, 0, 0],   // both optional
 *       "thetaRe": […], "thetaIm": […], "phiRe": […], "phiIm": […] }  // [V], nθ·nφ each, θ fastest
 *   ]
 * }
 * ```
 * **CSV layout, version 1**: `#` comment lines carry metadata as `key: value`
 * (`phasewise-embedded-patterns: 1` first, then `frequencyHz`, `excitation`,
 * `driveCurrentA` or `driveVoltageV`, `loadOhm` as space-separated `re+imj`
 * values, optional `port N label` and `port N phaseCenterM` (three numbers));
 * then the header `port,thetaDeg,phiDeg,thetaReV,thetaImV,phiReV,phiImV` and
 * one row per port and grid direction, in any order. The θ and φ grids are the
 * distinct values found; every (port, θ, φ) must appear exactly once.
 * Angles are in degrees in both files (an edge of the library, like the
 * degree helpers); values are RMS volts, phase referred to the origin,
 * e^{+jωt}, as in {@link EmbeddedPatternSet}.
 * @module
 */
import { z } from 'zod';
import { ParseError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { parseJsonText } from '../internal/json.js';
import { embeddedPatternSet, type EmbeddedPatternSet, type PatternExcitation } from './patternSet.js';
import { NumericError } from '../errors.js';
import { matrixView } from '../linalg/cmatrix.js';

const FORMAT = 'phasewise-embedded-patterns';
const DEG = Math.PI / 180;

const finite = z.number().refine(Number.isFinite, { message: 'must be a finite number' });
const complexSchema = z.object({ re: finite, im: finite }).strict();
const excitationSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('open-circuit-current'), driveCurrentA: finite }).strict(),
  z.object({ kind: z.literal('short-circuit-voltage'), driveVoltageV: finite }).strict(),
  z.object({ kind: z.literal('loaded-voltage'), driveVoltageV: finite, loadOhm: z.array(complexSchema).min(1) }).strict(),
]);
const portSchema = z.object({
  label: z.string().optional(),
  phaseCenterM: z.tuple([finite, finite, finite]).optional(),
  thetaRe: z.array(finite), thetaIm: z.array(finite), phiRe: z.array(finite), phiIm: z.array(finite),
}).strict();
const fileSchema = z.object({
  format: z.literal(FORMAT),
  version: z.literal(1),
  frequencyHz: finite,
  excitation: excitationSchema,
  thetaDeg: z.array(finite).min(1),
  phiDeg: z.array(finite).min(1),
  ports: z.array(portSchema).min(1),
}).strict();

/** One-based line of the value at `path` in valid JSON text (0 if not found). */
function jsonLineOf(text: string, path: ReadonlyArray<PropertyKey>): number {
  let pos = 0;
  const ws = () => { while (pos < text.length && /\s/.test(text[pos])) pos++; };
  const skipString = () => { pos++; while (pos < text.length && text[pos] !== '"') { if (text[pos] === '\\') pos++; pos++; } pos++; };
  const readString = () => { const start = pos; skipString(); return JSON.parse(text.slice(start, pos)) as string; };
  const skipValue = (): void => {
    ws();
    const c = text[pos];
    if (c === '"') { skipString(); return; }
    if (c === '{' || c === '[') {
      const close = c === '{' ? '}' : ']';
      pos++; ws();
      if (text[pos] === close) { pos++; return; }
      for (;;) {
        if (c === '{') { ws(); skipString(); ws(); pos++; }
        skipValue(); ws();
        if (text[pos] === ',') { pos++; continue; }
        pos++; return;
      }
    }
    while (pos < text.length && !/[,}\]\s]/.test(text[pos])) pos++;
  };
  for (const key of path) {
    ws();
    const c = text[pos];
    if (c === '{') {
      pos++;
      let found = false;
      for (;;) {
        ws();
        if (text[pos] === '}') break;
        const k = readString(); ws(); pos++; // colon
        if (k === key) { found = true; break; }
        skipValue(); ws();
        if (text[pos] === ',') pos++;
      }
      if (!found) break;
    } else if (c === '[') {
      pos++;
      const idx = Number(key);
      for (let i = 0; i < idx; i++) { skipValue(); ws(); if (text[pos] === ',') pos++; }
    } else break;
  }
  ws();
  let line = 1;
  for (let i = 0; i < pos && i < text.length; i++) if (text[i] === '\n') line++;
  return line;
}

function fieldName(path: ReadonlyArray<PropertyKey>): string {
  return path.map((p, i) => (typeof p === 'number' ? `[${p}]` : i === 0 ? String(p) : `.${String(p)}`)).join('') || '(root)';
}

function columnMatrix(values: ReadonlyArray<{ re: number; im: number }>): CMatrix {
  const d = new Float64Array(2 * values.length);
  values.forEach((v, i) => { d[2 * i] = v.re; d[2 * i + 1] = v.im; });
  return matrixView(values.length, 1, d);
}

/** Wraps a validation failure of the assembled set as a ParseError. */
function assemble(parts: EmbeddedPatternSet, where: string): EmbeddedPatternSet {
  try {
    return embeddedPatternSet(parts);
  } catch (e) {
    if (e instanceof NumericError) throw new ParseError(`${where}: ${e.message}`);
    throw e;
  }
}

/**
 * Parses an embedded-pattern set from phasewise's JSON layout (version 1; see
 * the module notes for the layout).
 *
 * @param text - The JSON text.
 * @returns The validated set.
 * @throws {@link ParseError} with the line number and the field path (e.g.
 * `ports[2].thetaRe[17]`) of the first problem: JSON syntax, a missing or
 * unknown field, a wrong type, arrays of the wrong length, or an invalid grid.
 * @category Elements
 */
export function parsePatternJson(text: string): EmbeddedPatternSet {
  if (typeof text !== 'string') throw new ParseError(`expected the JSON text as a string, received ${typeof text}.`);
  const raw = parseJsonText(text, 'the pattern file');
  const r = fileSchema.safeParse(raw);
  if (!r.success) {
    const issue = r.error.issues[0];
    const path = issue.path as PropertyKey[];
    throw new ParseError(`field "${fieldName(path)}": ${issue.message}`, jsonLineOf(text, path));
  }
  const f = r.data;
  const nt = f.thetaDeg.length, np = f.phiDeg.length, m = nt * np, n = f.ports.length;
  const t = new Float64Array(2 * n * m), p = new Float64Array(2 * n * m);
  for (const [pi, port] of f.ports.entries()) {
    for (const key of ['thetaRe', 'thetaIm', 'phiRe', 'phiIm'] as const) {
      if (port[key].length !== m) {
        const path = ['ports', pi, key];
        throw new ParseError(`field "${fieldName(path)}": expected ${m} values (${nt} θ × ${np} φ, θ fastest), found ${port[key].length}.`, jsonLineOf(text, path));
      }
    }
    for (let c = 0; c < m; c++) {
      const o = 2 * (pi * m + c);
      t[o] = port.thetaRe[c]; t[o + 1] = port.thetaIm[c];
      p[o] = port.phiRe[c]; p[o + 1] = port.phiIm[c];
    }
  }
  const e = f.excitation;
  const excitation: PatternExcitation = e.kind === 'loaded-voltage'
    ? { kind: e.kind, driveVoltageV: e.driveVoltageV, loadOhm: columnMatrix(e.loadOhm) }
    : e;
  const hasLabels = f.ports.some((q) => q.label !== undefined);
  const hasCentres = f.ports.some((q) => q.phaseCenterM !== undefined);
  return assemble({
    frequencyHz: f.frequencyHz, portCount: n,
    thetaRad: Float64Array.from(f.thetaDeg, (v) => v * DEG), phiRad: Float64Array.from(f.phiDeg, (v) => v * DEG),
    thetaComponentV: { rows: n, cols: m, data: t }, phiComponentV: { rows: n, cols: m, data: p },
    excitation,
    ...(hasLabels ? { portLabels: f.ports.map((q, i) => q.label ?? `port ${i}`) } : {}),
    ...(hasCentres ? { phaseCentersM: Float64Array.from(f.ports.flatMap((q) => q.phaseCenterM ?? [0, 0, 0])) } : {}),
  }, 'JSON pattern file');
}

function excitationJson(e: PatternExcitation): unknown {
  if (e.kind !== 'loaded-voltage') return e;
  const loads = [];
  for (let i = 0; i < e.loadOhm.rows; i++) loads.push({ re: e.loadOhm.data[2 * i], im: e.loadOhm.data[2 * i + 1] });
  return { kind: e.kind, driveVoltageV: e.driveVoltageV, loadOhm: loads };
}

/**
 * Formats an embedded-pattern set in phasewise's JSON layout (version 1).
 * Numbers are written with full double precision (round trip exact).
 * @param set - The set.
 * @returns JSON text.
 * @throws {@link DomainError} / {@link DimensionError} if the set is invalid.
 * @category Elements
 */
export function formatPatternJson(set: EmbeddedPatternSet): string {
  embeddedPatternSet(set);
  const m = set.thetaRad.length * set.phiRad.length;
  const ports = [];
  for (let r = 0; r < set.portCount; r++) {
    const pick = (d: Float64Array, off: number) => Array.from({ length: m }, (_, c) => d[2 * (r * m + c) + off]);
    ports.push({
      ...(set.portLabels ? { label: set.portLabels[r] } : {}),
      ...(set.phaseCentersM ? { phaseCenterM: Array.from(set.phaseCentersM.subarray(3 * r, 3 * r + 3)) } : {}),
      thetaRe: pick(set.thetaComponentV.data, 0), thetaIm: pick(set.thetaComponentV.data, 1),
      phiRe: pick(set.phiComponentV.data, 0), phiIm: pick(set.phiComponentV.data, 1),
    });
  }
  return JSON.stringify({
    format: FORMAT, version: 1, frequencyHz: set.frequencyHz, excitation: excitationJson(set.excitation),
    thetaDeg: Array.from(set.thetaRad, (v) => v / DEG), phiDeg: Array.from(set.phiRad, (v) => v / DEG), ports,
  }, null, 1);
}

const CSV_COLUMNS = ['port', 'thetaDeg', 'phiDeg', 'thetaReV', 'thetaImV', 'phiReV', 'phiImV'] as const;

function parseComplexToken(tok: string, line: number, key: string): { re: number; im: number } {
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)([+-](?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)j$/.exec(tok);
  if (!m) throw new ParseError(`metadata "${key}": expected complex values like 50+0j or 73.1-42.5j, found "${tok}".`, line);
  return { re: Number(m[1]), im: Number(m[2]) };
}

/**
 * Parses an embedded-pattern set from phasewise's CSV layout (version 1; see
 * the module notes).
 *
 * @param text - The CSV text.
 * @returns The validated set (θ and φ grids sorted ascending).
 * @throws {@link ParseError} with the line number and column name of the first
 * problem: missing metadata or header, a non-numeric field, a wrong column
 * count, a duplicate (port, θ, φ) row, a missing grid point, or an invalid grid.
 * @category Elements
 */
export function parsePatternCsv(text: string): EmbeddedPatternSet {
  if (typeof text !== 'string') throw new ParseError(`expected the CSV text as a string, received ${typeof text}.`);
  const lines = text.split(/\r?\n/);
  const meta = new Map<string, { value: string; line: number }>();
  let headerLine = 0;
  const rows: { line: number; v: number[] }[] = [];
  for (let i = 0; i < lines.length; i++) {
    const raw = lines[i].trim();
    const ln = i + 1;
    if (raw === '') continue;
    if (raw.startsWith('#')) {
      const body = raw.slice(1).trim();
      const colon = body.indexOf(':');
      if (colon > 0) meta.set(body.slice(0, colon).trim(), { value: body.slice(colon + 1).trim(), line: ln });
      continue;
    }
    if (headerLine === 0) {
      const cols = raw.split(',').map((s) => s.trim());
      if (cols.length !== CSV_COLUMNS.length || cols.some((c, j) => c !== CSV_COLUMNS[j])) {
        throw new ParseError(`expected the header "${CSV_COLUMNS.join(',')}", found "${raw}".`, ln);
      }
      headerLine = ln;
      continue;
    }
    const fields = raw.split(',');
    if (fields.length !== CSV_COLUMNS.length) {
      throw new ParseError(`expected ${CSV_COLUMNS.length} comma-separated fields (${CSV_COLUMNS.join(', ')}), found ${fields.length}.`, ln);
    }
    const v = fields.map((s, j) => {
      const x = Number(s.trim());
      if (s.trim() === '' || !Number.isFinite(x)) throw new ParseError(`field ${j + 1} ("${CSV_COLUMNS[j]}"): expected a finite number, found "${s.trim()}".`, ln);
      return x;
    });
    if (!Number.isInteger(v[0]) || v[0] < 0) throw new ParseError(`field 1 ("port"): expected a port index 0, 1, 2, …, found "${fields[0].trim()}".`, ln);
    rows.push({ line: ln, v });
  }
  const version = meta.get(FORMAT);
  if (!version || version.value !== '1') {
    throw new ParseError(`expected the first metadata line "# ${FORMAT}: 1"${version ? `, found version "${version.value}"` : ''}.`, version?.line ?? 1);
  }
  if (headerLine === 0) throw new ParseError(`no header line "${CSV_COLUMNS.join(',')}" found.`, lines.length);
  const num = (key: string): number => {
    const e = meta.get(key);
    if (!e) throw new ParseError(`missing metadata line "# ${key}: <number>".`, headerLine);
    const x = Number(e.value);
    if (e.value === '' || !Number.isFinite(x)) throw new ParseError(`metadata "${key}": expected a finite number, found "${e.value}".`, e.line);
    return x;
  };
  const frequencyHz = num('frequencyHz');
  const kindEntry = meta.get('excitation');
  if (!kindEntry) throw new ParseError('missing metadata line "# excitation: open-circuit-current | short-circuit-voltage | loaded-voltage".', headerLine);
  let excitation: PatternExcitation;
  if (kindEntry.value === 'open-circuit-current') excitation = { kind: 'open-circuit-current', driveCurrentA: num('driveCurrentA') };
  else if (kindEntry.value === 'short-circuit-voltage') excitation = { kind: 'short-circuit-voltage', driveVoltageV: num('driveVoltageV') };
  else if (kindEntry.value === 'loaded-voltage') {
    const l = meta.get('loadOhm');
    if (!l) throw new ParseError('missing metadata line "# loadOhm: <re+imj> …" (one load per port).', headerLine);
    const loads = l.value.split(/\s+/).filter((s) => s !== '').map((s) => parseComplexToken(s, l.line, 'loadOhm'));
    excitation = { kind: 'loaded-voltage', driveVoltageV: num('driveVoltageV'), loadOhm: columnMatrix(loads) };
  } else {
    throw new ParseError(`metadata "excitation": expected open-circuit-current, short-circuit-voltage or loaded-voltage, found "${kindEntry.value}".`, kindEntry.line);
  }
  if (rows.length === 0) throw new ParseError('no data rows after the header.', headerLine);
  const thetaSet = new Set<number>(), phiSet = new Set<number>();
  let ports = 0;
  for (const r of rows) { thetaSet.add(r.v[1]); phiSet.add(r.v[2]); ports = Math.max(ports, r.v[0] + 1); }
  const thetaDeg = [...thetaSet].sort((a, b) => a - b), phiDeg = [...phiSet].sort((a, b) => a - b);
  const ti = new Map(thetaDeg.map((v, i) => [v, i])), pi = new Map(phiDeg.map((v, i) => [v, i]));
  const nt = thetaDeg.length, np = phiDeg.length, m = nt * np;
  const t = new Float64Array(2 * ports * m), p = new Float64Array(2 * ports * m);
  const seen = new Int32Array(ports * m);
  for (const r of rows) {
    const c = (pi.get(r.v[2]) as number) * nt + (ti.get(r.v[1]) as number);
    const slot = r.v[0] * m + c;
    if (seen[slot]) throw new ParseError(`duplicate row for port ${r.v[0]}, θ = ${r.v[1]}°, φ = ${r.v[2]}° (first given on line ${seen[slot]}).`, r.line);
    seen[slot] = r.line;
    t[2 * slot] = r.v[3]; t[2 * slot + 1] = r.v[4];
    p[2 * slot] = r.v[5]; p[2 * slot + 1] = r.v[6];
  }
  for (let s = 0; s < seen.length; s++) {
    if (!seen[s]) {
      const port = Math.floor(s / m), c = s % m;
      throw new ParseError(`missing row for port ${port}, θ = ${thetaDeg[c % nt]}°, φ = ${phiDeg[Math.floor(c / nt)]}°: every port needs every (θ, φ) of the grid (${nt} × ${np}).`, lines.length);
    }
  }
  const labels: string[] = [];
  let anyLabel = false;
  const centres = new Float64Array(3 * ports);
  let anyCentre = false;
  for (let r = 0; r < ports; r++) {
    const l = meta.get(`port ${r} label`);
    labels.push(l ? l.value : `port ${r}`);
    anyLabel ||= l !== undefined;
    const c = meta.get(`port ${r} phaseCenterM`);
    if (c) {
      const xyz = c.value.split(/\s+/).map(Number);
      if (xyz.length !== 3 || xyz.some((x) => !Number.isFinite(x))) throw new ParseError(`metadata "port ${r} phaseCenterM": expected three numbers "x y z" [m], found "${c.value}".`, c.line);
      centres.set(xyz, 3 * r);
      anyCentre = true;
    }
  }
  return assemble({
    frequencyHz, portCount: ports,
    thetaRad: Float64Array.from(thetaDeg, (v) => v * DEG), phiRad: Float64Array.from(phiDeg, (v) => v * DEG),
    thetaComponentV: { rows: ports, cols: m, data: t }, phiComponentV: { rows: ports, cols: m, data: p },
    excitation, ...(anyLabel ? { portLabels: labels } : {}), ...(anyCentre ? { phaseCentersM: centres } : {}),
  }, 'CSV pattern file');
}

/**
 * Formats an embedded-pattern set in phasewise's CSV layout (version 1), one
 * row per port and grid direction, full double precision.
 * @param set - The set.
 * @returns CSV text.
 * @throws {@link DomainError} / {@link DimensionError} if the set is invalid.
 * @category Elements
 */
export function formatPatternCsv(set: EmbeddedPatternSet): string {
  embeddedPatternSet(set);
  const out: string[] = [`# ${FORMAT}: 1`, `# frequencyHz: ${set.frequencyHz}`, `# excitation: ${set.excitation.kind}`];
  const e = set.excitation;
  if (e.kind === 'open-circuit-current') out.push(`# driveCurrentA: ${e.driveCurrentA}`);
  else {
    out.push(`# driveVoltageV: ${e.driveVoltageV}`);
    if (e.kind === 'loaded-voltage') {
      const toks = [];
      for (let i = 0; i < e.loadOhm.rows; i++) {
        const im = e.loadOhm.data[2 * i + 1];
        toks.push(`${e.loadOhm.data[2 * i]}${im < 0 || Object.is(im, -0) ? '-' : '+'}${Math.abs(im)}j`);
      }
      out.push(`# loadOhm: ${toks.join(' ')}`);
    }
  }
  for (let r = 0; r < set.portCount; r++) {
    if (set.portLabels) out.push(`# port ${r} label: ${set.portLabels[r]}`);
    if (set.phaseCentersM) out.push(`# port ${r} phaseCenterM: ${Array.from(set.phaseCentersM.subarray(3 * r, 3 * r + 3)).join(' ')}`);
  }
  out.push(CSV_COLUMNS.join(','));
  const nt = set.thetaRad.length, np = set.phiRad.length, m = nt * np;
  const t = set.thetaComponentV.data, p = set.phiComponentV.data;
  for (let r = 0; r < set.portCount; r++) {
    for (let c = 0; c < m; c++) {
      const o = 2 * (r * m + c);
      out.push(`${r},${set.thetaRad[c % nt] / DEG},${set.phiRad[Math.floor(c / nt)] / DEG},${t[o]},${t[o + 1]},${p[o]},${p[o + 1]}`);
    }
  }
  return out.join('\n') + '\n';
}
