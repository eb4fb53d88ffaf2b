import { finiteValues } from './finiteValues.ts';
import { selectRanks } from './selectRanks.ts';
import { sortValues } from './sortValues.ts';

/**
 * Sample quantile by Hyndman & Fan (1996) definition 7, the default of R's `quantile()` and of
 * numpy: with the n sorted values x(1) ≤ … ≤ x(n) and h = (n − 1)·p + 1, the quantile is
 * x(⌊h⌋) + (h − ⌊h⌋)·(x(⌊h⌋+1) − x(⌊h⌋)). Missing values are skipped (see finiteValues).
 * Returns NaN for an empty sample. Cost O(n log n) for the sort; from 4,096 values on, the two
 * order statistics are selected instead (selectRanks), expected O(n), with the same result.
 *
 * Hyndman, R. J. & Fan, Y. (1996). Sample quantiles in statistical packages. The American
 * Statistician 50(4), 361–365.
 */
export function quantile(values: Iterable<number | null | undefined>, probability: number): number {
  if (!(probability >= 0 && probability <= 1)) throw new RangeError('quantile requires a probability from 0 to 1');
  const kept = finiteValues(values);
  const n = kept.length;
  if (n < SELECT_FROM) return quantileSorted(sortValues(kept), probability);
  // Only the order statistics at ⌊h⌋ and ⌊h⌋ + 1, h = (n − 1)p, are needed: selected rather than
  // sorted, then combined by the same arithmetic as quantileSorted.
  const h = (n - 1) * probability;
  const below = Math.floor(h);
  if (below + 1 >= n) return selectRanks(kept, n, [below])[0] as number;
  const [low, high] = selectRanks(kept, n, [below, below + 1]) as [number, number];
  return low + (h - below) * (high - low);
}

/** From this many values on, quantile selects instead of sorting. */
const SELECT_FROM = 4096;

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
