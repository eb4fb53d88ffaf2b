import { finitePairs } from './finiteValues.ts';
import { mannKendall, type MannKendallResult } from './mannKendall.ts';
import { normalQuantile } from './normalQuantile.ts';
import { normalSurvival } from './normalSurvival.ts';
import { sensSlope } from './sensSlope.ts';

export interface HamedRaoResult {
  /** The plain Mann-Kendall test on the same values. */
  plain: MannKendallResult;
  /** n/n*: the variance inflation from autocorrelation; 1 when no lag is significant. */
  correctionFactor: number;
  /** Lags whose rank autocorrelation was significant and entered the sum. */
  significantLags: number[];
  varianceS: number;
  z: number;
  p: number;
  reason: null | 'too-few-values' | 'no-variance' | 'correction-not-positive';
}

/**
 * Mann-Kendall with the variance correction for autocorrelation of Hamed & Rao (1998, Journal of
 * Hydrology 204, 182–196). Missing pairs are skipped; lags count observed values, so the series
 * should be regular in time.
 *
 * 1. Remove the trend with Sen's slope: dᵢ = xᵢ − β·tᵢ.
 * 2. Rank the dᵢ (ties get their mean rank) and compute the autocorrelation of the ranks at each
 *    lag k = 1 … n−1: ρ(k) = Σᵢ (Rᵢ − R̄)(Rᵢ₊ₖ − R̄) / Σᵢ (Rᵢ − R̄)².
 * 3. Keep the lags with |ρ(k)| > z₁₋α/₂/√n (significant at level α, two-sided).
 * 4. n/n* = 1 + 2/(n(n−1)(n−2)) · Σ over kept lags of (n−k)(n−k−1)(n−k−2)·ρ(k). The sum is signed,
 *    as in the paper: negative autocorrelation shrinks the variance.
 * 5. Var*(S) = Var(S)·n/n*; Z = (S − sgn S)/√Var*(S); p two-sided.
 * A factor that is not positive gives no statement (reason 'correction-not-positive').
 * Cost O(n²).
 */
export function hamedRao(
  times: ArrayLike<number | null | undefined>,
  values: ArrayLike<number | null | undefined>,
  { alpha = 0.05 } = {},
): HamedRaoResult {
  const { times: t, values: x } = finitePairs(times, values);
  const plain = mannKendall(x);
  const n = x.length;
  if (plain.reason !== null) {
    return {
      plain,
      correctionFactor: Number.NaN,
      significantLags: [],
      varianceS: plain.varianceS,
      z: plain.z,
      p: plain.p,
      reason: plain.reason,
    };
  }
  const beta = sensSlope(t, x).slope;
  const ranks = averageRanks(Float64Array.from(x, (value, k) => value - beta * (t[k] as number)));
  const mean = (n + 1) / 2;
  let denominator = 0;
  for (const rank of ranks) denominator += (rank - mean) ** 2;
  const bound = normalQuantile(1 - alpha / 2) / Math.sqrt(n);
  const significantLags: number[] = [];
  let sum = 0;
  for (let lag = 1; lag < n; lag++) {
    let numerator = 0;
    for (let i = 0; i + lag < n; i++) numerator += ((ranks[i] as number) - mean) * ((ranks[i + lag] as number) - mean);
    const rho = denominator > 0 ? numerator / denominator : 0;
    if (Math.abs(rho) > bound) {
      significantLags.push(lag);
      sum += (n - lag) * (n - lag - 1) * (n - lag - 2) * rho;
    }
  }
  const correctionFactor = 1 + (2 / (n * (n - 1) * (n - 2))) * sum;
  if (!(correctionFactor > 0)) {
    return {
      plain,
      correctionFactor,
      significantLags,
      varianceS: Number.NaN,
      z: Number.NaN,
      p: Number.NaN,
      reason: 'correction-not-positive',
    };
  }
  const varianceS = plain.varianceS * correctionFactor;
  const z = (plain.s - Math.sign(plain.s)) / Math.sqrt(varianceS);
  return { plain, correctionFactor, significantLags, varianceS, z, p: Math.min(1, 2 * normalSurvival(Math.abs(z))), reason: null };
}

/** Ranks 1…n, ties sharing the mean of the ranks they span. O(n log n). */
function averageRanks(values: Float64Array): Float64Array {
  const order = Array.from(values.keys()).sort((a, b) => (values[a] as number) - (values[b] as number));
  const ranks = new Float64Array(values.length);
  for (let start = 0; start < order.length;) {
    let end = start;
    while (end + 1 < order.length && values[order[end + 1] as number] === values[order[start] as number]) end++;
    const rank = (start + end) / 2 + 1;
    for (let k = start; k <= end; k++) ranks[order[k] as number] = rank;
    start = end + 1;
  }
  return ranks;
}
