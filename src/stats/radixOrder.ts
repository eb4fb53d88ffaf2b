import { scratch, scratchInts } from './scratch.ts';

const BITS = 11;
const RADIX = 1 << BITS;
const MASK = RADIX - 1;

/**
 * Positions 0..n−1 of the first n values ordered by value, equal values in their original order,
 * by an LSD radix sort (Knuth 1998, TAOCP vol. 3 §5.2.5) on the bits of the doubles: each value
 * becomes an unsigned 64-bit key that orders like the number (negative: all bits flipped; positive:
 * the sign bit set; −0 is first made +0, so the two zeros count as equal, as `<` sees them), then
 * six stable counting passes of 11, 11, 10 bits per 32-bit half sort the keys. O(n) time for
 * n ≫ 2¹¹; no NaN allowed. The result is a work buffer, valid until the next call.
 */
export function radixOrder(values: Float64Array, n: number): Int32Array {
  // Work buffers kept between calls (about 40 bytes a value): the keys as two 32-bit halves.
  const copy = scratch('radix-copy', n);
  const words = new Uint32Array(copy.buffer, 0, 2 * n);
  for (let k = 0; k < n; k++) copy[k] = (values[k] as number) + 0; // −0 + 0 is +0
  let hi = scratchInts('radix-hi-a', n);
  let lo = scratchInts('radix-lo-a', n);
  let order = scratchInts('radix-order-a', n);
  let nextHi = scratchInts('radix-hi-b', n);
  let nextLo = scratchInts('radix-lo-b', n);
  let nextOrder = scratchInts('radix-order-b', n);
  // Little-endian: word 2k is the low half of value k, word 2k + 1 the high half.
  for (let k = 0; k < n; k++) {
    const high = words[2 * k + 1] as number;
    const low = words[2 * k] as number;
    const negative = high >>> 31 === 1;
    // Stored in Int32Arrays: the bits are what count (>>> reads them back unsigned).
    hi[k] = negative ? ~high : high | 0x80000000;
    lo[k] = negative ? ~low : low;
    order[k] = k;
  }
  const counts = scratchInts('radix-counts', RADIX);
  for (let pass = 0; pass < 6; pass++) {
    const fromHigh = pass >= 3;
    const shift = (pass % 3) * BITS;
    const source = fromHigh ? hi : lo;
    for (let digit = 0; digit < RADIX; digit++) counts[digit] = 0;
    for (let k = 0; k < n; k++) {
      const digit = ((source[k] as number) >>> shift) & MASK;
      counts[digit] = (counts[digit] as number) + 1;
    }
    let sum = 0;
    for (let digit = 0; digit < RADIX; digit++) {
      const count = counts[digit] as number;
      counts[digit] = sum;
      sum += count;
    }
    for (let k = 0; k < n; k++) {
      const digit = ((source[k] as number) >>> shift) & MASK;
      const at = counts[digit] as number;
      counts[digit] = at + 1;
      nextHi[at] = hi[k] as number;
      nextLo[at] = lo[k] as number;
      nextOrder[at] = order[k] as number;
    }
    [hi, nextHi] = [nextHi, hi];
    [lo, nextLo] = [nextLo, lo];
    [order, nextOrder] = [nextOrder, order];
  }
  return order;
}
