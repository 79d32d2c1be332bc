// No import cycle between folders (part of npm run lint).
//
// For each source tree in ROOTS, every folder directly inside it is one node (the files directly
// in the tree are one more, "(top level)"), and folder A depends on folder B when any file in A
// imports any file in B. That graph must have no cycle. A file-level cycle check does not see
// this: alerts/x.ts importing forecasts/y.ts while forecasts/z.ts imports alerts/w.ts is a cycle
// between the two folders although no file cycle exists. dependency-cruiser resolves the imports
// (type-only ones too); the graph is collapsed here and its strongly connected components found
// with Tarjan's algorithm (Tarjan 1972). Test files are left out: nothing imports them.
//
// Run: node scripts/folder-cycles.mjs [root...]   (no roots: the ROOTS below)
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { cruise } from 'dependency-cruiser';

/** Source trees whose folders must not import each other in a cycle (add one line per package). */
export const ROOTS = ['server/src', 'client/src', 'client/src/features', 'engine/src'];

const TEST_FILE = '\\.(spec|test|e2e-spec)\\.[cm]?[jt]sx?$';
const TOP_LEVEL = '(top level)';
const escape = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** The folder of `root` that `file` belongs to, or null when the file is outside the root. */
export function folderOf(root, file) {
  if (!file.startsWith(`${root}/`)) return null;
  const rest = file.slice(root.length + 1);
  const slash = rest.indexOf('/');
  return slash < 0 ? TOP_LEVEL : rest.slice(0, slash);
}

/** Strongly connected components of a graph given as Map<node, Set<node>> (Tarjan 1972). */
export function stronglyConnected(graph) {
  let next = 0;
  const index = new Map();
  const low = new Map();
  const stack = [];
  const onStack = new Set();
  const components = [];
  const visit = (v) => {
    index.set(v, next);
    low.set(v, next);
    next++;
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v), low.get(w)));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v), index.get(w)));
    }
    if (low.get(v) === index.get(v)) {
      const component = [];
      let w;
      do {
        w = stack.pop();
        onStack.delete(w);
        component.push(w);
      } while (w !== v);
      components.push(component.sort());
    }
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return components;
}

/**
 * The folder cycles of each root: [{ root, folders, imports: [{ from, to }] }], the imports being
 * those between folders of the cycle (what to cut), and the relative imports that could not be
 * resolved (the check cannot see their edges, so they count as failures too).
 */
export async function findFolderCycles(roots, baseDir = process.cwd()) {
  for (const root of roots) if (!existsSync(`${baseDir}/${root}`)) throw new Error(`no folder ${root} to check`);
  const trees = roots.filter((r) => !roots.some((other) => other !== r && r.startsWith(`${other}/`)));
  const { output } = await cruise(trees, {
    baseDir,
    tsPreCompilationDeps: true,
    // what lies outside the roots (packages, shared/) is a leaf: not read, its edges not needed
    doNotFollow: { path: `^(?!(${roots.map(escape).join('|')})/)` },
    exclude: { path: TEST_FILE },
  });
  const unresolved = [];
  const edges = [];
  for (const module of output.modules) {
    for (const dependency of module.dependencies) {
      if (dependency.couldNotResolve) {
        if (dependency.module.startsWith('.')) unresolved.push(`${module.source} imports ${dependency.module}`);
      } else edges.push({ from: module.source, to: dependency.resolved });
    }
  }
  const cycles = [];
  for (const root of roots) {
    const graph = new Map();
    const imports = new Map();
    for (const edge of edges) {
      const a = folderOf(root, edge.from);
      const b = folderOf(root, edge.to);
      if (a === null || b === null || a === b) continue;
      if (!graph.has(a)) graph.set(a, new Set());
      graph.get(a).add(b);
      const key = `${a}\0${b}`;
      if (!imports.has(key)) imports.set(key, []);
      imports.get(key).push(edge);
    }
    for (const folders of stronglyConnected(graph)) {
      if (folders.length < 2) continue;
      const inCycle = new Set(folders);
      const between = [...imports.entries()]
        .filter(([key]) => key.split('\0').every((f) => inCycle.has(f)))
        .flatMap(([, list]) => list);
      cycles.push({ root, folders, imports: between });
    }
  }
  return { cycles, unresolved };
}

async function main() {
  const roots = process.argv.length > 2 ? process.argv.slice(2) : ROOTS;
  const { cycles, unresolved } = await findFolderCycles(roots);
  for (const line of unresolved) console.error(`folder-cycles: could not resolve: ${line}`);
  for (const cycle of cycles) {
    console.error(`folder-cycles: import cycle between the folders of ${cycle.root}: ${cycle.folders.join(', ')}`);
    let pair = '';
    for (const edge of cycle.imports) {
      const next = `${folderOf(cycle.root, edge.from)} -> ${folderOf(cycle.root, edge.to)}`;
      if (next !== pair) console.error(`  ${(pair = next)}`);
      console.error(`    ${edge.from.slice(cycle.root.length + 1)} imports ${edge.to.slice(cycle.root.length + 1)}`);
    }
  }
  if (cycles.length > 0 || unresolved.length > 0) process.exit(1);
  console.log(`folder-cycles: no import cycle between the folders of ${roots.join(', ')}`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) await main();
