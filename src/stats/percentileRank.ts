import { finiteValues } from './finiteValues.ts';

/**
 * Percentile rank of a value in a sample, the "mean" definition: 100 × (number of sample values
 * below it + ½ × number equal to it) / n. A value equal to the sample median of an odd sample gets
 * 50; a value beyond every sample value gets 0 or 100. (This is `kind='mean'` of
 * scipy.stats.percentileofscore.) Missing sample values are skipped; NaN for an empty sample.
 * Cost O(n).
 */
export function percentileRank(sample: Iterable<number | null | undefined>, value: number): number {
  const values = finiteValues(sample);
  if (values.length === 0 || !Number.isFinite(value)) return Number.NaN;
  let below = 0;
  let equal = 0;
  for (const entry of values) {
    if (entry < value) below++;
    else if (entry === value) equal++;
  }
  return (100 * (below + 0.5 * equal)) / values.length;
}
