import { finiteValues } from './finiteValues.ts';
import { mean } from './mean.ts';
import { quantileSorted } from './quantile.ts';
import { sampleStandardDeviation } from './sampleStandardDeviation.ts';

export interface ClimatologyEntry {
  /** Calendar month 1–12. */
  calendarMonth: number;
  /** Baseline years with a value for this calendar month. */
  count: number;
  /** The baseline values, sorted, so percentile ranks and envelopes can be taken later. */
  values: number[];
  /** NaN (all four) when count is below minYears. */
  median: number;
  mean: number;
  standardDeviation: number;
  p10: number;
  p90: number;
  enough: boolean;
}

export interface BaselinePeriod {
  firstYear: number;
  lastYear: number;
  /** Fewest baseline years a calendar month needs for its statistics to be stated. */
  minYears: number;
}

/**
 * Monthly climatology over a declared baseline period: for each calendar month, the values of the
 * baseline years (months given as year × 12 + month − 1; missing values skipped) summarised by
 * median, mean, sample standard deviation (n − 1) and 10th and 90th percentiles (type 7). A month
 * with fewer than `minYears` values gets NaN statistics and `enough: false`. Cost O(n log n).
 */
export function climatology(
  months: ArrayLike<number>,
  values: ArrayLike<number | null | undefined>,
  baseline: BaselinePeriod,
): ClimatologyEntry[] {
  if (months.length !== values.length) throw new RangeError('climatology requires months and values of the same length');
  const byMonth: number[][] = Array.from({ length: 12 }, () => []);
  for (let k = 0; k < months.length; k++) {
    const month = months[k] as number;
    const year = Math.floor(month / 12);
    const value = values[k];
    if (year < baseline.firstYear || year > baseline.lastYear) continue;
    if (typeof value === 'number' && Number.isFinite(value)) byMonth[((month % 12) + 12) % 12]?.push(value);
  }
  return byMonth.map((raw, index) => {
    const sorted = finiteValues(raw).sort();
    const enough = sorted.length >= baseline.minYears;
    return {
      calendarMonth: index + 1,
      count: sorted.length,
      values: Array.from(sorted),
      median: enough ? quantileSorted(sorted, 0.5) : Number.NaN,
      mean: enough ? mean(sorted) : Number.NaN,
      standardDeviation: enough ? sampleStandardDeviation(sorted) : Number.NaN,
      p10: enough ? quantileSorted(sorted, 0.1) : Number.NaN,
      p90: enough ? quantileSorted(sorted, 0.9) : Number.NaN,
      enough,
    };
  });
}
