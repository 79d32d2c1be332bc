/**
 * Limits on what a JSON request body may be. Every route's body is a small form (the largest, a
 * day's schedule correction or a handover note, is a few kilobytes); CSV history goes through the
 * upload route, which has its own limit (CSV_MAX_BYTES).
 */

/** Largest JSON or form body, in bytes (100 KiB). Larger: 413. */
export const MAX_BODY_BYTES = 100 * 1024;

/** Deepest nesting of objects and arrays in a body. Deeper: 400. Our deepest DTO nests 3 levels. */
export const MAX_BODY_DEPTH = 32;

/**
 * Keys refused anywhere in a body: they name an object's prototype machinery, never a field of
 * ours, and merging them into an object can change how every object of the process behaves.
 */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);
