import { copyFinite } from './finiteValues.ts';
import { scratch } from './scratch.ts';
import { normalSurvival } from './normalSurvival.ts';
import { kendallScore } from './kendallScore.ts';

/** Why a test could make no statement; null when it could. */
export type TrendReason = null | 'too-few-values' | 'no-variance';

export interface MannKendallResult {
  /** Values used (missing ones skipped). */
  n: number;
  /** Kendall's S = Σᵢ<ⱼ sgn(xⱼ − xᵢ). */
  s: number;
  /** Var(S) under no trend, corrected for ties. */
  varianceS: number;
  /** Z with the continuity correction: (S − sgn S)/√Var(S). */
  z: number;
  /** Z without it: S/√Var(S). */
  zUncorrected: number;
  /** Two-sided p of z (normal approximation). */
  p: number;
  /** Two-sided p of zUncorrected. */
  pUncorrected: number;
  /** Kendall's tau-b between time order and value. */
  tau: number;
  reason: TrendReason;
}

/**
 * Mann-Kendall test for a monotonic trend (Mann 1945; Kendall 1975) on values in time order;
 * missing values (null, NaN, ±∞) are skipped.
 *
 * S = Σᵢ<ⱼ sgn(xⱼ − xᵢ); Var(S) = [n(n−1)(2n+5) − Σ t(t−1)(2t+5)]/18 over groups of t tied values
 * (Gilbert 1987, eq. 16.4); Z = (S − 1)/√Var(S) for S > 0, (S + 1)/√Var(S) for S < 0, 0 for S = 0
 * (eq. 16.5), and without the correction S/√Var(S); p = 2·Q(|Z|). Kendall's
 * tau-b = S/√((n₀ − n₁)·n₀) with n₀ = n(n−1)/2 and n₁ the pairs tied in value (time is never tied).
 *
 * Too little data is a result, not an exception: for n < 3 z and p are NaN and `reason` is
 * 'too-few-values'; when Var(S) = 0 (every value equal) z = 0, p = 1, tau is NaN and `reason` is
 * 'no-variance'. S and the tie terms come from one merge sort (kendallScore): O(n log n) time,
 * O(n) memory.
 */
export function mannKendall(values: Iterable<number | null | undefined> | ArrayLike<number | null | undefined>): MannKendallResult {
  const list = 'length' in values ? values : Array.from(values);
  const x = scratch('mann-kendall', list.length);
  const n = copyFinite(list, x);
  const ties = kendallScore(x, n);
  const s = ties.s;
  const varianceS = (n * (n - 1) * (2 * n + 5) - ties.varianceTerm) / 18;
  const pairs = (n * (n - 1)) / 2;
  const tau = pairs - ties.tiedPairs > 0 ? s / Math.sqrt((pairs - ties.tiedPairs) * pairs) : Number.NaN;
  if (n < 3) {
    return {
      n,
      s,
      varianceS,
      z: Number.NaN,
      zUncorrected: Number.NaN,
      p: Number.NaN,
      pUncorrected: Number.NaN,
      tau,
      reason: 'too-few-values',
    };
  }
  if (varianceS <= 0) {
    return { n, s, varianceS: 0, z: 0, zUncorrected: 0, p: 1, pUncorrected: 1, tau, reason: 'no-variance' };
  }
  const root = Math.sqrt(varianceS);
  const z = (s - Math.sign(s)) / root;
  const zUncorrected = s / root;
  return { n, s, varianceS, z, zUncorrected, p: twoSided(z), pUncorrected: twoSided(zUncorrected), tau, reason: null };
}

const twoSided = (z: number) => Math.min(1, 2 * normalSurvival(Math.abs(z)));
