import { chiSquareSurvival } from './chiSquareSurvival.ts';
import { scratch } from './scratch.ts';
import { sortedPositions } from './sortedPositions.ts';

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
/** Slots of the groups 0..63 (reused between calls). */
const SMALL_SLOTS = new Int32Array(64);

export function kruskalWallis(groups: ArrayLike<number>, values: ArrayLike<number | null | undefined>): KruskalWallisResult {
  // Values and their groups in work buffers, then sorted together by value (a stable merge sort
  // of positions: no object per value, which mattered at a test per water body).
  const kept = scratch('kruskal-values', values.length);
  const keptGroups = scratch('kruskal-groups', values.length);
  let n = 0;
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    if (typeof value === 'number' && value - value === 0) {
      kept[n] = value;
      keptGroups[n++] = groups[k] as number;
    }
  }
  const order = sortedPositions(kept, n);
  // Rank sums by group, each group in a slot numbered by first appearance in rank order (the order
  // the sums are added in). Calendar months and other small whole numbers find their slot in an
  // array; any other group in a map.
  const smallSlot = SMALL_SLOTS.fill(-1);
  const slotOf = new Map<number, number>();
  const sums: number[] = [];
  const counts: number[] = [];
  let tieTerm = 0;
  for (let start = 0; start < n;) {
    const value = kept[order[start] as number] as number;
    let end = start;
    while (end + 1 < n && kept[order[end + 1] as number] === value) end++;
    const rank = (start + end) / 2 + 1;
    const size = end - start + 1;
    tieTerm += size ** 3 - size;
    for (let k = start; k <= end; k++) {
      const group = keptGroups[order[k] as number] as number;
      const small = group >= 0 && group < SMALL_SLOTS.length && Number.isInteger(group);
      let slot = small ? (smallSlot[group] as number) : (slotOf.get(group) ?? -1);
      if (slot < 0) {
        slot = sums.length;
        if (small) smallSlot[group] = slot;
        else slotOf.set(group, slot);
        sums.push(0);
        counts.push(0);
      }
      sums[slot] = (sums[slot] as number) + rank;
      counts[slot] = (counts[slot] as number) + 1;
    }
    start = end + 1;
  }
  const groupCount = sums.length;
  const degreesOfFreedom = groupCount - 1;
  if (groupCount < 2) return { groups: groupCount, n, h: Number.NaN, degreesOfFreedom, p: Number.NaN, reason: 'too-few-groups' };
  let sum = 0;
  for (let slot = 0; slot < groupCount; slot++) sum += ((sums[slot] as number) * (sums[slot] as number)) / (counts[slot] as number);
  const correction = 1 - tieTerm / (n ** 3 - n);
  if (correction <= 0) return { groups: groupCount, n, h: 0, degreesOfFreedom, p: 1, reason: 'no-variance' };
  const h = ((12 / (n * (n + 1))) * sum - 3 * (n + 1)) / correction;
  return { groups: groupCount, n, h, degreesOfFreedom, p: chiSquareSurvival(h, degreesOfFreedom), reason: null };
}
