import { radixOrder } from './radixOrder.ts';
import { scratchInts } from './scratch.ts';

/** From this many values on, the radix sort is the faster. */
const RADIX_FROM = 4096;

/**
 * Positions 0..n−1 of the first n values, ordered by value; equal values keep their order (a
 * stable bottom-up merge sort, Knuth 1998, TAOCP vol. 3 §5.2.4). The result is a work buffer,
 * valid until the next call. O(n log n) time, no allocation after the first calls; for many values
 * the radix sort (radixOrder), which gives the same order in O(n).
 */
export function sortedPositions(values: Float64Array, n: number): Int32Array {
  if (n >= RADIX_FROM) return radixOrder(values, n);
  let from = scratchInts('kruskal-order-a', n);
  let to = scratchInts('kruskal-order-b', n);
  for (let k = 0; k < n; k++) from[k] = k;
  for (let width = 1; width < n; width *= 2) {
    for (let left = 0; left < n; left += 2 * width) {
      const middle = Math.min(left + width, n);
      const right = Math.min(left + 2 * width, n);
      let i = left;
      let j = middle;
      let k = left;
      while (i < middle && j < right)
        to[k++] =
          (values[from[j] as number] as number) < (values[from[i] as number] as number) ? (from[j++] as number) : (from[i++] as number);
      while (i < middle) to[k++] = from[i++] as number;
      while (j < right) to[k++] = from[j++] as number;
    }
    const swap = from;
    from = to;
    to = swap;
  }
  return from;
}
