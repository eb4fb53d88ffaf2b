/**
 * Tie terms of Kendall's statistics over groups of equal values (Kendall 1975, Rank Correlation
 * Methods, ch. 4; Gilbert 1987, eq. 16.4): with tᵢ the size of the i-th group of equal values,
 * `varianceTerm` = Σ tᵢ(tᵢ − 1)(2tᵢ + 5), subtracted from n(n − 1)(2n + 5) in Var(S), and
 * `tiedPairs` = Σ tᵢ(tᵢ − 1)/2, the pairs tied in value, used by tau-b. The values must have no
 * missing entries. Cost O(n log n).
 */
export function tieCorrection(values: ArrayLike<number>): { varianceTerm: number; tiedPairs: number } {
  const sorted = Float64Array.from(values).sort();
  let varianceTerm = 0;
  let tiedPairs = 0;
  let run = 1;
  for (let k = 1; k <= sorted.length; k++) {
    if (k < sorted.length && sorted[k] === sorted[k - 1]) {
      run++;
      continue;
    }
    if (run > 1) {
      varianceTerm += run * (run - 1) * (2 * run + 5);
      tiedPairs += (run * (run - 1)) / 2;
    }
    run = 1;
  }
  return { varianceTerm, tiedPairs };
}
