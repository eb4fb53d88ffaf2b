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
}

export type Status =
  | {
      kind: 'stated';
      fillingPercent: number;
      coveragePercent: number;
      filledPercent: number;
      baseline: BaselineSummary;
      /** Filling minus the baseline median, in percentage points of reference area. */
      anomalyPoints: number;
      percentOfBaseline: number;
      standardized: number;
      percentileRank: number;
      bandKey: string;
      /** Percentage points against the same month a year earlier; null when that month has no figure. */
      changeFromLastYear: number | null;
      changeFromPreviousMonth: number | null;
    }
  | { kind: 'low-coverage'; coveragePercent: number; thresholdPercent: number }
  | { kind: 'short-baseline'; fillingPercent: number; coveragePercent: number; usableYears: number; neededYears: number };

export function bandFor(percentOfBaseline: number, bands: Array<{ key: string; fromPercent: number | null }>): string {
  let key = bands[0]?.key ?? '';
  for (const band of bands) if (band.fromPercent === null || percentOfBaseline >= band.fromPercent) key = band.key;
  return key;
}

export function statusOf(series: GroupMonth[], bulletinMonth: number, config: BulletinConfig): Status {
  const current = series.find((entry) => entry.month === bulletinMonth);
  const thresholdPercent = 100 * config.coverage.minRegionCoverage;
  if (!current || current.fillingPercent === null)
    return { kind: 'low-coverage', coveragePercent: current?.coveragePercent ?? 0, thresholdPercent };
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
      coveragePercent: current.coveragePercent,
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
  const result = anomaly(current.fillingPercent, entry);
  const at = (month: number) => series.find((row) => row.month === month)?.fillingPercent ?? null;
  const lastYear = at(bulletinMonth - 12);
  const previous = at(bulletinMonth - 1);
  return {
    kind: 'stated',
    fillingPercent: current.fillingPercent,
    coveragePercent: current.coveragePercent,
    filledPercent: current.filledPercent,
    baseline: {
      years,
      values: entry.values,
      median: entry.median,
      p10: entry.p10,
      p90: entry.p90,
      mean: entry.mean,
      standardDeviation: entry.standardDeviation,
    },
    anomalyPoints: result.absolute,
    percentOfBaseline: result.percentOfBaseline,
    standardized: result.standardized,
    percentileRank: result.percentileRank,
    bandKey: bandFor(result.percentOfBaseline, config.statusBands),
    changeFromLastYear: lastYear === null ? null : current.fillingPercent - lastYear,
    changeFromPreviousMonth: previous === null ? null : current.fillingPercent - previous,
  };
}
