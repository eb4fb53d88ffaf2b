/**
 * The full set of trend statistics for one series, and for many series with the Benjamini-Hochberg
 * adjustment across them. Used by the `trend` command and the benchmark. The decision (`method`,
 * `p`, and the adjusted p from it) is the test the bulletin uses for every series (trendTest in
 * trends.ts): Mann-Kendall with the AR(1) variance inflation (ar1MannKendall), on calendar-month
 * anomalies with --seasonal. The other tests are reported beside it for comparison.
 */
import { ar1MannKendall, benjaminiHochberg, hamedRao, mannKendall, pettitt, seasonalKendall, sensSlope } from '../stats/index.ts';

/** The test the decision rests on (one for every series, whatever its length). */
export const DECISION_METHOD = 'mann-kendall-ar1';

/** A plain array or a typed array. */
export type Numbers = ArrayLike<number> & Iterable<number>;

export interface TrendSeries {
  key: string;
  /** Decimal years. */
  times: Numbers;
  /** Month indices (year × 12 + month − 1); needed for seasonal tests. */
  months?: Numbers;
  /** NaN = missing. */
  values: Numbers;
}

export interface TrendOptions {
  seasonal: boolean;
  /** Sen's slope confidence level; default 0.95. */
  confidence?: number;
  /** False discovery rate for the adjustment across series; default 0.05. */
  falseDiscoveryRate?: number;
}

export interface TrendRow {
  series: string;
  n: number;
  /** The decision's test and its two-sided p (DECISION_METHOD). */
  method: typeof DECISION_METHOD;
  p: number;
  ar1Lag1: number;
  ar1Phi: number;
  ar1Factor: number;
  ar1DegreesOfFreedom: number;
  ar1Z: number;
  s: number;
  varianceS: number;
  /** Plain Mann-Kendall (independent values assumed). */
  mannKendallZ: number;
  mannKendallP: number;
  zUncorrected: number;
  pUncorrected: number;
  tau: number;
  slopePerYear: number;
  intercept: number;
  slopeLower: number;
  slopeUpper: number;
  autocorrelationFactor: number;
  autocorrelationZ: number;
  autocorrelationP: number;
  changePointK: number;
  /** Index (0-based, in the series as given) of the first value after the change; null when none. */
  changePointIndex: number | null;
  changePointP: number;
  seasonalS: number;
  seasonalVarianceS: number;
  seasonalZ: number;
  seasonalP: number;
  seasonalSlopePerYear: number;
  seasonalCovarianceZ: number;
  seasonalCovarianceP: number;
  /** The decision's p adjusted across series (Benjamini-Hochberg), and whether it is within the false discovery rate. */
  pAdjusted: number;
  rejected: boolean;
  /** Why a test could not be made, test by test; null when every test was made. */
  reason: string | null;
}

/** Every statistic for one series; cost O(n²). */
export function trendRow(series: TrendSeries, options: TrendOptions): Omit<TrendRow, 'pAdjusted' | 'rejected'> {
  const plain = mannKendall(series.values);
  const decision = ar1MannKendall(series.times, series.values, options.seasonal ? series.months : undefined);
  const slope = sensSlope(series.times, series.values, { confidence: options.confidence ?? 0.95 });
  const corrected = hamedRao(series.times, series.values);
  const change = pettitt(series.values);
  const observedIndex: number[] = [];
  for (let k = 0; k < series.values.length; k++) if (Number.isFinite(series.values[k])) observedIndex.push(k);
  let seasonal = null;
  if (options.seasonal) {
    if (!series.months || Array.from(series.months).some((month) => Number.isNaN(month)))
      throw new RangeError('seasonal trends require monthly times');
    seasonal = seasonalKendall(series.months, series.values);
  }
  const reasons = [
    plain.reason && `mann-kendall: ${plain.reason}`,
    corrected.reason && corrected.reason !== plain.reason ? `autocorrelation: ${corrected.reason}` : null,
    seasonal?.reason ? `seasonal: ${seasonal.reason}` : null,
    seasonal && !seasonal.covariance.applied
      ? `seasonal covariance: too few years (${seasonal.covariance.fewestYears} of ${seasonal.covariance.neededYears})`
      : null,
  ].filter(Boolean);
  return {
    series: series.key,
    n: plain.n,
    method: DECISION_METHOD,
    p: decision.p,
    ar1Lag1: decision.lag1,
    ar1Phi: decision.phi,
    ar1Factor: decision.correctionFactor,
    ar1DegreesOfFreedom: decision.degreesOfFreedom,
    ar1Z: decision.z,
    s: plain.s,
    varianceS: plain.varianceS,
    mannKendallZ: plain.z,
    mannKendallP: plain.p,
    zUncorrected: plain.zUncorrected,
    pUncorrected: plain.pUncorrected,
    tau: plain.tau,
    slopePerYear: slope.slope,
    intercept: slope.intercept,
    slopeLower: slope.lower,
    slopeUpper: slope.upper,
    autocorrelationFactor: corrected.correctionFactor,
    autocorrelationZ: corrected.z,
    autocorrelationP: corrected.p,
    changePointK: change.k,
    changePointIndex: change.reason === null ? (observedIndex[change.location] ?? null) : null,
    changePointP: change.p,
    seasonalS: seasonal?.s ?? Number.NaN,
    seasonalVarianceS: seasonal?.varianceS ?? Number.NaN,
    seasonalZ: seasonal?.z ?? Number.NaN,
    seasonalP: seasonal?.p ?? Number.NaN,
    seasonalSlopePerYear: seasonal?.slope ?? Number.NaN,
    seasonalCovarianceZ: seasonal?.covariance.applied ? seasonal.covariance.z : Number.NaN,
    seasonalCovarianceP: seasonal?.covariance.applied ? seasonal.covariance.p : Number.NaN,
    reason: reasons.length > 0 ? reasons.join('; ') : null,
  };
}

/** Adds the Benjamini-Hochberg adjusted p and decision across rows. */
export function adjustAcrossSeries(rows: Array<Omit<TrendRow, 'pAdjusted' | 'rejected'>>, falseDiscoveryRate = 0.05): TrendRow[] {
  const adjusted = benjaminiHochberg(
    rows.map((row) => row.p),
    falseDiscoveryRate,
  );
  return rows.map((row, k) => ({ ...row, pAdjusted: adjusted.adjusted[k] as number, rejected: adjusted.rejected[k] as boolean }));
}

export function trendTable(series: TrendSeries[], options: TrendOptions): TrendRow[] {
  return adjustAcrossSeries(
    series.map((entry) => trendRow(entry, options)),
    options.falseDiscoveryRate,
  );
}
