import type { ClimatologyEntry } from './climatology.ts';
import { percentileRank } from './percentileRank.ts';

export interface Anomaly {
  /** value − baseline median. */
  absolute: number;
  /** 100 × value / baseline median. */
  percentOfBaseline: number;
  /** (value − baseline mean) / baseline sample standard deviation. */
  standardized: number;
  /** Percentile rank of the value among the baseline values (mean definition). */
  percentileRank: number;
}

/**
 * Anomaly of one value against the climatology of its calendar month: absolute (against the
 * median), percent of the median, standardized (z-score against mean and sample standard
 * deviation) and percentile rank among the baseline values. All NaN when the climatology does not
 * have enough years; percentOfBaseline is NaN for a zero median and standardized for a zero
 * standard deviation. Cost O(years).
 */
export function anomaly(value: number, reference: ClimatologyEntry): Anomaly {
  if (!reference.enough || !Number.isFinite(value))
    return { absolute: Number.NaN, percentOfBaseline: Number.NaN, standardized: Number.NaN, percentileRank: Number.NaN };
  return {
    absolute: value - reference.median,
    percentOfBaseline: reference.median !== 0 ? (100 * value) / reference.median : Number.NaN,
    standardized: reference.standardDeviation > 0 ? (value - reference.mean) / reference.standardDeviation : Number.NaN,
    percentileRank: percentileRank(reference.values, value),
  };
}
