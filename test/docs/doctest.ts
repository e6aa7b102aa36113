/**
 * The doc-test harness: finds the examples (the ```ts blocks of `@example` tags in src/ and of
 * README.md and docs/*.md), instruments the values their comments state, and runs them with
 * imports of 'phasewise', 'phasewise/plot' and 'phasewise/node' pointed at the sources.
 * Rules for writers: DEVELOPERS.md, "Examples are tests".
 */
import { mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import ts from 'typescript';
import { compareStated, parseAssertions, parseStated, type Stated } from './stated.js';

export const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

/** One example: its code, where it comes from, and whether it is marked as a fragment. */
export interface Example {
  /** `file:line` of the opening fence. */
  where: string;
  code: string;
  /** Marked ```` ```ts fragment ````: shown, not run. */
  fragment: boolean;
}

const FENCE = /^```(\S*)([^\n]*)\n([\s\S]*?)^```/gm;

function fenced(text: string, file: string, lineOffset: (index: number) => number): Example[] {
  const out: Example[] = [];
  for (const m of text.matchAll(FENCE)) {
    if (m[1] !== 'ts' && m[1] !== 'typescript') continue;
    const info = m[2].trim();
    if (info !== '' && info !== 'fragment') throw new Error(`${file}:${lineOffset(m.index)}: unknown fence marker "${info}" (use \`\`\`ts or \`\`\`ts fragment)`);
    out.push({ where: `${file}:${lineOffset(m.index)}`, code: m[3], fragment: info === 'fragment' });
  }
  return out;
}

const lineOf = (text: string, index: number): number => text.slice(0, index).split('\n').length;

/** The ```ts blocks of a Markdown file (path relative to the repository root), in order. */
export function markdownExamples(file: string): Example[] {
  const text = readFileSync(join(root, file), 'utf8');
  return fenced(text, file, (i) => lineOf(text, i));
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).sort().flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? sourceFiles(p) : p.endsWith('.ts') ? [p] : [];
  });
}

/** The ```ts blocks under every `@example` tag of every TSDoc comment in src/. */
export function tsdocExamples(): Example[] {
  const out: Example[] = [];
  for (const path of sourceFiles(join(root, 'src'))) {
    const text = readFileSync(path, 'utf8');
    const file = relative(root, path);
    for (const doc of text.matchAll(/\/\*\*[\s\S]*?\*\//g)) {
      const body = doc[0].split('\n').map((l) => l.replace(/^\s*\/?\*+\/?\s?/, '').replace(/\s*\*\/$/, ''));
      const startLine = lineOf(text, doc.index);
      let inExample = false;
      for (let i = 0; i < body.length; i++) {
        if (/^@\w+/.test(body[i])) inExample = body[i].startsWith('@example');
        if (!inExample || !body[i].startsWith('```')) continue;
        const end = body.findIndex((l, k) => k > i && l.startsWith('```'));
        if (end < 0) throw new Error(`${file}:${startLine + i}: unclosed fence in @example`);
        const chunk = body.slice(i, end + 1).join('\n') + '\n';
        out.push(...fenced(chunk, file, () => startLine + i));
        i = end;
      }
    }
  }
  return out;
}

/** One stated value to check, and where it stands. */
export interface Check {
  id: number;
  where: string;
  label: string;
  stated: Stated;
}

/** The result of instrumenting an example. */
export interface Instrumented {
  code: string;
  checks: Check[];
  /** Comments after a call that hold digits but no stated value the grammar reads. */
  problems: string[];
  /** Comments holding digits that state nothing the harness checks (prose; listed for review). */
  unchecked: string[];
}

export const STATED_HOOK = '__phasewiseStated';
let nextId = 0;

function declaredNames(sf: ts.SourceFile): Set<string> {
  const names = new Set<string>();
  const bind = (n: ts.BindingName): void => {
    if (ts.isIdentifier(n)) names.add(n.text);
    else for (const e of n.elements) if (!ts.isOmittedExpression(e)) bind(e.name);
  };
  const visit = (node: ts.Node): void => {
    if (ts.isVariableDeclaration(node) || ts.isParameter(node)) bind(node.name);
    if ((ts.isFunctionDeclaration(node) || ts.isClassDeclaration(node)) && node.name) names.add(node.name.text);
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return names;
}

function listedStatements(sf: ts.SourceFile): ts.Statement[] {
  const out: ts.Statement[] = [];
  const visit = (node: ts.Node): void => {
    if ((ts.isSourceFile(node) || ts.isBlock(node) || ts.isModuleBlock(node) || ts.isCaseClause(node) || ts.isDefaultClause(node))) out.push(...node.statements);
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return out;
}

function comments(sf: ts.SourceFile): { pos: number; text: string }[] {
  // Comments live in the trivia before tokens: read the leading trivia of every leaf token.
  const found = new Map<number, string>();
  const visit = (node: ts.Node): void => {
    const kids = node.getChildren(sf);
    if (kids.length === 0 || node.kind === ts.SyntaxKind.EndOfFileToken) {
      const ranges = [...ts.getLeadingCommentRanges(sf.text, node.getFullStart()) ?? [], ...ts.getTrailingCommentRanges(sf.text, node.end) ?? []];
      for (const r of ranges) {
        if (r.kind === ts.SyntaxKind.SingleLineCommentTrivia) found.set(r.pos, sf.text.slice(r.pos + 2, r.end).trim());
      }
    }
    for (const k of kids) visit(k);
  };
  visit(sf);
  return [...found].sort((a, b) => a[0] - b[0]).map(([pos, text]) => ({ pos, text }));
}

/**
 * Rewrites an example so that every value its comments state is handed to the global hook
 * `__phasewiseStated(id, value)`:
 * - a comment after an expression statement, on its line (or on the next line, starting with
 *   `≈` or `→`), states the statement's value
 *   (`expr; // ≈ 1.5`; a comma expression `a, b; // 1, 2` states each operand), or holds
 *   `path: value` assertions; any other such comment with a digit is a problem;
 * - a comment after a declaration, on its line, starting with `≈`, `=` or `→`, states the
 *   declared variable;
 * - any comment of `path: value` / `path = value` assertions whose path starts at a variable
 *   the example declares states that path after the statement before it.
 */
export function instrument(code: string, where: string): Instrumented {
  const sf = ts.createSourceFile('example.ts', code, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const declared = declaredNames(sf);
  const statements = listedStatements(sf);
  const edits: { pos: number; end: number; text: string }[] = [];
  const checks: Check[] = [];
  const problems: string[] = [];
  const unchecked: string[] = [];
  const hook = (id: number, expr: string): string => `globalThis.${STATED_HOOK}(${id}, ${expr})`;
  const add = (label: string, stated: Stated, line: number): number => {
    const id = nextId++;
    checks.push({ id, where: `${where} (example line ${line})`, label, stated });
    return id;
  };
  const wrapped = new Set<ts.Statement>();
  for (const c of comments(sf)) {
    let before: ts.Statement | undefined;
    for (const s of statements) if (s.end <= c.pos && (!before || s.end > before.end)) before = s;
    if (!before) continue;
    const line = sf.getLineAndCharacterOfPosition(c.pos).line + 1;
    const trailing = !code.slice(before.end, c.pos).includes('\n');
    const assertions = parseAssertions(c.text).filter((a) => declared.has(a.path.split(/[.[]/)[0]));
    const insertAfter = (text: string): void => { edits.push({ pos: before!.end, end: before!.end, text: `;${text};` }); };
    // `≈ value` on the line after an expression statement states that statement's value.
    const nextLine = !trailing && /^[ \t]*\r?\n[ \t]*$/.test(code.slice(before.end, c.pos)) && /^[≈→]/.test(c.text);
    if ((trailing || nextLine) && ts.isExpressionStatement(before) && !wrapped.has(before)) {
      const operands: ts.Expression[] = [];
      const flatten = (e: ts.Expression): void => {
        if (ts.isBinaryExpression(e) && e.operatorToken.kind === ts.SyntaxKind.CommaToken) { flatten(e.left); flatten(e.right); } else operands.push(e);
      };
      flatten(before.expression);
      // A leading `label =` or `label:` that names nothing declared is commentary (`Γ = 0.3 + 0.1j`).
      const label = /^([\p{L}_][\p{L}\p{N}_₀-₉']*)\s*(?:[=:]\s*(?=[≈\d+\-−[{'A-Z])|(?=≈))/u.exec(c.text);
      const text = label && !declared.has(label[1].split(/[.[]/)[0]) && assertions.length === 0 ? c.text.slice(label[0].length) : c.text;
      const stated = assertions.length === 0 ? parseStated(text, operands.length) : null;
      if (stated) {
        const ids = stated.map((s, k) => add(operands[k].getText(sf), s, line));
        const expr = before.expression;
        const wrappedText = operands.length === 1
          ? hook(ids[0], `(${expr.getText(sf)})`)
          : operands.map((o, k) => hook(ids[k], `(${o.getText(sf)})`)).join(', ');
        edits.push({ pos: expr.getStart(sf), end: expr.end, text: wrappedText });
        wrapped.add(before);
        continue;
      }
      if (assertions.length === 0 && /\d/.test(c.text)) {
        problems.push(`${where} (example line ${line}): "// ${c.text}" after a call states no value the harness reads; write it as \`// ≈ value\`, \`// path: value\` or move the prose off the call's line.`);
        continue;
      }
    } else if (trailing && ts.isVariableStatement(before) && /^[≈=→]/.test(c.text)) {
      const decl = before.declarationList.declarations.at(-1)!;
      const stated = ts.isIdentifier(decl.name) ? parseStated(c.text) : null;
      if (stated) {
        insertAfter(hook(add(decl.name.getText(sf), stated[0], line), decl.name.getText(sf)));
        continue;
      }
      problems.push(`${where} (example line ${line}): "// ${c.text}" after a declaration is not a stated value the harness reads.`);
      continue;
    }
    for (const a of assertions) insertAfter(hook(add(a.path, a.stated, line), `(${a.path})`));
    if (assertions.length === 0 && /\d/.test(c.text)) unchecked.push(`${where} (example line ${line}): // ${c.text}`);
  }
  edits.sort((a, b) => b.pos - a.pos);
  let out = code;
  for (const e of edits) out = out.slice(0, e.pos) + e.text + out.slice(e.end);
  return { code: out, checks, problems, unchecked };
}

const ENTRIES = [['phasewise', 'index.ts'], ['phasewise/plot', 'plot/index.ts'], ['phasewise/node', 'node.ts']] as const;
const srcUrl = (p: string): string => pathToFileURL(join(root, 'src', p)).href;

/**
 * Makes example code a module: named imports from the package are gathered into one import
 * per entry point (guides often show fragments without imports, or repeat them per block);
 * namespace imports are pointed at the sources.
 */
async function asModule(code: string): Promise<string> {
  let body = code.replace(/import\s+(type\s+)?\{[^}]*\}\s+from\s+'phasewise(\/plot|\/node)?';?\n?/g, '');
  for (const [spec, file] of ENTRIES) body = body.split(`from '${spec}'`).join(`from '${srcUrl(file)}'`);
  const taken = new Set<string>();
  const imports: string[] = [];
  for (const [, file] of ENTRIES) {
    const mod = await import(srcUrl(file));
    const names = Object.keys(mod).filter((k) => !taken.has(k) && new RegExp(`(?<![\\w.$])${k.replace(/\$/g, '\\$')}(?![\\w$])`).test(body));
    names.forEach((k) => taken.add(k));
    if (names.length > 0) imports.push(`import { ${names.join(', ')} } from '${srcUrl(file)}';`);
  }
  return imports.join('\n') + '\n' + body;
}

/**
 * Runs example code as a module; `log` receives what it prints with console.log.
 * @returns the values handed to the stated-value hook, by check id.
 */
export async function runExample(code: string, name: string, log: (line: string) => void = () => {}): Promise<Map<number, unknown[]>> {
  const dir = join(root, 'node_modules', '.cache', 'phasewise-snippets');
  mkdirSync(dir, { recursive: true });
  const file = join(dir, `${name.replace(/\W+/g, '-')}-${process.pid}.ts`);
  writeFileSync(file, await asModule(code));
  const seen = new Map<number, unknown[]>();
  const g = globalThis as unknown as Record<string, unknown>;
  g[STATED_HOOK] = (id: number, value: unknown) => {
    if (!seen.has(id)) seen.set(id, []);
    seen.get(id)!.push(value);
    return value;
  };
  const original = console.log;
  console.log = (...a: unknown[]) => log(a.join(' '));
  try {
    await import(pathToFileURL(file).href);
  } finally {
    console.log = original;
    delete g[STATED_HOOK];
    rmSync(file, { force: true });
  }
  return seen;
}

/** Checks every stated value against what the run handed to the hook; returns the mismatches. */
export function verify(checks: Check[], seen: Map<number, unknown[]>): string[] {
  const out: string[] = [];
  for (const c of checks) {
    const values = seen.get(c.id);
    if (!values) { out.push(`${c.where}: the stated value of ${c.label} was never reached`); continue; }
    for (const v of values) {
      const m = compareStated(v, c.stated, c.label);
      if (m) { out.push(`${c.where}: ${m}`); break; }
    }
  }
  return out;
}
