// One lint configuration for the whole tree (npm run lint).
import js from '@eslint/js';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

// The engine package (engine/) is pure computation: numbers in, numbers out. It imports no
// framework, ORM, socket or server code, and no workspace package; only its command line
// (engine/src/cli) reads files, and the command line reaches the engine through its public API
// ('@morrowline/engine') like the server does. See DEVELOPERS.md, "The engine package".
const NOT_IN_ENGINE = {
  group: ['@nestjs/*', '@mikro-orm/*', 'socket.io', 'socket.io-client', 'express', 'mariadb', 'piscina', '@morrowline/*'],
  message: 'The engine imports no framework, ORM, socket, server or other workspace code (DEVELOPERS.md, "The engine package").',
};
const NO_IO_IN_ENGINE = {
  regex: '^(node:)?(fs|fs/promises|net|http|https|http2|tls|dgram|child_process|worker_threads)$',
  message: 'No I/O in the engine: the caller reads the data and passes numbers (only engine/src/cli reads files).',
};
const CLI_OUTSIDE_ENGINE = {
  group: ['@nestjs/*', '@mikro-orm/*', 'socket.io', 'socket.io-client', 'express', 'mariadb', 'piscina', '@morrowline/*', '!@morrowline/engine'],
  message: 'The engine command line uses the engine and Node only (DEVELOPERS.md, "The engine package").',
};
/** A relative import that climbs `levels` folders or more (out of engine/src from that depth). */
const climbing = (levels) => ({
  regex: `^(\\./)?(\\.\\./){${levels},}`,
  message: 'A relative import may not leave engine/src: the engine depends on nothing outside its package.',
});
// One block per folder depth under engine/src, since how many '../' leave the package depends on
// where the file is; specs may read their fixtures (no I/O rule), the code may not.
const ENGINE_DEPTHS = [0, 1, 2, 3, 4, 5];
const engineBoundary = ENGINE_DEPTHS.flatMap((depth) => {
  const files = [`engine/src/${'*/'.repeat(depth)}*.ts`];
  const ignores = ['engine/src/cli/**'];
  const leave = climbing(depth + 1);
  return [
    { files, ignores: [...ignores, '**/*.spec.ts'], rules: { 'no-restricted-imports': ['error', { patterns: [NOT_IN_ENGINE, NO_IO_IN_ENGINE, leave] }] } },
    { files: files.map((f) => f.replace(/\*\.ts$/, '*.spec.ts')), ignores, rules: { 'no-restricted-imports': ['error', { patterns: [NOT_IN_ENGINE, leave] }] } },
  ];
});

export default tseslint.config(
  { ignores: ['**/dist/**', '**/node_modules/**', '.data/**', '**/coverage/**', 'server/src/database/migrations/Migration*.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-require-imports': 'off',
    },
  },
  {
    files: ['client/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'warn' },
  },  ...engineBoundary,
  {
    // The command line: files, Node and the engine's public API (never its modules by path).
    files: ['engine/src/cli/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [CLI_OUTSIDE_ENGINE, { ...climbing(1), message: 'The command line imports the engine as @morrowline/engine (its public API), not by relative path.' }] }] },
  },
  {
    // The desk in the browser never runs the engine: it asks the server.
    files: ['client/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': ['error', { paths: [{ name: '@morrowline/engine', message: 'The client asks the server; the engine runs there.' }] }] },
  },
);
