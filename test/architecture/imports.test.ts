/**
 * The one-way flow of DEVELOPERS.md, checked on the source: a stage imports only stages to its
 * left and the leaves; the leaves import only leaves; `src/stats/` imports nothing else from src/;
 * and no files import each other in a circle (type-only imports included, since a circle of types
 * is a circle of meaning too).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, normalize, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const SRC = join(import.meta.dirname, '..', '..', 'src');

/** Leaves: every stage may import them; they import only leaves. */
const LEAVES = new Set(['common', 'text', 'parallel']);
/** The stages, left to right; files directly in src/ (build.ts, progress.ts) and cli/ come last. */
const STAGES = ['ingest', 'stats', 'model', 'wording', 'charts', 'render', 'site', '.', 'cli'];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
    entry.isDirectory() ? sourceFiles(join(dir, entry.name)) : /\.(ts|js)$/.test(entry.name) ? [join(dir, entry.name)] : [],
  );
}

/** Relative module specifiers of a file: static imports and re-exports, side-effect imports, dynamic imports with a literal. */
export function importsOf(text: string): string[] {
  const found: string[] = [];
  const patterns = [/\bfrom\s+'(\.[^']*)'/g, /\bimport\s+'(\.[^']*)'/g, /\bimport\(\s*'(\.[^']*)'\s*\)/g];
  for (const pattern of patterns) for (const match of text.matchAll(pattern)) found.push(match[1] as string);
  return found;
}

const folderOf = (file: string) => {
  const rel = relative(SRC, file);
  return rel.includes('/') ? (rel.split('/')[0] as string) : '.';
};

/** Why importing `to` from `from` breaks the flow, or null when it does not. */
export function arrowProblem(from: string, to: string): string | null {
  if (from === to) return null;
  if (LEAVES.has(from)) return LEAVES.has(to) ? null : `leaf ${from}/ imports stage ${to}/`;
  if (from === 'stats') return `stats/ imports ${to}/ (it imports nothing else from src/)`;
  if (LEAVES.has(to)) return null;
  const [a, b] = [STAGES.indexOf(from), STAGES.indexOf(to)];
  if (a < 0 || b < 0) return `${a < 0 ? from : to}/ is in no layer of the flow`;
  return b < a ? null : `${from}/ imports ${to}/, a stage to its right`;
}

/** Every circle of the graph (Tarjan's strongly connected components of more than one file, or a file importing itself). */
export function circles(graph: Map<string, string[]>): string[][] {
  let index = 0;
  const order = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const found: string[][] = [];
  const visit = (node: string) => {
    order.set(node, index);
    low.set(node, index++);
    stack.push(node);
    onStack.add(node);
    for (const next of graph.get(node) ?? []) {
      if (!order.has(next)) {
        visit(next);
        low.set(node, Math.min(low.get(node) as number, low.get(next) as number));
      } else if (onStack.has(next)) low.set(node, Math.min(low.get(node) as number, order.get(next) as number));
    }
    if (low.get(node) === order.get(node)) {
      const component: string[] = [];
      let member: string;
      do {
        member = stack.pop() as string;
        onStack.delete(member);
        component.push(member);
      } while (member !== node);
      if (component.length > 1 || (graph.get(node) ?? []).includes(node)) found.push(component.sort());
    }
  };
  for (const node of graph.keys()) if (!order.has(node)) visit(node);
  return found;
}

describe('the one-way flow of the source', () => {
  const files = sourceFiles(SRC);
  const graph = new Map<string, string[]>();
  for (const file of files) {
    const targets = importsOf(readFileSync(file, 'utf8')).map((specifier) => normalize(join(dirname(file), specifier)));
    graph.set(
      relative(SRC, file),
      targets.map((target) => relative(SRC, target)),
    );
  }

  it('reads the imports of every source file, including multi-line and type-only ones', () => {
    expect(files.length).toBeGreaterThan(50);
    expect(
      importsOf(
        "import type {\n  A,\n  B,\n} from '../model/index.ts';\nexport { c } from './c.ts';\nimport './side.js';\nawait import('../x.ts');\nimport x from 'node:fs';",
      ),
    ).toEqual(['../model/index.ts', './c.ts', './side.js', '../x.ts']);
  });

  it('no folder imports from a folder to its right, and the leaves import only leaves', () => {
    const wrong: string[] = [];
    for (const [file, targets] of graph) {
      for (const target of targets) {
        // Data outside src/ (the catalogues' JSON, for their key type) is no stage.
        if (target.startsWith('..')) {
          if (!target.endsWith('.json')) wrong.push(`${file} → ${target}: imports code from outside src/`);
          continue;
        }
        const problem = arrowProblem(folderOf(join(SRC, file)), folderOf(join(SRC, target)));
        if (problem) wrong.push(`${file} → ${target}: ${problem}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it('the arrow rule itself catches each kind of wrong arrow (mutations)', () => {
    expect(arrowProblem('ingest', 'site')).toMatch(/to its right/);
    expect(arrowProblem('render', 'site')).toMatch(/to its right/);
    expect(arrowProblem('parallel', 'model')).toMatch(/leaf parallel/);
    expect(arrowProblem('common', 'ingest')).toMatch(/leaf common/);
    expect(arrowProblem('stats', 'text')).toMatch(/stats/);
    expect(arrowProblem('model', 'ingest')).toBeNull();
    expect(arrowProblem('ingest', 'parallel')).toBeNull();
    expect(arrowProblem('cli', 'site')).toBeNull();
  });

  it('no files import each other in a circle', () => {
    expect(circles(graph)).toEqual([]);
    // The detector finds a circle when there is one.
    expect(
      circles(
        new Map([
          ['a', ['b']],
          ['b', ['c']],
          ['c', ['a']],
          ['d', ['a']],
        ]),
      ),
    ).toEqual([['a', 'b', 'c']]);
    expect(circles(new Map([['a', ['a']]]))).toEqual([['a']]);
  });
});
