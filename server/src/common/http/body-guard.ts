import { FORBIDDEN_KEYS, MAX_BODY_DEPTH } from './body-limits';

/**
 * What is wrong with a parsed body, or null. Walks the body with an explicit stack rather than
 * recursion, so a body nested thousands of levels deep is refused here, by message, instead of
 * overflowing the call stack of the validation that would otherwise walk it.
 */
export function bodyProblem(body: unknown, maxDepth = MAX_BODY_DEPTH): string | null {
  const stack: { value: unknown; depth: number; path: string }[] = [{ value: body, depth: 0, path: 'body' }];
  while (stack.length > 0) {
    const { value, depth, path } = stack.pop()!;
    if (typeof value !== 'object' || value === null) continue;
    if (depth >= maxDepth) return `The body is nested more than ${maxDepth} levels deep`;
    if (Array.isArray(value)) {
      value.forEach((item, index) => stack.push({ value: item, depth: depth + 1, path: `${path}[${index}]` }));
      continue;
    }
    for (const key of Object.keys(value)) {
      if (FORBIDDEN_KEYS.has(key)) return `${path} has a key "${key}", which no request may carry`;
      stack.push({ value: (value as Record<string, unknown>)[key], depth: depth + 1, path: `${path}.${key.length > 40 ? `${key.slice(0, 40)}…` : key}` });
    }
  }
  return null;
}
