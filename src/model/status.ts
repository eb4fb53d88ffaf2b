/**
 * The bulletin month of a group against its baseline: the climatology of the same calendar month
 * over the baseline years (median, 10th–90th percentile envelope, mean and sample standard
 * deviation), the anomaly (percentage points, percent of the baseline median, standardized,
 * percentile rank), the status band, and the change from the same month a year earlier and from
 * the month before. Thin data give a reason instead of figures.
 */
import type { BulletinConfig } from '../ingest/index.ts';
import { anomaly, climatology } from '../stats/index.ts';
import type { GroupMonth } from './aggregate.ts';

export interface BaselineSummary {
  years: number[];
  values: number[];
  median: number;
  p10: number;
  p90: number;
  mean: number;
  standardDeviation: number;
  /**
   * The usual spread as printed: the 10th–90th percentiles from ENVELOPE_MIN_VALUES values on,
   * below that the range (lowest to highest) of the baseline years, which is what so few values
   * can show.
   */
  envelope: { low: number; high: number; kind: 'percentiles' | 'range' };
}

/**
 * Baseline years from which a standardized anomaly is shown. WMO-No. 1203 (WMO Guidelines on the
 * Calculation of Climate Normals, 2017) takes 30 years as the standard period for normals; a
 * bulletin of satellite years rarely has that. From n values the standard deviation has a
 * relative standard error of about 1/√(2(n − 1)): 35 % at 5 years, 24 % at 10. Below 10 years a
 * division by it says more than the data do, so only the rank among the baseline years is given
 * (this minimum is this project's choice, with WMO's 30 years as the reference).
 */
export const STANDARDIZED_MIN_YEARS = 10;

/** Values from which an envelope is given as 10th–90th percentiles (fewer give the range). */
export const ENVELOPE_MIN_VALUES = 10;

export type Status =
  | {
      kind: 'stated';
      fillingPercent: number;
      coverageShare: number;
      filledShare: number;
      /** Share of the reference area estimated (fixed set), and the figure's range from the estimates (estimate.ts). */
      estimatedShare: number;
      range: FigureRange;
      baseline: BaselineSummary;
      /** Filling minus the baseline median, in percentage points of reference area. */
      anomalyPoints: number;
      percentOfBaseline: number;
      /** (filling − baseline mean) / baseline sd; null below STANDARDIZED_MIN_YEARS baseline years. */
      standardized: number | null;
      percentileRank: number;
      /** The bulletin month among its baseline years: how many were lower and how many higher (words that hold at any length). */
      rank: { lower: number; higher: number; of: number };
      bandKey: string;
      /** Percentage points against the same month a year earlier; null when that month has no figure. */
      changeFromLastYear: number | null;
      changeFromPreviousMonth: number | null;
    }
  | { kind: 'low-coverage'; coverageShare: number; thresholdShare: number }
  | {
      kind: 'short-baseline';
      fillingPercent: number;
      coverageShare: number;
      estimatedShare: number;
      range: FigureRange;
      usableYears: number;
      neededYears: number;
    }
  /** A grid cell with fewer bodies than `grid.minBodies`: no figure is formed. */
  | { kind: 'too-few-bodies'; bodies: number; minBodies: number };

/** The status of a group that has a figure at all (every group but a thin grid cell). */
export type GroupStatus = Exclude<Status, { kind: 'too-few-bodies' }>;

/**
 * Where a figure could lie given its estimated bodies: filling with every estimated body at the low
 * and at the high end of its spread; for a stated status also as percent of the baseline median.
 * Low equals high when nothing was estimated.
 */
export interface FigureRange {
  low: number;
  high: number;
  percentOfBaselineLow: number | null;
  percentOfBaselineHigh: number | null;
}

export function bandFor(percentOfBaseline: number, bands: Array<{ key: string; fromPercent: number | null }>): string {
  let key = bands[0]?.key ?? '';
  for (const band of bands) if (band.fromPercent === null || percentOfBaseline >= band.fromPercent) key = band.key;
  return key;
}

export function statusOf(series: GroupMonth[], bulletinMonth: number, config: BulletinConfig): GroupStatus {
  const current = series.find((entry) => entry.month === bulletinMonth);
  const thresholdShare = config.coverage.minRegionCoverage;
  if (!current || current.fillingPercent === null)
    return { kind: 'low-coverage', coverageShare: current?.coverageShare ?? 0, thresholdShare };
  // Only the bulletin's calendar month enters its climatology.
  const same = series.filter((row) => row.month % 12 === bulletinMonth % 12);
  const entry = climatology(
    same.map((row) => row.month),
    same.map((row) => row.fillingPercent),
    config.baseline,
  )[bulletinMonth % 12];
  if (!entry || !entry.enough) {
    return {
      kind: 'short-baseline',
      fillingPercent: current.fillingPercent,
      coverageShare: current.coverageShare,
      estimatedShare: current.estimatedShare,
      range: rangeOf(current, null),
      usableYears: entry?.count ?? 0,
      neededYears: config.baseline.minYears,
    };
  }
  const years = same
    .filter(
      (row) =>
        row.fillingPercent !== null &&
        Math.floor(row.month / 12) >= config.baseline.firstYear &&
        Math.floor(row.month / 12) <= config.baseline.lastYear,
    )
    .map((row) => Math.floor(row.month / 12));
  const filling = current.fillingPercent;
  const result = anomaly(filling, entry);
  const at = (month: number) => series.find((row) => row.month === month)?.fillingPercent ?? null;
  const lastYear = at(bulletinMonth - 12);
  const previous = at(bulletinMonth - 1);
  return {
    kind: 'stated',
    fillingPercent: current.fillingPercent,
    coverageShare: current.coverageShare,
    filledShare: current.filledShare,
    estimatedShare: current.estimatedShare,
    range: rangeOf(current, entry.median),
    baseline: {
      years,
      values: entry.values,
      median: entry.median,
      p10: entry.p10,
      p90: entry.p90,
      mean: entry.mean,
      standardDeviation: entry.standardDeviation,
      envelope: envelopeOf(entry),
    },
    anomalyPoints: result.absolute,
    percentOfBaseline: result.percentOfBaseline,
    standardized: entry.values.length >= STANDARDIZED_MIN_YEARS && Number.isFinite(result.standardized) ? result.standardized : null,
    percentileRank: result.percentileRank,
    rank: {
      lower: entry.values.filter((value) => value < filling).length,
      higher: entry.values.filter((value) => value > filling).length,
      of: entry.values.length,
    },
    bandKey: bandFor(result.percentOfBaseline, config.statusBands),
    changeFromLastYear: lastYear === null ? null : current.fillingPercent - lastYear,
    changeFromPreviousMonth: previous === null ? null : current.fillingPercent - previous,
  };
}

function rangeOf(current: GroupMonth, median: number | null): FigureRange {
  const low = current.lowPercent ?? (current.fillingPercent as number);
  const high = current.highPercent ?? (current.fillingPercent as number);
  const percent = (value: number) => (median !== null && median > 0 ? (100 * value) / median : null);
  return { low, high, percentOfBaselineLow: percent(low), percentOfBaselineHigh: percent(high) };
}

/** The envelope of a calendar month's baseline values: percentiles from ENVELOPE_MIN_VALUES on, else the range. */
export function envelopeOf(entry: { values: number[]; p10: number; p90: number }): BaselineSummary['envelope'] {
  if (entry.values.length >= ENVELOPE_MIN_VALUES) return { low: entry.p10, high: entry.p90, kind: 'percentiles' };
  return { low: Math.min(...entry.values), high: Math.max(...entry.values), kind: 'range' };
}
