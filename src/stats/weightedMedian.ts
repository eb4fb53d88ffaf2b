import { scratch } from './scratch.ts';
import { sortedPositions } from './sortedPositions.ts';

/**
 * Weighted median: the smallest value whose cumulative weight, in ascending order of value,
 * reaches half the total weight; when it reaches exactly half, the mean of that value and the next
 * (so equal weights give the ordinary median). Pairs with a missing value or a weight that is not
 * positive are skipped; NaN when none is left. Cost O(n log n).
 */
export function weightedMedian(values: ArrayLike<number | null | undefined>, weights: ArrayLike<number>): number {
  const kept = scratch('weighted-values', values.length);
  const keptWeights = scratch('weighted-weights', values.length);
  let n = 0;
  let total = 0;
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    const weight = weights[k] as number;
    if (typeof value === 'number' && value - value === 0 && weight > 0 && weight - weight === 0) {
      kept[n] = value;
      keptWeights[n++] = weight;
      total += weight;
    }
  }
  if (n === 0) return Number.NaN;
  const order = sortedPositions(kept, n);
  let cumulative = 0;
  for (let k = 0; k < n; k++) {
    const value = kept[order[k] as number] as number;
    cumulative += keptWeights[order[k] as number] as number;
    if (Math.abs(cumulative - total / 2) <= 1e-12 * total)
      return (value + (k + 1 < n ? (kept[order[k + 1] as number] as number) : value)) / 2;
    if (cumulative > total / 2) return value;
  }
  return kept[order[n - 1] as number] as number;
}
