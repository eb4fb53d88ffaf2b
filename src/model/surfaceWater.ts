/**
 * Regional surface water for every month, and the bulletin month against its baseline.
 *
 * Method (ratio estimator): in each month only body-months seen through clouds over at least
 * `coverage.minObservedShare` of their area count. The regional filling is Σ water area / Σ reference
 * area over those bodies, so the bodies seen stand for the unseen ones in proportion to their
 * reference area; the coverage is Σ reference area seen / Σ reference area of the inventory. A month
 * whose coverage falls below `coverage.minRegionCoverage` has no regional figure.
 *
 * The bulletin month is compared with the median filling of the same calendar month in the baseline
 * years (those with a regional figure); with fewer than `baseline.minYears` such years no comparison
 * is stated.
 */
import type { BulletinInputs } from '../ingest/index.ts';
import { calendarMonthOf, yearOf } from '../ingest/index.ts';
import { median } from '../stats/index.ts';

export interface RegionalMonth {
  month: number;
  /** Percent of the reference area of the bodies seen that was water; null when coverage is too low. */
  fillingPercent: number | null;
  /** Percent of the inventory's reference area seen well enough to count. */
  coveragePercent: number;
  bodiesCounted: number;
}

export interface BaselineYear {
  year: number;
  fillingPercent: number;
}

export type Comparison =
  | {
      kind: 'stated';
      fillingPercent: number;
      coveragePercent: number;
      baselineMedianPercent: number;
      /** Bulletin-month filling as percent of the baseline median. */
      percentOfBaseline: number;
      bandKey: string;
      baselineYears: BaselineYear[];
    }
  | { kind: 'low-coverage'; coveragePercent: number; thresholdPercent: number }
  | { kind: 'short-baseline'; usableYears: number; neededYears: number };

export interface SurfaceWater {
  series: RegionalMonth[];
  /** The same calendar month in every year of the record, for the year-by-year chart. */
  sameMonthEachYear: Array<{ year: number; fillingPercent: number | null; inBaseline: boolean }>;
  bulletin: Comparison;
}

export function regionalSeries(inputs: BulletinInputs): RegionalMonth[] {
  const { area, bodies } = inputs;
  const totalReference = bodies.reduce((sum, body) => sum + body.referenceHa, 0);
  let first = inputs.bulletinMonth;
  for (let k = 0; k < area.length; k++) first = Math.min(first, area.month[k] as number);
  const span = inputs.bulletinMonth - first + 1;
  const water = new Float64Array(span);
  const reference = new Float64Array(span);
  const counted = new Int32Array(span);
  for (let k = 0; k < area.length; k++) {
    if ((area.observedShare[k] as number) < inputs.config.coverage.minObservedShare) continue;
    const slot = (area.month[k] as number) - first;
    water[slot] = (water[slot] as number) + (area.waterHa[k] as number);
    reference[slot] = (reference[slot] as number) + (bodies[area.body[k] as number] as { referenceHa: number }).referenceHa;
    counted[slot] = (counted[slot] as number) + 1;
  }
  const series: RegionalMonth[] = [];
  for (let slot = 0; slot < span; slot++) {
    const seen = reference[slot] as number;
    const coveragePercent = totalReference > 0 ? (100 * seen) / totalReference : 0;
    const enough = coveragePercent >= 100 * inputs.config.coverage.minRegionCoverage && seen > 0;
    series.push({ month: first + slot, fillingPercent: enough ? (100 * (water[slot] as number)) / seen : null, coveragePercent, bodiesCounted: counted[slot] as number });
  }
  return series;
}

export function bandFor(percentOfBaseline: number, bands: Array<{ key: string; fromPercent: number | null }>): string {
  let key = bands[0]?.key ?? '';
  for (const band of bands) if (band.fromPercent === null || percentOfBaseline >= band.fromPercent) key = band.key;
  return key;
}

export function surfaceWater(inputs: BulletinInputs): SurfaceWater {
  const { config, bulletinMonth } = inputs;
  const series = regionalSeries(inputs);
  const calendarMonth = calendarMonthOf(bulletinMonth);
  const sameMonth = series.filter((entry) => calendarMonthOf(entry.month) === calendarMonth);
  const inBaseline = (year: number) => year >= config.baseline.firstYear && year <= config.baseline.lastYear;
  const sameMonthEachYear = sameMonth.map((entry) => ({ year: yearOf(entry.month), fillingPercent: entry.fillingPercent, inBaseline: inBaseline(yearOf(entry.month)) }));
  const baselineYears = sameMonthEachYear
    .filter((entry): entry is { year: number; fillingPercent: number; inBaseline: boolean } => entry.inBaseline && entry.fillingPercent !== null)
    .map(({ year, fillingPercent }) => ({ year, fillingPercent }));

  const current = series[series.length - 1] as RegionalMonth;
  let bulletin: Comparison;
  if (current.fillingPercent === null) {
    bulletin = { kind: 'low-coverage', coveragePercent: current.coveragePercent, thresholdPercent: 100 * config.coverage.minRegionCoverage };
  } else if (baselineYears.length < config.baseline.minYears) {
    bulletin = { kind: 'short-baseline', usableYears: baselineYears.length, neededYears: config.baseline.minYears };
  } else {
    const baselineMedianPercent = median(baselineYears.map((entry) => entry.fillingPercent));
    const percentOfBaseline = (100 * current.fillingPercent) / baselineMedianPercent;
    bulletin = {
      kind: 'stated',
      fillingPercent: current.fillingPercent,
      coveragePercent: current.coveragePercent,
      baselineMedianPercent,
      percentOfBaseline,
      bandKey: bandFor(percentOfBaseline, config.statusBands),
      baselineYears,
    };
  }
  return { series, sameMonthEachYear, bulletin };
}
