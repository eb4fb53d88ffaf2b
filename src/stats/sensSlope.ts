import { copyFinitePairs } from './finiteValues.ts';
import { kendallScore } from './kendallScore.ts';
import { normalQuantile } from './normalQuantile.ts';
import { scratch } from './scratch.ts';
import { selectRanks } from './selectRanks.ts';
import { pairSlopeRanks } from './pairSlopeRanks.ts';
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
 * Selecting the median and the two limits dominates the cost. When the times strictly increase
 * (no pair tied in time) they are selected without making every slope: randomized slope selection
 * by inversion counting (see pairSlopeRanks), O(n log n + N^(2/3) + K) for the K slopes between
 * the limits; when it cannot vouch for its answer, and when times repeat, all N slopes are made
 * and the four ranks selected among them (selectRanks), O(n²). Either way the result is the same
 * double as from sorting all slopes. O(N) work memory at most, reused between calls.
 */
export function sensSlope(
  times: ArrayLike<number | null | undefined>,
  values: ArrayLike<number | null | undefined>,
  { confidence = 0.95 } = {},
): SensSlopeResult {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError('sensSlope requires a confidence between 0 and 1');
  const t = scratch('sen-times', times.length);
  const y = scratch('sen-values', values.length);
  const n = copyFinitePairs(times, values, t, y);
  const timeTies = increasing(t, n)
    ? { tiedPairs: 0, varianceTerm: 0, median: (t[Math.floor((n - 1) / 2)]! + t[Math.ceil((n - 1) / 2)]!) / 2 }
    : kendallScore(t, n);
  const valueTies = kendallScore(y, n);
  // Pairs tied in time have no slope.
  const count = (n * (n - 1)) / 2 - timeTies.tiedPairs;
  const none = { n, slopes: count, slope: Number.NaN, intercept: Number.NaN, lower: Number.NaN, upper: Number.NaN, confidence };
  if (count === 0) return { ...none, reason: 'too-few-values' };

  const z = normalQuantile(1 - (1 - confidence) / 2);
  const variance = (n * (n - 1) * (2 * n + 5) - timeTies.varianceTerm - valueTies.varianceTerm) / 18;
  const spread = z * Math.sqrt(Math.max(0, variance));
  const lowerIndex = Math.max(roundHalfEven((count - spread) / 2) - 1, 0);
  const upperIndex = Math.min(roundHalfEven((count + spread) / 2), count - 1);
  const middleLow = Math.floor((count - 1) / 2);
  const middleHigh = Math.ceil((count - 1) / 2);

  const ranks = [...new Set([lowerIndex, middleLow, middleHigh, upperIndex])].sort((a, b) => a - b);
  // + 0 turns −0 into 0: a −0 slope (from a value of −0) and a 0 slope are the same, whichever a selection meets first.
  const at = (found: number[], rank: number) => (found[ranks.indexOf(rank)] as number) + 0;
  const result = (found: number[]) => {
    const slope = (at(found, middleLow) + at(found, middleHigh)) / 2;
    const intercept = valueTies.median - slope * timeTies.median;
    return {
      ...none,
      slope,
      intercept,
      lower: at(found, lowerIndex),
      upper: at(found, upperIndex),
      reason: n < 3 ? ('too-few-values' as const) : null,
    };
  };
  // Times in order, the usual case: select without making every slope; null means it could not vouch.
  const selected = timeTies.tiedPairs === 0 && count >= SELECT_FROM ? pairSlopeRanks(t, y, n, ranks) : null;
  if (selected) return result(selected);

  const slopes = scratch('sen-slopes', count);
  let size = 0;
  for (let i = 0; i < n - 1; i++) {
    const ti = t[i] as number;
    const yi = y[i] as number;
    for (let j = i + 1; j < n; j++) {
      const dt = (t[j] as number) - ti;
      // Written always, kept only when the times differ: no branch to mispredict.
      slopes[size] = ((y[j] as number) - yi) / dt;
      size += dt !== 0 ? 1 : 0;
    }
  }
  return result(selectRanks(slopes, count, ranks));
}

/**
 * From this many slopes on, selecting without making them all is the faster way. Measured here
 * (one core, monthly series with ties and 5 % missing; µs a call, making all / selecting):
 * n = 48: 19 / 26; 120: 69 / 58; 240: 224 / 134; 360: 490 / 225; 600: 1,336 / 399.
 */
const SELECT_FROM = 2500;

/** Whether the first n times are strictly increasing (the usual case: then no pair is tied in time). */
function increasing(t: Float64Array, n: number): boolean {
  let ordered = 1;
  for (let k = 1; k < n; k++) ordered &= +((t[k] as number) > (t[k - 1] as number));
  return ordered === 1;
}

/** Nearest whole number, halves to the even neighbour (IEEE 754 roundTiesToEven). */
function roundHalfEven(value: number): number {
  const floor = Math.floor(value);
  const fraction = value - floor;
  if (fraction > 0.5) return floor + 1;
  if (fraction < 0.5) return floor;
  return floor % 2 === 0 ? floor : floor + 1;
}
