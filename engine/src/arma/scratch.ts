/**
 * Zeroed scratch arrays kept between calls, by slot. The likelihood is evaluated hundreds of
 * times per fit with arrays of the same few sizes, and allocating a typed array costs V8 more
 * than the work done on it for small state sizes (it was a quarter of a 200-point evaluation).
 * A slot belongs to one function, which must not call itself or hand the array out; each worker
 * thread has its own copy of this module, so nothing is shared across threads.
 */
const slots = new Map<string, Float64Array>();

export function scratch(slot: string, length: number): Float64Array {
  let buffer = slots.get(slot);
  if (!buffer || buffer.length !== length) {
    buffer = new Float64Array(length);
    slots.set(slot, buffer);
    return buffer;
  }
  buffer.fill(0);
  return buffer;
}

/**
 * A scratch array of at least `length` elements, not cleared: for a caller whose length varies
 * from call to call and who writes every element it reads.
 */
export function scratchAtLeast(slot: string, length: number): Float64Array {
  let buffer = slots.get(slot);
  if (!buffer || buffer.length < length) {
    buffer = new Float64Array(Math.max(length, 2 * (buffer?.length ?? 0)));
    slots.set(slot, buffer);
  }
  return buffer;
}
