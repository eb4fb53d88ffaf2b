import { finiteValues } from './finiteValues.ts';

/**
 * Sample quantile by Hyndman & Fan (1996) definition 7, the default of R's `quantile()` and of
 * numpy: with the n sorted values x(1) ≤ … ≤ x(n) and h = (n − 1)·p + 1, the quantile is
 * x(⌊h⌋) + (h − ⌊h⌋)·(x(⌊h⌋+1) − x(⌊h⌋)). Missing values are skipped (see finiteValues).
 * Returns NaN for an empty sample. Cost O(n log n) for the sort.
 *
 * Hyndman, R. J. & Fan, Y. (1996). Sample quantiles in statistical packages. The American
 * Statistician 50(4), 361–365.
 */
export function quantile(values: Iterable<number | null | undefined>, probability: number): number {
  if (!(probability >= 0 && probability <= 1)) throw new RangeError('quantile requires a probability from 0 to 1');
  const sorted = finiteValues(values).sort();
  return quantileSorted(sorted, probability);
}

/** The same on values already sorted ascending with no missing values. Cost O(1). */
export function quantileSorted(sorted: ArrayLike<number>, probability: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * probability;
  const below = Math.floor(h);
  const low = sorted[below] as number;
  if (below + 1 >= n) return low;
  return low + (h - below) * ((sorted[below + 1] as number) - low);
}
