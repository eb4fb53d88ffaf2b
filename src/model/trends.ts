/**
 * Trends over the whole record, for every water body and sub-region, and a change point in the
 * regional series.
 *
 * A monthly series is tested for seasonality first (Kruskal-Wallis across calendar months,
 * p < trends.seasonalityP). A seasonal series gets the seasonal Kendall test (with the covariance
 * correction of Hirsch & Slack 1984 where every month has 10 years or more) and the seasonal Sen
 * slope; a series that is not seasonal gets the Mann-Kendall test with the Hamed & Rao (1998)
 * autocorrelation correction and Sen's slope. Only observed months enter (filled months would add
 * made-up autocorrelation). Series with fewer than trends.minMonths observed months are not tested.
 * p values across water bodies are adjusted by Benjamini & Hochberg (1995) at
 * trends.falseDiscoveryRate, and so are those across sub-regions.
 */
import type { BulletinConfig } from '../ingest/index.ts';
import { benjaminiHochberg, hamedRao, kruskalWallis, median, pettitt, seasonalKendall, sensSlope } from '../stats/index.ts';
import { OBSERVED, type BodySeries } from './bodySeries.ts';
import type { GroupMonth } from './aggregate.ts';

export type TrendMethod = 'seasonal-kendall' | 'seasonal-kendall-covariance' | 'mann-kendall-hamed-rao';

export interface TrendTest {
  observedMonths: number;
  /** Kruskal-Wallis p across calendar months. */
  seasonalityP: number;
  method: TrendMethod;
  /** Units of the series per year. */
  slopePerYear: number;
  p: number;
}

export interface TrendEntry {
  id: string;
  name: string;
  /** Null when the series was too short to test. */
  test: TrendTest | null;
  pAdjusted: number | null;
  /** 'decline' or 'rise' only when the adjusted p is within the false discovery rate. */
  direction: 'decline' | 'rise' | 'none' | 'untested';
}

export interface TrendSummary {
  entries: TrendEntry[];
  tested: number;
  declining: number;
  rising: number;
  falseDiscoveryRate: number;
}

/** The trend test of one monthly series (NaN = missing), or null when it is too short. */
export function trendTest(months: ArrayLike<number>, values: ArrayLike<number>, config: BulletinConfig): TrendTest | null {
  const keptMonths: number[] = [];
  const keptValues: number[] = [];
  for (let k = 0; k < values.length; k++) {
    const value = values[k] as number;
    if (Number.isFinite(value)) {
      keptMonths.push(months[k] as number);
      keptValues.push(value);
    }
  }
  if (keptValues.length < config.trends.minMonths) return null;
  const seasonality = kruskalWallis(keptMonths.map((month) => month % 12), keptValues);
  const seasonal = seasonality.reason === null && seasonality.p < config.trends.seasonalityP;
  if (seasonal) {
    const result = seasonalKendall(keptMonths, keptValues);
    const withCovariance = result.covariance.applied;
    return {
      observedMonths: keptValues.length,
      seasonalityP: seasonality.p,
      method: withCovariance ? 'seasonal-kendall-covariance' : 'seasonal-kendall',
      slopePerYear: result.slope,
      p: result.covariance.applied ? result.covariance.p : result.p,
    };
  }
  const years = keptMonths.map((month) => month / 12);
  return {
    observedMonths: keptValues.length,
    seasonalityP: seasonality.p,
    method: 'mann-kendall-hamed-rao',
    slopePerYear: sensSlope(years, keptValues).slope,
    p: hamedRao(years, keptValues).p,
  };
}

function summarize(entries: Array<{ id: string; name: string; test: TrendTest | null }>, falseDiscoveryRate: number): TrendSummary {
  const adjusted = benjaminiHochberg(entries.map((entry) => (entry.test && Number.isFinite(entry.test.p) ? entry.test.p : null)), falseDiscoveryRate);
  const out: TrendEntry[] = entries.map((entry, k) => {
    const pAdjusted = Number.isFinite(adjusted.adjusted[k]) ? (adjusted.adjusted[k] as number) : null;
    const direction: TrendEntry['direction'] = !entry.test || pAdjusted === null ? 'untested' : adjusted.rejected[k] ? (entry.test.slopePerYear < 0 ? 'decline' : entry.test.slopePerYear > 0 ? 'rise' : 'none') : 'none';
    return { ...entry, pAdjusted, direction };
  });
  return {
    entries: out,
    tested: out.filter((entry) => entry.direction !== 'untested').length,
    declining: out.filter((entry) => entry.direction === 'decline').length,
    rising: out.filter((entry) => entry.direction === 'rise').length,
    falseDiscoveryRate,
  };
}

export function bodyTrends(series: BodySeries, bodies: Array<{ id: string; name: string }>, config: BulletinConfig): TrendSummary {
  const months = Int32Array.from({ length: series.months }, (_, k) => series.firstMonth + k);
  const entries = bodies.map((body, k) => {
    const state = series.state[k] as Uint8Array;
    const values = Float64Array.from(series.filling[k] as Float64Array, (value, slot) => (state[slot] === OBSERVED ? value : Number.NaN));
    return { id: body.id, name: body.name, test: trendTest(months, values, config) };
  });
  return summarize(entries, config.trends.falseDiscoveryRate);
}

export function groupTrends(groups: Array<{ id: string; name: string; series: GroupMonth[] }>, config: BulletinConfig): TrendSummary {
  const entries = groups.map((entry) => ({
    id: entry.id,
    name: entry.name,
    test: trendTest(entry.series.map((row) => row.month), entry.series.map((row) => row.fillingPercent ?? Number.NaN), config),
  }));
  return summarize(entries, config.trends.falseDiscoveryRate);
}

export interface ChangePoint {
  /** First month after the change (YYYY-MM index), or null when the test makes no statement. */
  month: number | null;
  k: number;
  p: number;
  /** Mean anomaly before and after, percentage points. */
  meanBefore: number | null;
  meanAfter: number | null;
}

/**
 * Pettitt's test on the regional series with the seasonal cycle removed (each month minus the
 * median of its calendar month over the whole record), so the change point is not a season.
 */
export function regionalChangePoint(series: GroupMonth[]): ChangePoint {
  const stated = series.filter((row) => row.fillingPercent !== null) as Array<GroupMonth & { fillingPercent: number }>;
  const medians = Array.from({ length: 12 }, (_, month) => median(stated.filter((row) => row.month % 12 === month).map((row) => row.fillingPercent)));
  const anomalies = stated.map((row) => row.fillingPercent - (medians[row.month % 12] as number));
  const result = pettitt(anomalies);
  if (result.reason !== null) return { month: null, k: result.k, p: result.p, meanBefore: null, meanAfter: null };
  const mean = (list: number[]) => list.reduce((sum, value) => sum + value, 0) / list.length;
  return {
    month: stated[result.location]?.month ?? null,
    k: result.k,
    p: result.p,
    meanBefore: mean(anomalies.slice(0, result.location)),
    meanAfter: mean(anomalies.slice(result.location)),
  };
}
