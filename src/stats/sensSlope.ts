import { finitePairs } from './finiteValues.ts';
import { normalQuantile } from './normalQuantile.ts';
import { quantileSorted } from './quantile.ts';
import { selectKth } from './selectKth.ts';
import { tieCorrection } from './tieCorrection.ts';
import type { TrendReason } from './mannKendall.ts';

export interface SensSlopeResult {
  /** Pairs (time, value) used, after skipping missing ones. */
  n: number;
  /** Pairwise slopes: pairs with different times. */
  slopes: number;
  /** Median of the pairwise slopes, in value units per time unit. */
  slope: number;
  /** median(values) − slope · median(times) (Conover 1980). */
  intercept: number;
  lower: number;
  upper: number;
  confidence: number;
  reason: TrendReason;
}

/**
 * Sen's (1968) slope: the median of the slopes (yⱼ − yᵢ)/(tⱼ − tᵢ) over all pairs with tⱼ ≠ tᵢ, in
 * the caller's time unit (pass decimal years for slopes per year). Missing pairs are skipped.
 *
 * Confidence interval by the rank method (Sen 1968, eq. 2.6; Gilbert 1987, §16.5): with N slopes,
 * C = z₁₋α/₂·√Var(S) where Var(S) = [n(n−1)(2n+5) − Σ ties in t − Σ ties in y]/18, the limits are
 * the M₁-th and (M₂+1)-th smallest slopes for M₁ = (N − C)/2 and M₂ = (N + C)/2. M₁ and M₂ are
 * rounded to the nearest whole number, halves to even (as numpy's round does, so results match
 * scipy.stats.theilslopes), and kept within 1..N. The intercept is the "separate medians" one of
 * Conover (1980), scipy's default.
 *
 * The median and the two limits are found by quickselect, not by sorting: O(n²) time for the slopes
 * and expected O(n²) for the selection, against O(n² log n) for a sort. O(n²) memory.
 */
export function sensSlope(times: ArrayLike<number | null | undefined>, values: ArrayLike<number | null | undefined>, { confidence = 0.95 } = {}): SensSlopeResult {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError('sensSlope requires a confidence between 0 and 1');
  const { times: t, values: y } = finitePairs(times, values);
  const n = y.length;
  const slopes = new Float64Array((n * (n - 1)) / 2);
  let count = 0;
  for (let i = 0; i < n - 1; i++) {
    const ti = t[i]!;
    const yi = y[i]!;
    for (let j = i + 1; j < n; j++) {
      const dt = t[j]! - ti;
      if (dt !== 0) slopes[count++] = (y[j]! - yi) / dt;
    }
  }
  const none = { n, slopes: count, slope: Number.NaN, intercept: Number.NaN, lower: Number.NaN, upper: Number.NaN, confidence };
  if (count === 0) return { ...none, reason: 'too-few-values' };
  const work = slopes.subarray(0, count);

  const z = normalQuantile(1 - (1 - confidence) / 2);
  const variance = (n * (n - 1) * (2 * n + 5) - tieCorrection(t).varianceTerm - tieCorrection(y).varianceTerm) / 18;
  const spread = z * Math.sqrt(Math.max(0, variance));
  const lowerIndex = Math.max(roundHalfEven((count - spread) / 2) - 1, 0);
  const upperIndex = Math.min(roundHalfEven((count + spread) / 2), count - 1);
  const middle = (count - 1) / 2;
  const wanted = [...new Set([lowerIndex, Math.floor(middle), Math.ceil(middle), upperIndex])].sort((a, b) => a - b);
  const picked = new Map<number, number>();
  let from = 0;
  for (const index of wanted) {
    picked.set(index, selectKth(work, index, from, count - 1));
    from = index;
  }
  const slope = ((picked.get(Math.floor(middle)) as number) + (picked.get(Math.ceil(middle)) as number)) / 2;
  const intercept = quantileSorted(Float64Array.from(y).sort(), 0.5) - slope * quantileSorted(Float64Array.from(t).sort(), 0.5);
  return { ...none, slope, intercept, lower: picked.get(lowerIndex) as number, upper: picked.get(upperIndex) as number, reason: n < 3 ? 'too-few-values' : null };
}

/** Nearest whole number, halves to the even neighbour (IEEE 754 roundTiesToEven). */
function roundHalfEven(value: number): number {
  const floor = Math.floor(value);
  const fraction = value - floor;
  if (fraction > 0.5) return floor + 1;
  if (fraction < 0.5) return floor;
  return floor % 2 === 0 ? floor : floor + 1;
}
