import { kendallScore } from './kendallScore.ts';

/**
 * Tie terms of Kendall's statistics over groups of equal values (Kendall 1975, Rank Correlation
 * Methods, ch. 4; Gilbert 1987, eq. 16.4): with tᵢ the size of the i-th group of equal values,
 * `varianceTerm` = Σ tᵢ(tᵢ − 1)(2tᵢ + 5), subtracted from n(n − 1)(2n + 5) in Var(S), and
 * `tiedPairs` = Σ tᵢ(tᵢ − 1)/2, the pairs tied in value, used by tau-b. The values must have no
 * missing entries. Cost O(n log n): the groups are read off the merge sort of kendallScore.
 */
export function tieCorrection(values: ArrayLike<number>): { varianceTerm: number; tiedPairs: number } {
  const { varianceTerm, tiedPairs } = kendallScore(values);
  return { varianceTerm, tiedPairs };
}
