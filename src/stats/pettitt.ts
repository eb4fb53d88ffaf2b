import { ar1VarianceFactor, correctedPhi, lag1Autocorrelation } from './ar1MannKendall.ts';
import { finiteValues } from './finiteValues.ts';
import { median } from './median.ts';

export interface PettittResult {
  n: number;
  /** K = max over t of |U_t|. */
  k: number;
  /** Number of values before the change: the change falls between value `location` and the next (1-based). */
  location: number;
  /** Approximate two-sided p = 2·exp(−6K²/(n³ + n²)), capped at 1. */
  p: number;
  reason: null | 'too-few-values';
}

/**
 * Pettitt (1979) non-parametric change-point test on values in time order (missing values
 * skipped): U_t = Σᵢ≤t Σⱼ>t sgn(xᵢ − xⱼ) for t = 1 … n−1, K = max |U_t| at the first t where
 * it is reached, p ≈ 2·exp(−6K²/(n³ + n²)) (Pettitt 1979, eq. 2.4, valid for p ≤ 0.5).
 * U_t is updated as U_t = U_{t−1} + Σⱼ sgn(x_t − xⱼ). Cost O(n²).
 */
export function pettitt(values: Iterable<number | null | undefined>): PettittResult {
  const x = finiteValues(values);
  const n = x.length;
  if (n < 3) return { n, k: 0, location: 0, p: Number.NaN, reason: 'too-few-values' };
  let u = 0;
  let k = 0;
  let location = 0;
  for (let t = 0; t < n - 1; t++) {
    const xt = x[t] as number;
    for (let j = 0; j < n; j++) {
      const xj = x[j] as number;
      u += xt > xj ? 1 : xt < xj ? -1 : 0;
    }
    if (Math.abs(u) > k) {
      k = Math.abs(u);
      location = t + 1;
    }
  }
  const p = Math.min(1, 2 * Math.exp((-6 * k * k) / (n ** 3 + n ** 2)));
  return { n, k, location, p, reason: null };
}

export interface Ar1PettittResult extends PettittResult {
  /** Lag-1 autocorrelation of the values about their two segment medians, and φ after the bias correction. */
  lag1: number;
  phi: number;
  /** n/n* for an AR(1) process with that φ; p = min(1, 2·exp(−6K²/((n³ + n²)·n/n*))). */
  correctionFactor: number;
}

/**
 * Pettitt's test for a serially correlated series. Pettitt's p assumes independent values, and
 * persistent ones make it find a change far too often (in this project's simulation of
 * trend-free AR(1) series with φ = 0.5, about a third of them). Like Kendall's S, U_t is a sum of
 * signs of pairs, so its variance is inflated by about the same factor: the dependence is
 * measured on the residuals about the two segments' medians (so the step itself is not taken for
 * persistence), φ is corrected as in ar1MannKendall, and K² is divided by the AR(1) factor n/n*
 * in Pettitt's approximation. This is the project's own adjustment, not a published one; it is
 * checked by simulation in test/model/trends.test.ts.
 */
export function ar1Pettitt(values: Iterable<number | null | undefined>): Ar1PettittResult {
  const x = finiteValues(values);
  const plain = pettitt(x);
  const n = x.length;
  if (plain.reason !== null || plain.location <= 0 || plain.location >= n)
    return { ...plain, lag1: Number.NaN, phi: Number.NaN, correctionFactor: Number.NaN };
  const before = median(x.subarray(0, plain.location));
  const after = median(x.subarray(plain.location));
  const residuals = Float64Array.from(x, (value, k) => value - (k < plain.location ? before : after));
  const lag1 = lag1Autocorrelation(residuals);
  const phi = correctedPhi(lag1, n);
  const correctionFactor = ar1VarianceFactor(phi, n);
  const p = Math.min(1, 2 * Math.exp((-6 * plain.k * plain.k) / ((n ** 3 + n ** 2) * correctionFactor)));
  return { ...plain, p, lag1, phi, correctionFactor };
}
