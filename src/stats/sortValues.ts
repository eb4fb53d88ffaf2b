import { radixOrder } from './radixOrder.ts';

/** From this many values on, the radix sort is the faster (the engine's sort is slow on long arrays). */
const RADIX_FROM = 4096;

/**
 * Sorts the values ascending in place and returns them: exactly what Float64Array's own sort
 * gives (ECMAScript §23.2.3.29: numeric order, −0 before +0; no NaN allowed here), by the radix
 * order (radixOrder) for many values. O(n) for many values, O(n log n) otherwise.
 */
export function sortValues(values: Float64Array): Float64Array {
  const n = values.length;
  if (n < RADIX_FROM) return values.sort();
  const order = radixOrder(values, n);
  const copy = Float64Array.from(values);
  for (let k = 0; k < n; k++) values[k] = copy[order[k] as number] as number;
  // radixOrder counts −0 and +0 as equal; the engine's sort puts −0 first.
  let zeros = 0;
  while (zeros < n && values[zeros] !== 0 && (values[zeros] as number) < 0) zeros++;
  let end = zeros;
  let negativeZeros = 0;
  while (end < n && values[end] === 0) {
    if (Object.is(values[end], -0)) negativeZeros++;
    end++;
  }
  for (let k = zeros; k < end; k++) values[k] = k - zeros < negativeZeros ? -0 : 0;
  return values;
}
