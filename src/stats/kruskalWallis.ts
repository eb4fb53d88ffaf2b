import { chiSquareSurvival } from './chiSquareSurvival.ts';

export interface KruskalWallisResult {
  /** Groups with at least one value. */
  groups: number;
  n: number;
  /** H corrected for ties. */
  h: number;
  degreesOfFreedom: number;
  /** P(χ² > H) with groups − 1 degrees of freedom. */
  p: number;
  reason: null | 'too-few-groups' | 'no-variance';
}

/**
 * Kruskal-Wallis test that several groups come from the same distribution (Kruskal & Wallis 1952,
 * JASA 47, 583–621), used here to decide whether a monthly series is seasonal (groups = calendar
 * months). All values are ranked together (ties get their mean rank); with Rᵢ the rank sum and nᵢ
 * the size of group i, H = 12/(N(N+1)) Σ Rᵢ²/nᵢ − 3(N+1), divided by the tie correction
 * 1 − Σ(t³ − t)/(N³ − N); p from the chi-square distribution with (groups − 1) degrees of freedom.
 * Missing values are skipped. Cost O(N log N).
 */
export function kruskalWallis(groups: ArrayLike<number>, values: ArrayLike<number | null | undefined>): KruskalWallisResult {
  const pairs: Array<[number, number]> = [];
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    if (typeof value === 'number' && Number.isFinite(value)) pairs.push([groups[k] as number, value]);
  }
  pairs.sort((a, b) => a[1] - b[1]);
  const n = pairs.length;
  const rankSums = new Map<number, { sum: number; count: number }>();
  let tieTerm = 0;
  for (let start = 0; start < n; ) {
    let end = start;
    while (end + 1 < n && (pairs[end + 1] as [number, number])[1] === (pairs[start] as [number, number])[1]) end++;
    const rank = (start + end) / 2 + 1;
    const size = end - start + 1;
    tieTerm += size ** 3 - size;
    for (let k = start; k <= end; k++) {
      const group = (pairs[k] as [number, number])[0];
      const entry = rankSums.get(group) ?? { sum: 0, count: 0 };
      entry.sum += rank;
      entry.count++;
      rankSums.set(group, entry);
    }
    start = end + 1;
  }
  const groupCount = rankSums.size;
  const degreesOfFreedom = groupCount - 1;
  if (groupCount < 2) return { groups: groupCount, n, h: Number.NaN, degreesOfFreedom, p: Number.NaN, reason: 'too-few-groups' };
  let sum = 0;
  for (const { sum: rankSum, count } of rankSums.values()) sum += (rankSum * rankSum) / count;
  const correction = 1 - tieTerm / (n ** 3 - n);
  if (correction <= 0) return { groups: groupCount, n, h: 0, degreesOfFreedom, p: 1, reason: 'no-variance' };
  const h = ((12 / (n * (n + 1))) * sum - 3 * (n + 1)) / correction;
  return { groups: groupCount, n, h, degreesOfFreedom, p: chiSquareSurvival(h, degreesOfFreedom), reason: null };
}
