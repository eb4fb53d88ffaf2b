import { quantile } from './quantile.ts';

/**
 * Sample median: the middle sorted value, or the mean of the two middle ones (quantile type 7 at
 * p = 0.5). Missing values are skipped; NaN for an empty sample. Cost as quantile's: O(n log n) for a
 * sort below 4,096 values, expected O(n) by selection from there on.
 */
export function median(values: Iterable<number | null | undefined>): number {
  return quantile(values, 0.5);
}
