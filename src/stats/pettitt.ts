import { finiteValues } from './finiteValues.ts';

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
