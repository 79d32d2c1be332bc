/**
 * The differencing operators live in series/differencing.ts, below the top level, so that the
 * engine's folders (regression/) may use them without an import cycle between folders
 * (scripts/folder-cycles.mjs); the top-level files keep importing them from here.
 */
export * from './series/differencing';
