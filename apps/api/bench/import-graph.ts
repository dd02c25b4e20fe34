/**
 * The API's import graph by folder: how many folders, how deep their layering goes and how many
 * imports run back up against it. Reads the imports of every non-test file under apps/api/src with
 * the TypeScript compiler's own pre-processor (type-only imports count: they tie the folders as
 * much as the others), resolves the relative ones and prints one table.
 *
 *   npx tsx apps/api/bench/import-graph.ts [--src apps/api/src] [--json]
 *
 * A folder is the first folder under src/ (files directly in src/ are "(root)"). Measured:
 * - folders and folder edges (A imports from B at least once);
 * - cycles: groups of folders that reach each other (strongly connected components, Tarjan), their
 *   sizes, and the edges inside them;
 * - back edges: the edges a depth-first walk from (root), then the other folders by name, finds
 *   closing a cycle, and the file imports running along them ("imports running back up");
 * - levels: the longest chain of folders once the cycles are cut at the back edges (a folder that
 *   imports no other folder is level 1);
 * - files in import cycles (strongly connected components of the file graph with 2 or more files).
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import ts from 'typescript';

function argValue(name: string): string | undefined {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

const SRC = resolve(argValue('--src') ?? join(__dirname, '..', 'src'));
const ROOT = '(root)';

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...sourceFiles(path));
    else if (/\.ts$/.test(name) && !/\.(spec|e2e-spec|d)\.ts$/.test(name)) out.push(path);
  }
  return out.sort();
}

function resolveImport(from: string, spec: string): string | null {
  if (!spec.startsWith('.')) return null;
  const base = resolve(dirname(from), spec);
  for (const candidate of [`${base}.ts`, join(base, 'index.ts')]) {
    if (existsSync(candidate)) return candidate;
  }
  return null;
}

function folderOf(file: string): string {
  const parts = relative(SRC, file).split(sep);
  return parts.length > 1 ? parts[0] : ROOT;
}

/** Tarjan's strongly connected components. */
function components(nodes: string[], edges: Map<string, Set<string>>): string[][] {
  let index = 0;
  const indices = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const result: string[][] = [];
  const visit = (v: string): void => {
    indices.set(v, index);
    low.set(v, index);
    index++;
    stack.push(v);
    onStack.add(v);
    for (const w of edges.get(v) ?? []) {
      if (!indices.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) {
        low.set(v, Math.min(low.get(v)!, indices.get(w)!));
      }
    }
    if (low.get(v) === indices.get(v)) {
      const group: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        group.push(w);
      } while (w !== v);
      result.push(group.sort());
    }
  };
  for (const v of nodes) if (!indices.has(v)) visit(v);
  return result;
}

const files = sourceFiles(SRC);
const fileEdges = new Map<string, Set<string>>();
/** Folder edge "a→b" → number of file imports along it. */
const folderImports = new Map<string, number>();
const folders = new Set<string>(files.map(folderOf));
for (const file of files) {
  const info = ts.preProcessFile(readFileSync(file, 'utf8'), true, true);
  const targets = new Set<string>();
  for (const ref of info.importedFiles) {
    const target = resolveImport(file, ref.fileName);
    if (target && target.startsWith(SRC + sep) && target !== file) targets.add(target);
  }
  fileEdges.set(file, targets);
  for (const target of targets) {
    const a = folderOf(file);
    const b = folderOf(target);
    if (a !== b) folderImports.set(`${a}→${b}`, (folderImports.get(`${a}→${b}`) ?? 0) + 1);
  }
}

const folderEdges = new Map<string, Set<string>>();
for (const key of folderImports.keys()) {
  const [a, b] = key.split('→');
  if (!folderEdges.has(a)) folderEdges.set(a, new Set());
  folderEdges.get(a)!.add(b);
}
const order = [ROOT, ...[...folders].filter((f) => f !== ROOT).sort()].filter((f) => folders.has(f));
for (const set of folderEdges.values()) {
  const sorted = [...set].sort();
  set.clear();
  sorted.forEach((f) => set.add(f));
}

// Depth-first walk: an edge to a folder still on the walk's path closes a cycle (a back edge).
const state = new Map<string, 'open' | 'done'>();
const backEdges: string[] = [];
const walk = (v: string): void => {
  state.set(v, 'open');
  for (const w of folderEdges.get(v) ?? []) {
    if (state.get(w) === 'open') backEdges.push(`${v}→${w}`);
    else if (!state.has(w)) walk(w);
  }
  state.set(v, 'done');
};
for (const f of order) if (!state.has(f)) walk(f);

// Levels on the graph without its back edges (a DAG now).
const back = new Set(backEdges);
const level = new Map<string, number>();
const levelOf = (v: string): number => {
  const known = level.get(v);
  if (known !== undefined) return known;
  let deepest = 0;
  for (const w of folderEdges.get(v) ?? [])
    if (!back.has(`${v}→${w}`)) deepest = Math.max(deepest, levelOf(w));
  level.set(v, deepest + 1);
  return deepest + 1;
};
const levels = Math.max(...order.map(levelOf));

const folderCycles = components(order, folderEdges).filter((c) => c.length > 1);
const inCycle = new Map<string, number>();
folderCycles.forEach((c, i) => c.forEach((f) => inCycle.set(f, i)));
const edgesInCycles = [...folderImports.keys()].filter((key) => {
  const [a, b] = key.split('→');
  return inCycle.has(a) && inCycle.get(a) === inCycle.get(b);
}).length;
const fileCycles = components(files, fileEdges).filter((c) => c.length > 1);
const backImports = backEdges.reduce((n, e) => n + folderImports.get(e)!, 0);

const summary = {
  files: files.length,
  folders: folders.size,
  folderEdges: folderImports.size,
  levels,
  backEdges: backEdges.length,
  importsRunningBackUp: backImports,
  folderCycles: folderCycles.length,
  largestFolderCycle: Math.max(0, ...folderCycles.map((c) => c.length)),
  folderEdgesInCycles: edgesInCycles,
  fileCycles: fileCycles.length,
  filesInCycles: fileCycles.reduce((n, c) => n + c.length, 0),
};

if (process.argv.includes('--json')) {
  console.log(JSON.stringify({ ...summary, backEdgeList: backEdges, folderCycles, fileCycles }, null, 2));
} else {
  console.log(`Import graph of ${relative(process.cwd(), SRC) || '.'} (tests left out)\n`);
  console.log('| measure | value |');
  console.log('| --- | ---: |');
  for (const [key, value] of Object.entries(summary)) console.log(`| ${key} | ${value} |`);
  console.log('\nBack edges (file imports along each):');
  for (const e of backEdges) console.log(`  ${e} (${folderImports.get(e)})`);
  console.log('\nFolder cycles:');
  for (const c of folderCycles) console.log(`  ${c.length}: ${c.join(', ')}`);
  console.log('\nFile cycles:');
  for (const c of fileCycles) console.log(`  ${c.map((f) => relative(SRC, f)).join(', ')}`);
}
