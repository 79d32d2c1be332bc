/**
 * The engine's boundary as `npm run lint` enforces it (eslint.config.mjs): probe files given to
 * ESLint on stdin under engine paths, and the imports it must refuse or let through.
 */
import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';

const root = resolve(__dirname, '../..');

/** Lints every probe in one ESLint run (its start-up is most of the time). */
const LINT_PROBES = `
  const { ESLint } = await import('eslint');
  const probes = JSON.parse(require('node:fs').readFileSync(0, 'utf8'));
  const eslint = new ESLint({ cwd: process.cwd() });
  const out = [];
  for (const p of probes) {
    const [report] = await eslint.lintText(p.source, { filePath: require('node:path').join(process.cwd(), p.path) });
    out.push(report.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.line));
  }
  process.stdout.write(JSON.stringify(out));
`;

interface Probe {
  path: string;
  source: string[];
}

const PROBES = {
  engine: {
    path: 'engine/src/arma/probe.ts',
    source: [
      "import { Injectable } from '@nestjs/common';",
      "import { EntityManager } from '@mikro-orm/core';",
      "import { readFileSync } from 'node:fs';",
      "import * as fs from 'fs';",
      "import { createServer } from 'node:http';",
      "import net from 'net';",
      "import { Server } from 'socket.io';",
      "import { AppModule } from '@morrowline/server';",
      "import { DEMO_ZONES } from '@morrowline/shared';",
      "import { x } from '../../server/src/app.module';",
      "import { Matrix } from 'ml-matrix';",
      "import { difference } from '../differencing';",
      "import { fitArma } from './fit';",
    ],
  },
  top: { path: 'engine/src/probe.ts', source: ["import { a } from '../package.json';", "import { b } from './arma/fit';"] },
  nested: { path: 'engine/src/arma/probe.ts', source: ["import { a } from '../../package.json';", "import { b } from '../series';"] },
  spec: {
    path: 'engine/src/arma/probe.spec.ts',
    source: ["import { readFileSync } from 'node:fs';", "import { Injectable } from '@nestjs/common';", "import { x } from '../../../server/src/main';"],
  },
  cli: {
    path: 'engine/src/cli/probe.ts',
    source: [
      "import { readFileSync } from 'node:fs';",
      "import { runPipeline } from '@morrowline/engine';",
      "import { parseLoadCsv } from './csv-series';",
      "import { fitArma } from '../arma/fit';",
      "import { Injectable } from '@nestjs/common';",
      "import { DEMO_ZONES } from '@morrowline/shared';",
    ],
  },
  client: { path: 'client/src/probe.ts', source: ["import { runPipeline } from '@morrowline/engine';", "import { DEMO_ZONES } from '@morrowline/shared';"] },
} satisfies Record<string, Probe>;

/** The lines of each probe that no-restricted-imports refuses. */
let refused: Record<keyof typeof PROBES, number[]>;

beforeAll(() => {
  const names = Object.keys(PROBES) as Array<keyof typeof PROBES>;
  const input = JSON.stringify(names.map((n) => ({ path: PROBES[n].path, source: PROBES[n].source.join('\n') + '\n' })));
  const r = spawnSync(process.execPath, ['--input-type=commonjs', '-e', `(async () => {${LINT_PROBES}})()`], { cwd: root, input, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`eslint failed: ${r.stderr}`);
  const lines = JSON.parse(r.stdout) as number[][];
  refused = Object.fromEntries(names.map((n, i) => [n, lines[i]])) as typeof refused;
});

describe('the engine boundary (lint)', () => {
  it('refuses framework, ORM, socket, server and I/O imports, and paths out of the package, in the engine', () => {
    expect(refused.engine).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
  });

  it('counts the folders climbed from where the file is', () => {
    expect(refused.top).toEqual([1]);
    expect(refused.nested).toEqual([1]);
  });

  it('lets a spec read its fixtures, nothing more', () => {
    expect(refused.spec).toEqual([2, 3]);
  });

  it('lets the command line read files and use the engine by its package name only', () => {
    expect(refused.cli).toEqual([4, 5, 6]);
  });

  it('keeps the engine out of the client', () => {
    expect(refused.client).toEqual([1]);
  });
});
