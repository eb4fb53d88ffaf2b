import { finitePairs } from './finiteValues.ts';
import { mannKendall, type TrendReason } from './mannKendall.ts';
import { median } from './median.ts';
import { sensSlope } from './sensSlope.ts';
import { studentTTwoSided } from './studentT.ts';

export interface Ar1MannKendallResult {
  /** Values used (missing ones skipped). */
  n: number;
  /** Kendall's S and its variance under independence (ties corrected), on the anomalies. */
  s: number;
  varianceS: number;
  /** Lag-1 autocorrelation of the detrended anomalies, as measured and after the bias correction (0 ≤ φ ≤ 0.99). */
  lag1: number;
  phi: number;
  /** n/n*: the variance inflation for an AR(1) process with that φ (1 when φ = 0). */
  correctionFactor: number;
  /** n* = n / correctionFactor, and the degrees of freedom of the t reference, max(1, n* − 2). */
  effectiveN: number;
  degreesOfFreedom: number;
  /** (S − sgn S)/√(Var(S)·n/n*), and its two-sided p from Student's t. */
  z: number;
  p: number;
  reason: TrendReason;
}

/** Largest φ used: beyond it the factor is dominated by the estimate's error. */
const MAX_PHI = 0.99;

/**
 * Mann-Kendall for a serially correlated series, whatever its length:
 *
 * 1. With `months` (year × 12 + month − 1), the season is removed first: each value minus the
 *    median of its calendar month over the record (observed values only).
 * 2. Kendall's S and Var(S) on the anomalies, as in mannKendall.
 * 3. The anomalies are detrended with Sen's slope; r₁ is their lag-1 autocorrelation (lags count
 *    observed values, so the series should be regular in time). r₁ is biased low for a short
 *    series with its mean, season and trend removed: φ = r₁ + (3 + 5r₁)/n, kept within [0, 0.99]
 *    (the first-order bias of r₁ about a known mean is −(1 + 3φ)/n, Kendall 1954; the larger
 *    correction here was chosen by the simulation in test/stats/ar1MannKendall.test.ts, which
 *    also removes season and trend; it is this project's choice, not a published constant).
 *    Negative autocorrelation is taken as none, so the variance is never shrunk.
 * 4. The variance inflation of Hamed & Rao (1998, Journal of Hydrology 204, 182–196, eq. 26):
 *    n/n* = 1 + 2/(n(n−1)(n−2)) Σₖ (n−k)(n−k−1)(n−k−2) ρₖ, with ρₖ the rank autocorrelation of an
 *    AR(1) normal process, (6/π) arcsin(φᵏ/2) (Pearson's relation between Spearman's and Pearson's
 *    correlation for normal variables), in place of the sample lags, which are too noisy to use
 *    one by one at these lengths.
 * 5. Z = (S − sgn S)/√(Var(S)·n/n*), and p from Student's t with max(1, n* − 2) degrees of
 *    freedom rather than the normal: with n* small (φ near 1) the variance itself is uncertain.
 *
 * In the simulation (trend-free AR(1) monthly series, φ from 0 to 0.9, 96 to 240 months), the
 * rejection rate at the 5 % level stays below 8 %; the plain seasonal test rejects over half the
 * time at φ = 0.9. The price is power: with φ = 0.9 only steep trends are found. Cost O(n²).
 */
export function ar1MannKendall(
  times: ArrayLike<number | null | undefined>,
  values: ArrayLike<number | null | undefined>,
  months?: ArrayLike<number>,
): Ar1MannKendallResult {
  const anomalies = months
    ? calendarMonthAnomalies(values, months)
    : Float64Array.from({ length: values.length }, (_, k) => {
        const value = values[k];
        return typeof value === 'number' ? value : Number.NaN;
      });
  const { times: t, values: x } = finitePairs(times, anomalies);
  const plain = mannKendall(x);
  const n = x.length;
  const none = { n, s: plain.s, varianceS: plain.varianceS, lag1: Number.NaN, phi: Number.NaN, correctionFactor: Number.NaN };
  if (plain.reason !== null)
    return { ...none, effectiveN: Number.NaN, degreesOfFreedom: Number.NaN, z: plain.z, p: plain.p, reason: plain.reason };
  const beta = sensSlope(t, x).slope;
  const detrended = Float64Array.from(x, (value, k) => value - beta * (t[k] as number));
  const lag1 = lag1Autocorrelation(detrended);
  const phi = correctedPhi(lag1, n);
  const correctionFactor = ar1VarianceFactor(phi, n);
  const effectiveN = n / correctionFactor;
  const degreesOfFreedom = Math.max(1, effectiveN - 2);
  const z = plain.s === 0 ? 0 : (plain.s - Math.sign(plain.s)) / Math.sqrt(plain.varianceS * correctionFactor);
  return {
    ...none,
    lag1,
    phi,
    correctionFactor,
    effectiveN,
    degreesOfFreedom,
    z,
    p: studentTTwoSided(Math.abs(z), degreesOfFreedom),
    reason: null,
  };
}

/** Each value minus the median of its calendar month (months: year × 12 + month − 1) over the observed values; NaN stays NaN. */
export function calendarMonthAnomalies(values: ArrayLike<number | null | undefined>, months: ArrayLike<number>): Float64Array {
  const byMonth: number[][] = Array.from({ length: 12 }, () => []);
  const calendar = (k: number) => (((months[k] as number) % 12) + 12) % 12;
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    if (typeof value === 'number' && Number.isFinite(value)) (byMonth[calendar(k)] as number[]).push(value);
  }
  const medians = byMonth.map((list) => (list.length > 0 ? median(list) : Number.NaN));
  return Float64Array.from({ length: values.length }, (_, k) => {
    const value = values[k];
    return typeof value === 'number' && Number.isFinite(value) ? value - (medians[calendar(k)] as number) : Number.NaN;
  });
}

/** φ from a lag-1 autocorrelation of n residuals: r₁ + (3 + 5r₁)/n, within [0, 0.99] (see ar1MannKendall, step 3). */
export function correctedPhi(lag1: number, n: number): number {
  return Math.min(MAX_PHI, Math.max(0, lag1 + (3 + 5 * lag1) / n));
}

/**
 * Hamed & Rao's (1998) variance inflation n/n* of a rank statistic over n values of an AR(1)
 * normal process with lag-1 correlation φ: 1 + 2/(n(n−1)(n−2)) Σₖ (n−k)(n−k−1)(n−k−2) ρₖ with
 * ρₖ = (6/π) arcsin(φᵏ/2).
 */
export function ar1VarianceFactor(phi: number, n: number): number {
  if (n < 3) return 1;
  let sum = 0;
  let power = 1;
  for (let k = 1; k < n; k++) {
    power *= phi;
    const rho = (6 / Math.PI) * Math.asin(power / 2);
    if (rho < 1e-15) break;
    sum += (n - k) * (n - k - 1) * (n - k - 2) * rho;
  }
  return 1 + (2 / (n * (n - 1) * (n - 2))) * sum;
}

/** Lag-1 autocorrelation of values in order about their mean; 0 when they do not vary. */
export function lag1Autocorrelation(values: ArrayLike<number>): number {
  const n = values.length;
  let mean = 0;
  for (let k = 0; k < n; k++) mean += values[k] as number;
  mean /= n;
  let numerator = 0;
  let denominator = 0;
  for (let k = 0; k < n; k++) {
    const d = (values[k] as number) - mean;
    denominator += d * d;
    if (k + 1 < n) numerator += d * ((values[k + 1] as number) - mean);
  }
  return denominator > 0 ? numerator / denominator : 0;
}
