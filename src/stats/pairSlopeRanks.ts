import { scratch, scratchInts } from './scratch.ts';
import { selectKth } from './selectKth.ts';
import { selectRanks } from './selectRanks.ts';

/** Unit roundoff of IEEE 754 doubles, 2⁻⁵³. */
const ROUNDOFF = 2 ** -53;

/**
 * The values at the given 0-based ranks (ascending, distinct) among the N = n(n − 1)/2 pairwise
 * slopes (yⱼ − yᵢ)/(tⱼ − tᵢ), i < j, of n points whose times strictly increase, as if all slopes
 * were made and sorted; or null when this method cannot vouch for its answer (the caller then
 * makes all the slopes). Each slope is computed exactly as the caller's full pass computes it, so
 * a value found here is the same double.
 *
 * The slopes are never all made. The method is randomized slope selection (Matoušek 1991,
 * "Randomized optimal algorithm for slope selection", Information Processing Letters 39, 183–187;
 * Dillencourt, Mount & Netanyahu 1992, International Journal of Computational Geometry &
 * Applications 2, 1–27), here in one round:
 * 1. a sample of about N^(2/3) pairs, drawn by a generator seeded from the values, brackets the wanted ranks: its
 *    order statistics a little below the lowest and above the highest rank, with a margin of three
 *    standard deviations of a sample rank, give slopes lo and hi;
 * 2. a slope is ≤ θ exactly when the residuals rᵢ = yᵢ − θ·tᵢ of its pair are out of time order
 *    (rⱼ ≤ rᵢ for i < j), so a merge sort of the residuals at lo counts the slopes ≤ lo as
 *    inversions (Knight 1966);
 * 3. an insertion sort from that order to the order of the residuals at hi swaps exactly the pairs
 *    whose slope lies in (lo, hi], one swap each: those K slopes are made, and the wanted ranks,
 *    less the count at lo, are selected among them (selectRanks).
 * Rounding: the residual comparison and the slope itself are computed with rounding, so a slope
 * within E(θ) = 16u(max|y| + |θ|·max|t|)/min Δt + 4u|θ| of θ (u = 2⁻⁵³) may be counted on the
 * wrong side of θ. lo and hi are pushed out by 3E from the sample values, and every value found must
 * lie more than E inside (lo, hi); then a slope counted on the wrong side cannot change any rank of
 * it. If that check, the bracket (the sample misled it) or the swap count fails, the result is null.
 *
 * Cost O(n log n + N^(2/3) + K) time with K ≈ N·(span of the ranks + 6/√sample) slopes, against
 * O(N) = O(n²) for making them all; O(n + K) work memory reused between calls.
 */
export function pairSlopeRanks(t: Float64Array, y: Float64Array, n: number, ranks: readonly number[]): number[] | null {
  const pairs = (n * (n - 1)) / 2;
  const lowest = ranks[0];
  const highest = ranks[ranks.length - 1];
  if (lowest === undefined || highest === undefined) return [];
  if (!(lowest >= 0 && highest < pairs)) throw new RangeError('pairSlopeRanks requires ranks within 0..N − 1');

  let maxAbsY = 0;
  let maxAbsT = 0;
  let minStep = Infinity;
  for (let k = 0; k < n; k++) {
    maxAbsY = Math.max(maxAbsY, Math.abs(y[k] as number));
    maxAbsT = Math.max(maxAbsT, Math.abs(t[k] as number));
    if (k > 0) minStep = Math.min(minStep, (t[k] as number) - (t[k - 1] as number));
  }
  if (!(minStep > 0) || !Number.isFinite(maxAbsY + maxAbsT)) return null;
  const tolerance = (theta: number) => (16 * ROUNDOFF * (maxAbsY + Math.abs(theta) * maxAbsT)) / minStep + 4 * ROUNDOFF * Math.abs(theta);

  // 1. The bracket from a sample of pairs, drawn uniformly by an xorshift generator seeded from the data.
  const size = Math.min(4096, Math.max(128, Math.round(pairs ** (2 / 3))));
  const sample = scratch('slope-sample', size);
  // Seeded from the data, so that the samples of different series are independent draws (a
  // fixed sample is the same draw for every series, and an unlucky one fails for many).
  let state = 0x9e3779b9 ^ n;
  for (let k = 0; k < n; k += 7) state = Math.imul(state ^ Math.round((y[k] as number) * 1e6), 0x85ebca6b) ^ (state >>> 13);
  state ||= 1;
  // xorshift32 (Marsaglia 2003) inline; an index is the high bits scaled to the range.
  for (let s = 0; s < size; s++) {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    const i = Math.floor((state >>> 0) * (n / 4294967296));
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    let j = Math.floor((state >>> 0) * ((n - 1) / 4294967296));
    j += j >= i ? 1 : 0;
    const a = Math.min(i, j);
    const b = Math.max(i, j);
    sample[s] = ((y[b] as number) - (y[a] as number)) / ((t[b] as number) - (t[a] as number));
  }
  const margin = Math.ceil(3 * Math.sqrt(size / 4)) + 1;
  const lowAt = Math.floor((lowest * size) / pairs) - margin;
  const highAt = Math.ceil(((highest + 1) * size) / pairs) + margin;
  const sampleLow = lowAt < 0 ? -Infinity : selectKth(sample, lowAt, 0, size - 1);
  const sampleHigh = highAt >= size ? Infinity : selectKth(sample, highAt, Math.max(0, lowAt), size - 1);
  const lo = sampleLow - 3 * tolerance(sampleLow);
  const hi = sampleHigh + 3 * tolerance(sampleHigh);
  if (!(lo < hi)) return null;

  // 2. The order of the residuals at lo, and the slopes counted at or below it.
  const order = scratchInts('slope-order', n);
  const belowLow = residualOrder(t, y, n, lo, order);
  if (belowLow > lowest) return null;

  // 3. From the order at lo to the order at hi (residuals at hi, ties in reverse time order) by
  //    insertion sort: each swap is one slope in (lo, hi], so the count at hi comes on the way.
  const room = pairs - belowLow;
  const inside = scratch('slope-inside', room);
  const atHigh = scratch('slope-residual', n);
  if (hi === Infinity) for (let k = 0; k < n; k++) atHigh[k] = -k;
  else for (let k = 0; k < n; k++) atHigh[k] = (y[k] as number) - hi * (t[k] as number);
  let count = 0;
  for (let p = 1; p < n; p++) {
    const b = order[p] as number;
    const key = atHigh[b] as number;
    let q = p - 1;
    for (; q >= 0; q--) {
      const a = order[q] as number;
      const other = atHigh[a] as number;
      if (!(other > key || (other === key && a < b))) break;
      // a came first at lo: the pair must be in time order there (slope above lo) and swap at hi.
      if (a > b || count >= room) return null;
      inside[count++] = ((y[b] as number) - (y[a] as number)) / ((t[b] as number) - (t[a] as number));
      order[q + 1] = a;
    }
    order[q + 1] = b;
  }
  if (!(highest < belowLow + count)) return null;

  const found = selectRanks(
    inside,
    count,
    ranks.map((rank) => rank - belowLow),
  );
  const floor = lo + tolerance(lo);
  const ceiling = hi - tolerance(hi);
  for (const value of found) if (!(value > floor && value < ceiling)) return null;
  return found;
}

/**
 * Fills `order` with 0..n − 1 sorted by the residual yᵢ − θ·tᵢ, ties in reverse time order, by a
 * bottom-up merge sort that counts as it goes the pairs i < j with rⱼ ≤ rᵢ: the slopes ≤ θ.
 * At θ = −∞ no slope is below.
 */
function residualOrder(t: Float64Array, y: Float64Array, n: number, theta: number, order: Int32Array): number {
  if (theta === -Infinity) {
    for (let k = 0; k < n; k++) order[k] = k;
    return 0;
  }
  const residual = scratch('slope-residual', n);
  for (let k = 0; k < n; k++) residual[k] = (y[k] as number) - theta * (t[k] as number);
  let source = order;
  let target = scratchInts('slope-merge', n);
  for (let k = 0; k < n; k++) source[k] = k;
  let inversions = 0;
  for (let width = 1; width < n; width *= 2) {
    for (let left = 0; left < n; left += 2 * width) {
      const middle = Math.min(left + width, n);
      const right = Math.min(left + 2 * width, n);
      let i = left;
      let j = middle;
      let k = left;
      while (i < middle && j < right) {
        const a = source[i] as number;
        const b = source[j] as number;
        // Every index of the right run is later in time than every index of the left run.
        if ((residual[b] as number) <= (residual[a] as number)) {
          inversions += middle - i;
          target[k++] = b;
          j++;
        } else {
          target[k++] = a;
          i++;
        }
      }
      while (i < middle) target[k++] = source[i++] as number;
      while (j < right) target[k++] = source[j++] as number;
    }
    const swap = source;
    source = target;
    target = swap;
  }
  if (source !== order) order.set(source.subarray(0, n));
  return inversions;
}
