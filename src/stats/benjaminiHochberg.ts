export interface FalseDiscoveryResult {
  /** Adjusted p per input, in input order; NaN where the input was missing. */
  adjusted: number[];
  /** Whether each hypothesis is rejected at the false discovery rate q. */
  rejected: boolean[];
  rejectedCount: number;
  /** Hypotheses with a p value. */
  tested: number;
}

/**
 * Benjamini & Hochberg (1995) step-up procedure controlling the false discovery rate at q over m
 * p values. With p₍₁₎ ≤ … ≤ p₍ₘ₎, the largest i with p₍ᵢ₎ ≤ i·q/m rejects hypotheses 1 … i. The
 * adjusted value is p̃₍ᵢ₎ = min over j ≥ i of min(1, m·p₍ⱼ₎/j), so a hypothesis is rejected exactly
 * when p̃ ≤ q (as scipy.stats.false_discovery_control and R's p.adjust "BH"). Missing p values are
 * left out of m and get NaN. Cost O(m log m).
 */
export function benjaminiHochberg(pValues: ArrayLike<number | null | undefined>, q = 0.05): FalseDiscoveryResult {
  if (!(q > 0 && q < 1)) throw new RangeError('benjaminiHochberg requires q between 0 and 1');
  const indices: number[] = [];
  for (let k = 0; k < pValues.length; k++) {
    const p = pValues[k];
    if (typeof p === 'number' && Number.isFinite(p)) {
      if (p < 0 || p > 1) throw new RangeError('benjaminiHochberg requires p values from 0 to 1');
      indices.push(k);
    }
  }
  const m = indices.length;
  indices.sort((a, b) => (pValues[a] as number) - (pValues[b] as number) || a - b);
  const adjusted = new Array<number>(pValues.length).fill(Number.NaN);
  let running = 1;
  for (let rank = m; rank >= 1; rank--) {
    const index = indices[rank - 1] as number;
    running = Math.min(running, (m * (pValues[index] as number)) / rank);
    adjusted[index] = running;
  }
  const rejected = adjusted.map((value) => value <= q);
  return { adjusted, rejected, rejectedCount: rejected.filter(Boolean).length, tested: m };
}
