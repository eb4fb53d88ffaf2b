/**
 * Reusable work buffers for the hot loops of the trend tests. Allocating a typed array costs about
 * a microsecond, as much as a whole small Mann-Kendall test, so each slot keeps one buffer and
 * grows it when asked for more. Buffers never leave the function that borrowed them (results are
 * always fresh values), and each worker thread has its own module instance, so the statistics stay
 * pure functions as seen from outside. Not exported from stats/index.ts.
 */
const buffers = new Map<string, Float64Array>();

export function scratch(slot: string, length: number): Float64Array {
  let buffer = buffers.get(slot);
  if (!buffer || buffer.length < length) {
    buffer = new Float64Array(Math.max(length, 2 * (buffer?.length ?? 0), 64));
    buffers.set(slot, buffer);
  }
  return buffer;
}
