/**
 * A small notebook executor for the example notebooks (examples/notebooks/*.ipynb, nbformat 4):
 * runs every code cell in order, as a kernel would, against the BUILT package imported by name
 * (`phasewise` refers to itself, so `npm run build` first), and records each cell's outputs in
 * nbformat's own shapes:
 * - console output → `stream` outputs (stdout, stderr), consecutive writes merged;
 * - the value of a cell's last expression statement → `execute_result`: the MIME bundle of
 *   `Symbol.for('Jupyter.display')` when the value has one (a phasewise `Figure`), else
 *   `text/plain` from Node's `util.inspect` (what a Node kernel prints);
 * - `display.svg(…)` / `display.html(…)` of the `tslab` module (a stand-in module takes its
 *   place here) → `display_data`.
 * Cells are TypeScript, transpiled by the TypeScript compiler; all cells form one ES module, so
 * top-level `await` works and declarations carry from cell to cell. The module runs in a child
 * Node process whose working directory is the notebook's folder (relative file names resolve
 * as in Jupyter). No Python and no Jupyter are needed.
 * @module
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

/** The repository root (the package the notebooks import by name). */
export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
/** Where the example notebooks live. */
export const NOTEBOOK_DIR = join(ROOT, 'examples', 'notebooks');

/** One output of a code cell (nbformat 4). */
export type NotebookOutput =
  | { output_type: 'stream'; name: 'stdout' | 'stderr'; text: string | string[] }
  | { output_type: 'execute_result'; data: Record<string, string | string[]>; metadata: Record<string, unknown>; execution_count: number | null }
  | { output_type: 'display_data'; data: Record<string, string | string[]>; metadata: Record<string, unknown> }
  | { output_type: 'error'; ename: string; evalue: string; traceback: string[] };

/** A notebook cell (nbformat 4). */
export interface NotebookCell {
  cell_type: 'code' | 'markdown' | 'raw';
  source: string | string[];
  metadata: Record<string, unknown>;
  outputs?: NotebookOutput[];
  execution_count?: number | null;
  id?: string;
}

/** A notebook (nbformat 4). */
export interface Notebook {
  nbformat: number;
  nbformat_minor: number;
  metadata: { kernelspec?: { name: string; display_name: string; language?: string }; language_info?: Record<string, unknown>; [k: string]: unknown };
  cells: NotebookCell[];
}

/** The text of a multi-line notebook field (a string or a list of lines). */
export function joined(text: string | string[] | undefined): string {
  return Array.isArray(text) ? text.join('') : text ?? '';
}

/** Splits text into nbformat's list of lines (each keeping its newline). */
export function lines(text: string): string[] {
  return text.split(/(?<=\n)/).filter((l) => l.length > 0);
}

/** Reads and checks a notebook file. */
export function readNotebook(path: string): Notebook {
  const nb = JSON.parse(readFileSync(path, 'utf8')) as Notebook;
  if (nb.nbformat !== 4 || !Array.isArray(nb.cells)) throw new Error(`${basename(path)}: not an nbformat 4 notebook`);
  return nb;
}

/** The cells' code as one TypeScript module, each last expression handed to the recorder. */
export function notebookModule(nb: Notebook, shim: string): string {
  const parts: string[] = [];
  nb.cells.forEach((cell, k) => {
    if (cell.cell_type !== 'code') return;
    let code = joined(cell.source);
    const sf = ts.createSourceFile(`cell${k}.ts`, code, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
    const last = sf.statements.at(-1);
    if (last && ts.isExpressionStatement(last)) {
      const e = last.expression;
      code = `${code.slice(0, e.getStart(sf))}globalThis.__notebook.result(${k}, (${e.getText(sf)}))${code.slice(e.end)}`;
    }
    code = code.replace(/from\s+(['"])tslab\1/g, `from ${JSON.stringify(shim)}`);
    parts.push(`globalThis.__notebook.cell(${k});\n${code}\n`);
  });
  return ts.transpileModule(parts.join('\n'), {
    compilerOptions: { module: ts.ModuleKind.ESNext, target: ts.ScriptTarget.ES2022, sourceMap: false },
  }).outputText;
}

/** The stand-in for tslab's `display` API: each call becomes a display_data output. */
const TSLAB_SHIM = `const put = (mime) => (content) => globalThis.__notebook.display({ [mime]: content });
export const display = { svg: put('image/svg+xml'), html: put('text/html'), markdown: put('text/markdown'), text: put('text/plain'),
  javascript: put('application/javascript'), latex: put('text/latex'), raw: (mime, content) => put(mime)(content) };
export function newDisplay() { return display; }
`;

/** The child process: records outputs while it imports the notebook module. */
const RUNNER = `import { format, inspect } from 'node:util';
import { writeFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
const [, , modulePath, outPath] = process.argv;
const cells = {};
let current = -1;
const outputs = (k) => (cells[k] ??= []);
function stream(name, text) {
  const o = outputs(current), last = o[o.length - 1];
  if (last && last.output_type === 'stream' && last.name === name) last.text += text;
  else o.push({ output_type: 'stream', name, text });
}
for (const [m, name] of [['log', 'stdout'], ['info', 'stdout'], ['warn', 'stderr'], ['error', 'stderr']]) console[m] = (...a) => stream(name, format(...a) + '\\n');
const DISPLAY = Symbol.for('Jupyter.display');
function bundle(v) {
  if (v !== null && typeof v === 'object' && typeof v[DISPLAY] === 'function') return { 'text/plain': inspect(v), ...v[DISPLAY]() };
  return { 'text/plain': inspect(v) };
}
globalThis.__notebook = {
  cell(k) { current = k; outputs(k); },
  result(k, v) {
    if (v !== undefined) outputs(k).push({ output_type: 'execute_result', data: bundle(v), metadata: {}, execution_count: null });
    return v;
  },
  display(data) { outputs(current).push({ output_type: 'display_data', data, metadata: {} }); },
};
let error = null;
try {
  await import(pathToFileURL(modulePath).href);
} catch (e) {
  error = { cell: current, ename: e?.name ?? 'Error', evalue: e?.message ?? String(e), traceback: String(e?.stack ?? e).split('\\n') };
}
writeFileSync(outPath, JSON.stringify({ cells, error }));
`;

/** The outputs of one run: by notebook cell index, and the first error (which stops the run). */
export interface NotebookRun {
  /** Outputs by cell index (code cells that ran). */
  outputs: Map<number, NotebookOutput[]>;
  /** The error that stopped the run, with the cell it happened in. */
  error: { cell: number; ename: string; evalue: string; traceback: string[] } | null;
}

/**
 * Executes every code cell of a notebook in order against the built package.
 * @param path - The .ipynb file.
 * @returns The outputs per cell and the error that stopped the run, if any.
 */
export function executeNotebook(path: string): NotebookRun {
  const nb = readNotebook(path);
  // Inside the package (outside node_modules), so that `import 'phasewise'` resolves to the package itself.
  const dir = join(ROOT, '.notebook-run', `${basename(path, '.ipynb')}-${process.pid}-${Date.now()}`);
  mkdirSync(dir, { recursive: true });
  try {
    writeFileSync(join(dir, 'tslab.mjs'), TSLAB_SHIM);
    writeFileSync(join(dir, 'runner.mjs'), RUNNER);
    writeFileSync(join(dir, 'notebook.mjs'), notebookModule(nb, './tslab.mjs'));
    const result = spawnSync(process.execPath, [join(dir, 'runner.mjs'), join(dir, 'notebook.mjs'), join(dir, 'out.json')], {
      cwd: dirname(resolve(path)), encoding: 'utf8', timeout: 300_000,
    });
    let parsed: { cells: Record<string, NotebookOutput[]>; error: NotebookRun['error'] };
    try {
      parsed = JSON.parse(readFileSync(join(dir, 'out.json'), 'utf8'));
    } catch {
      throw new Error(`${basename(path)}: the notebook process ended without results (status ${result.status}): ${result.stderr}`);
    }
    const outputs = new Map<number, NotebookOutput[]>();
    for (const [k, o] of Object.entries(parsed.cells)) {
      outputs.set(Number(k), o.map((x) => (x.output_type === 'execute_result' ? { ...x, execution_count: Number(k) } : x)));
    }
    return { outputs, error: parsed.error };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * The notebook with the outputs of a run stored in its code cells (execution counts numbered
 * 1, 2, … over the code cells, as a fresh kernel would).
 */
export function withOutputs(nb: Notebook, run: NotebookRun): Notebook {
  let count = 0;
  const cells = nb.cells.map((cell, k) => {
    if (cell.cell_type !== 'code') return cell;
    count++;
    const outputs = (run.outputs.get(k) ?? []).map((o): NotebookOutput => {
      if (o.output_type === 'stream') return { ...o, text: lines(joined(o.text)) };
      if (o.output_type === 'error') return o;
      const data = Object.fromEntries(Object.entries(o.data).map(([mime, v]) => [mime, mime.startsWith('text/') ? lines(joined(v)) : joined(v)]));
      return o.output_type === 'execute_result' ? { ...o, data, execution_count: count } : { ...o, data };
    });
    return { ...cell, execution_count: count, outputs };
  });
  return { ...nb, cells };
}
