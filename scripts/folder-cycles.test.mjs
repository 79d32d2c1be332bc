// The folder-cycle check on small trees made here (node --test, part of npm run lint).
import assert from 'node:assert/strict';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { after, test } from 'node:test';
import { findFolderCycles, folderOf, stronglyConnected } from './folder-cycles.mjs';

const made = [];
after(() => made.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

/** A tree of TypeScript files: { 'src/a/x.ts': "import { y } from '../b/y';" , … } */
function tree(files) {
  const dir = mkdtempSync(join(tmpdir(), 'folder-cycles-'));
  made.push(dir);
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(dirname(join(dir, path)), { recursive: true });
    writeFileSync(join(dir, path), `${text}\nexport const here = 1;\n`);
  }
  return dir;
}

test('a file belongs to the folder directly inside the root, files in the root to the top level', () => {
  assert.equal(folderOf('server/src', 'server/src/models/analysis/refit.ts'), 'models');
  assert.equal(folderOf('server/src', 'server/src/main.ts'), '(top level)');
  assert.equal(folderOf('server/src', 'client/src/main.tsx'), null);
  assert.equal(folderOf('client/src', 'client/src/features/live/index.ts'), 'features');
});

test('strongly connected components: a cycle of three and a folder outside it', () => {
  const graph = new Map([
    ['a', new Set(['b'])],
    ['b', new Set(['c'])],
    ['c', new Set(['a', 'd'])],
    ['d', new Set()],
  ]);
  const components = stronglyConnected(graph).map((c) => c.join(','));
  assert.deepEqual(components.sort(), ['a,b,c', 'd']);
});

test('finds a cycle between two folders whose files form no cycle', async () => {
  const dir = tree({
    'src/alerts/alerts.ts': "import { here as f } from '../forecasts/runs';",
    'src/alerts/lookup.ts': '',
    'src/forecasts/runs.ts': '',
    'src/forecasts/stored.ts': "import type { here as l } from '../alerts/lookup';",
  });
  const { cycles, unresolved } = await findFolderCycles(['src'], dir);
  assert.deepEqual(unresolved, []);
  assert.equal(cycles.length, 1);
  assert.deepEqual(cycles[0].folders, ['alerts', 'forecasts']);
  assert.deepEqual(
    cycles[0].imports.map((e) => `${e.from} -> ${e.to}`).sort(),
    ['src/alerts/alerts.ts -> src/forecasts/runs.ts', 'src/forecasts/stored.ts -> src/alerts/lookup.ts'],
  );
});

test('passes a tree whose folders depend one way; imports inside a folder and from test files do not count', async () => {
  const dir = tree({
    'src/main.ts': "import { here } from './models/models';",
    'src/models/models.ts': "import { here as c } from '../compute/pool'; import { here as t } from './analysis/tasks';",
    'src/models/analysis/tasks.ts': "import { here as p } from '../models';",
    'src/compute/pool.ts': '',
    'src/compute/pool.spec.ts': "import { here } from '../models/models';",
  });
  assert.deepEqual(await findFolderCycles(['src'], dir), { cycles: [], unresolved: [] });
});

test('checks nested roots on their own level: features of a client', async () => {
  const dir = tree({
    'src/app/router.ts': "import { here } from '../features/live';",
    'src/features/live.ts': '',
    'src/features/live/chart.ts': "import { here } from '../zones/picker';",
    'src/features/zones/picker.ts': "import { here } from '../live/chart';",
  });
  const { cycles } = await findFolderCycles(['src', 'src/features'], dir);
  assert.deepEqual(cycles.map((c) => [c.root, c.folders]), [['src/features', ['live', 'zones']]]);
});

test('refuses an import it cannot resolve, and a root that does not exist', async () => {
  const dir = tree({ 'src/a/x.ts': "import { here } from '../b/missing';" });
  assert.deepEqual((await findFolderCycles(['src'], dir)).unresolved, ["src/a/x.ts imports ../b/missing"]);
  await assert.rejects(findFolderCycles(['engine/src'], dir), /no folder engine\/src to check/);
});
