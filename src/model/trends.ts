/**
 * Trends over the whole record, for every water body and sub-region, and a change point in the
 * regional series.
 *
 * Every monthly series gets the same test, whatever its length, so the method never switches
 * between issues as the record grows: Mann-Kendall on calendar-month anomalies with the variance
 * inflated for lag-1 autocorrelation and a Student t reference (ar1MannKendall in src/stats; the
 * `trend --seasonal` command's decision). Seasonality is still measured (Kruskal-Wallis across
 * calendar months, p < trends.seasonalityP) to choose the slope: the seasonal Sen slope (Hirsch,
 * Slack & Smith 1982) for a seasonal series, Sen's slope otherwise. Only observed months enter
 * (filled months would add made-up autocorrelation). Series with fewer than trends.minMonths
 * observed months are not tested. p values across water bodies are adjusted by Benjamini &
 * Hochberg (1995) at trends.falseDiscoveryRate, and so are those across sub-regions.
 */
import type { BulletinConfig } from '../ingest/index.ts';
import {
  ar1MannKendall,
  ar1Pettitt,
  benjaminiHochberg,
  calendarMonthAnomalies,
  finiteOrNull,
  kruskalWallis,
  median,
  pettitt,
  seasonalKendall,
  sensSlope,
} from '../stats/index.ts';
import { OBSERVED, type BodySeries } from './bodySeries.ts';
import type { GroupMonth } from './aggregate.ts';
import { defineTask, type WorkerPool } from '../parallel/pool.ts';

export type TrendMethod = 'mann-kendall-ar1';

export interface TrendTest {
  observedMonths: number;
  /** Kruskal-Wallis p across calendar months. */
  seasonalityP: number;
  method: TrendMethod;
  /** Units of the series per year. */
  slopePerYear: number;
  p: number;
  /**
   * The most likely single shift in level (Pettitt's test on the calendar-month anomalies): the
   * first month after it, its p, the step (median anomaly after minus before, units of the
   * series), and the trend test of the months before it (null when they are fewer than
   * trends.minMonths). Whether it counts is decided across the family (summarize). Null when the
   * test makes no statement.
   */
  shift: { month: number; p: number; step: number; beforeSlopePerYear: number | null; beforeP: number | null } | null;
}

export interface TrendEntry {
  id: string;
  name: string;
  /** Null when the series was too short to test. */
  test: TrendTest | null;
  pAdjusted: number | null;
  /**
   * 'decline' or 'rise' only when the adjusted p is within the false discovery rate and the change
   * is not explained by a single shift; 'shift-down' or 'shift-up' when it is (see summarize).
   */
  direction: 'decline' | 'rise' | 'shift-down' | 'shift-up' | 'none' | 'untested';
}

/** A trend entry of any family: the test of one series, its adjusted p and what it says. */
export type Judged<E> = E & { pAdjusted: number | null; direction: TrendEntry['direction'] };

/** The trends of one family of series (bodies, sub-regions, a quality parameter's bodies), adjusted together. */
export interface TrendFamily<E> {
  entries: Array<Judged<E>>;
  tested: number;
  declining: number;
  rising: number;
  /** Entries whose change is a single shift in level, not a steady trend. */
  shiftedDown: number;
  shiftedUp: number;
  falseDiscoveryRate: number;
}

export type TrendSummary = TrendFamily<{ id: string; name: string; test: TrendTest | null }>;

/** The settings a trend test reads (bulletin.json "trends"). */
export type TrendSettings = BulletinConfig['trends'];

/** The trend test of one monthly series (NaN = missing), or null when it is too short. */
export function trendTest(months: ArrayLike<number>, values: ArrayLike<number>, config: { trends: TrendSettings }): TrendTest | null {
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
  const seasonality = kruskalWallis(
    keptMonths.map((month) => month % 12),
    keptValues,
  );
  const seasonal = seasonality.reason === null && seasonality.p < config.trends.seasonalityP;
  const years = keptMonths.map((month) => month / 12);
  const slope = (from: number, to: number) =>
    seasonal
      ? seasonalKendall(keptMonths.slice(from, to), keptValues.slice(from, to)).slope
      : sensSlope(years.slice(from, to), keptValues.slice(from, to)).slope;
  // A single shift in level, on the anomalies (so a season is never taken for one).
  const anomalies = calendarMonthAnomalies(keptValues, keptMonths);
  const change = ar1Pettitt(anomalies);
  let shift: TrendTest['shift'] = null;
  if (change.reason === null && change.location > 0 && change.location < keptValues.length) {
    const cut = change.location;
    // The months before the shift are tested only where the shift can hold after the adjustment
    // across the family (Benjamini-Hochberg rejects no p above the false discovery rate): the
    // same decisions, at a fraction of the cost for a large inventory.
    const enough = cut >= config.trends.minMonths && change.p <= config.trends.falseDiscoveryRate;
    shift = {
      month: keptMonths[cut] as number,
      p: change.p,
      step: median(anomalies.subarray(cut)) - median(anomalies.subarray(0, cut)),
      beforeSlopePerYear: enough ? finiteOrNull(slope(0, cut)) : null,
      beforeP: enough ? finiteOrNull(ar1MannKendall(years.slice(0, cut), keptValues.slice(0, cut), keptMonths.slice(0, cut)).p) : null,
    };
  }
  return {
    observedMonths: keptValues.length,
    seasonalityP: seasonality.p,
    method: 'mann-kendall-ar1',
    slopePerYear: slope(0, keptValues.length),
    // The anomalies are the ones the test would make from keptMonths: passed as they are, not made again.
    p: ar1MannKendall(years, anomalies).p,
    shift,
  };
}

/**
 * What a tested entry shows. A single shift in level (its Pettitt p within the false discovery
 * rate across the family) explains the change, unless the months before the shift hold a trend
 * of the same sign on their own (their test at the 5 % level, unadjusted: a further condition on
 * top of the adjusted trend test): then it is a steady decline or rise, if the whole record's
 * adjusted trend test holds. Without a shift, the adjusted trend test decides alone.
 */
function directionOf(test: TrendTest, trendHolds: boolean, shiftHolds: boolean): TrendEntry['direction'] {
  const sign = Math.sign(test.slopePerYear);
  const shift = test.shift;
  if (shift && shiftHolds) {
    const steadyBefore = shift.beforeP !== null && shift.beforeP < 0.05 && sign !== 0 && Math.sign(shift.beforeSlopePerYear ?? 0) === sign;
    if (!(steadyBefore && trendHolds)) return shift.step < 0 ? 'shift-down' : shift.step > 0 ? 'shift-up' : 'none';
  }
  if (!trendHolds || sign === 0) return 'none';
  return sign < 0 ? 'decline' : 'rise';
}

/**
 * Benjamini-Hochberg across one family, for the trend tests and for the shifts apart, and each
 * entry's direction (directionOf).
 */
export function summarize<E extends { test: TrendTest | null }>(entries: E[], falseDiscoveryRate: number): TrendFamily<E> {
  const adjusted = benjaminiHochberg(
    entries.map((entry) => (entry.test && Number.isFinite(entry.test.p) ? entry.test.p : null)),
    falseDiscoveryRate,
  );
  const shifts = benjaminiHochberg(
    entries.map((entry) => (entry.test?.shift && Number.isFinite(entry.test.shift.p) ? entry.test.shift.p : null)),
    falseDiscoveryRate,
  );
  const out: Array<Judged<E>> = entries.map((entry, k) => {
    const pAdjusted = Number.isFinite(adjusted.adjusted[k]) ? (adjusted.adjusted[k] as number) : null;
    const direction: TrendEntry['direction'] =
      !entry.test || pAdjusted === null ? 'untested' : directionOf(entry.test, adjusted.rejected[k] === true, shifts.rejected[k] === true);
    return { ...entry, pAdjusted, direction };
  });
  return {
    entries: out,
    tested: out.filter((entry) => entry.direction !== 'untested').length,
    declining: out.filter((entry) => entry.direction === 'decline').length,
    rising: out.filter((entry) => entry.direction === 'rise').length,
    shiftedDown: out.filter((entry) => entry.direction === 'shift-down').length,
    shiftedUp: out.filter((entry) => entry.direction === 'shift-up').length,
    falseDiscoveryRate,
  };
}

/**
 * Trends of every water body; `tests` when they were computed beforehand (bodyTrendTests on the
 * worker pool), otherwise here.
 */
export function bodyTrends(
  series: BodySeries,
  bodies: Array<{ id: string; name: string }>,
  config: BulletinConfig,
  tests?: Array<TrendTest | null>,
): TrendSummary {
  const computed = tests ?? testBatch(series.firstMonth, series.months, observedValues(series, 0, bodies.length), config.trends);
  const entries = bodies.map((body, k) => ({ id: body.id, name: body.name, test: computed[k] ?? null }));
  return summarize(entries, config.trends.falseDiscoveryRate);
}

/** Bodies per batch sent to a worker thread. */
const BATCH = 2000;
/** Below this many bodies the tests run in this thread (a worker's start-up would cost more). */
const PARALLEL_BODIES = 4000;

/**
 * The trend test of every water body, on the worker pool for a large inventory. Each batch carries
 * only the observed months of its bodies as one typed array; the results come back in body order,
 * so they are the same whatever the number of threads.
 */
export function bodyTrendTests(
  series: BodySeries,
  trends: TrendSettings,
  pool: WorkerPool,
  onBatch?: (series: number) => void,
): Promise<Array<TrendTest | null>> {
  return manyTrendTests(
    series.firstMonth,
    series.months,
    series.filling.length,
    (from, to) => observedValues(series, from, to),
    trends,
    pool,
    onBatch,
  );
}

/**
 * The trend tests of `count` monthly series that share their months, given as body-major matrices
 * of rows [from, to) (NaN = missing): in this thread for a few, in batches on the pool for many.
 */
export async function manyTrendTests(
  firstMonth: number,
  months: number,
  count: number,
  rows: (from: number, to: number) => Float64Array,
  trends: TrendSettings,
  pool: WorkerPool,
  onBatch?: (series: number) => void,
): Promise<Array<TrendTest | null>> {
  if (count < PARALLEL_BODIES || pool.size < 2) {
    const tests = testBatch(firstMonth, months, rows(0, count), trends);
    onBatch?.(count);
    return tests;
  }
  // A batch's matrix is made only when a thread is about to take it (two in hand per thread), so
  // the series of a whole inventory are never copied at once.
  const results: EncodedTests[] = [];
  let next = 0;
  const lane = async () => {
    while (next < count) {
      const from = next;
      next = Math.min(count, from + BATCH);
      const size = next - from;
      const values = rows(from, next); // moved to the thread: empty here afterwards
      results[from / BATCH] = await pool.run(TREND_TESTS, { firstMonth, months, values, trends }, [values.buffer as ArrayBuffer]);
      onBatch?.(size);
    }
  };
  await Promise.all(Array.from({ length: 2 * pool.size }, lane));
  return results.flatMap(decodeTests);
}

/** Observed filling of bodies [from, to), body-major, NaN where not observed. */
function observedValues(series: BodySeries, from: number, to: number): Float64Array {
  const values = new Float64Array((to - from) * series.months);
  for (let body = from; body < to; body++) {
    const filling = series.filling[body] as Float64Array;
    const state = series.state[body] as Uint8Array;
    const offset = (body - from) * series.months;
    for (let slot = 0; slot < series.months; slot++)
      values[offset + slot] = state[slot] === OBSERVED ? (filling[slot] as number) : Number.NaN;
  }
  return values;
}

function testBatch(firstMonth: number, months: number, values: Float64Array, trends: TrendSettings): Array<TrendTest | null> {
  const monthIndex = Int32Array.from({ length: months }, (_, k) => firstMonth + k);
  const tests: Array<TrendTest | null> = [];
  for (let offset = 0; offset < values.length; offset += months)
    tests.push(trendTest(monthIndex, values.subarray(offset, offset + months), { trends }));
  return tests;
}

const METHOD_CODES: TrendMethod[] = ['mann-kendall-ar1'];

/** Trend tests as typed columns, to cross between threads cheaply; method −1 = not tested. */
export interface EncodedTests {
  method: Int8Array;
  observedMonths: Int32Array;
  seasonalityP: Float64Array;
  slopePerYear: Float64Array;
  p: Float64Array;
  /** The shift's first month, −1 for none; its p and the trend before it, NaN for none. */
  shiftMonth: Int32Array;
  shiftP: Float64Array;
  shiftStep: Float64Array;
  beforeSlopePerYear: Float64Array;
  beforeP: Float64Array;
}

/** encodedTestBatch on a worker thread. */
const TREND_TESTS = defineTask<Parameters<typeof encodedTestBatch>[0], EncodedTests>(import.meta.url, 'encodedTestBatch');

/** The worker side: a batch of series, tested and encoded. */
export function encodedTestBatch(input: { firstMonth: number; months: number; values: Float64Array; trends: TrendSettings }): EncodedTests {
  const tests = testBatch(input.firstMonth, input.months, input.values, input.trends);
  const encoded: EncodedTests = {
    method: new Int8Array(tests.length),
    observedMonths: new Int32Array(tests.length),
    seasonalityP: new Float64Array(tests.length),
    slopePerYear: new Float64Array(tests.length),
    p: new Float64Array(tests.length),
    shiftMonth: new Int32Array(tests.length),
    shiftP: new Float64Array(tests.length),
    shiftStep: new Float64Array(tests.length),
    beforeSlopePerYear: new Float64Array(tests.length),
    beforeP: new Float64Array(tests.length),
  };
  tests.forEach((test, k) => {
    encoded.method[k] = test ? METHOD_CODES.indexOf(test.method) : -1;
    encoded.observedMonths[k] = test?.observedMonths ?? 0;
    encoded.seasonalityP[k] = test?.seasonalityP ?? Number.NaN;
    encoded.slopePerYear[k] = test?.slopePerYear ?? Number.NaN;
    encoded.p[k] = test?.p ?? Number.NaN;
    encoded.shiftMonth[k] = test?.shift?.month ?? -1;
    encoded.shiftP[k] = test?.shift?.p ?? Number.NaN;
    encoded.shiftStep[k] = test?.shift?.step ?? Number.NaN;
    encoded.beforeSlopePerYear[k] = test?.shift?.beforeSlopePerYear ?? Number.NaN;
    encoded.beforeP[k] = test?.shift?.beforeP ?? Number.NaN;
  });
  return encoded;
}

function decodeTests(encoded: EncodedTests): Array<TrendTest | null> {
  return Array.from(encoded.method, (code, k) =>
    code < 0
      ? null
      : {
          observedMonths: encoded.observedMonths[k] as number,
          seasonalityP: encoded.seasonalityP[k] as number,
          method: METHOD_CODES[code] as TrendMethod,
          slopePerYear: encoded.slopePerYear[k] as number,
          p: encoded.p[k] as number,
          shift:
            (encoded.shiftMonth[k] as number) < 0
              ? null
              : {
                  month: encoded.shiftMonth[k] as number,
                  p: encoded.shiftP[k] as number,
                  step: encoded.shiftStep[k] as number,
                  beforeSlopePerYear: finiteOrNull(encoded.beforeSlopePerYear[k] as number),
                  beforeP: finiteOrNull(encoded.beforeP[k] as number),
                },
        },
  );
}

export function groupTrends(groups: Array<{ id: string; name: string; series: GroupMonth[] }>, config: BulletinConfig): TrendSummary {
  const entries = groups.map((entry) => ({
    id: entry.id,
    name: entry.name,
    test: trendTest(
      entry.series.map((row) => row.month),
      entry.series.map((row) => row.fillingPercent ?? Number.NaN),
      config,
    ),
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
  const medians = Array.from({ length: 12 }, (_, month) =>
    median(stated.filter((row) => row.month % 12 === month).map((row) => row.fillingPercent)),
  );
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
