/**
 * Reusable work buffers for the hot loops of the trend tests. Allocating a typed array costs about
 * a microsecond, as much as a whole small Mann-Kendall test, so each slot keeps one buffer and
 * grows it when asked for more. Buffers never leave the function that borrowed them (results are
 * always fresh values), and each worker thread has its own module instance, so the statistics stay
 * pure functions as seen from outside. Not exported from stats/index.ts.
 */
type Buffer = Float64Array | Int32Array | Uint16Array;
const buffers = new Map<string, Buffer>();

function borrow<T extends Buffer>(kind: new (length: number) => T, slot: string, length: number): T {
  let buffer = buffers.get(slot) as T | undefined;
  if (!buffer || buffer.length < length) {
    buffer = new kind(Math.max(length, 2 * (buffer?.length ?? 0), 64));
    buffers.set(slot, buffer);
  }
  return buffer;
}

/** A buffer of at least `length` doubles. */
export const scratch = (slot: string, length: number): Float64Array => borrow(Float64Array, slot, length);
/** The same for whole-number work (counts and indices). */
export const scratchInts = (slot: string, length: number): Int32Array => borrow(Int32Array, slot, length);
/** The same for small whole numbers (bucket indices below 65,536). */
export const scratchShorts = (slot: string, length: number): Uint16Array => borrow(Uint16Array, slot, length);
