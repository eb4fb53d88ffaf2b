import { scratch } from './scratch.ts';

export interface KendallScore {
  /** S = Σᵢ<ⱼ sgn(xⱼ − xᵢ). */
  s: number;
  /** Σ t(t − 1)(2t + 5) over groups of t equal values. */
  varianceTerm: number;
  /** Σ t(t − 1)/2: pairs tied in value. */
  tiedPairs: number;
  /** Median of the values (they are sorted on the way). */
  median: number;
}

/**
 * Kendall's score S = Σᵢ<ⱼ sgn(xⱼ − xᵢ) of the first `length` values in time order, with the tie
 * terms, by counting inversions during a merge sort (Knight 1966, "A computer method for
 * calculating Kendall's tau with ungrouped data", JASA 61, 436–439): with n₀ = n(n−1)/2 pairs,
 * n₁ pairs tied in value and I pairs out of order (i < j, xⱼ < xᵢ), S = n₀ − n₁ − 2I. The tie
 * terms and the median are read off the sorted values. The values must have no missing entries.
 * Cost O(n log n) time, O(n) work memory, against O(n²) for the pair loop.
 */
/** Width of the runs sorted by insertion before merging. */
const RUN = 8;

export function kendallScore(values: ArrayLike<number>, length = values.length): KendallScore {
  const n = length;
  let source = scratch('kendall-a', n);
  let target = scratch('kendall-b', n);
  for (let k = 0; k < n; k++) source[k] = values[k] as number;
  let inversions = 0;
  // Runs of RUN values sorted by insertion first (each shift past a larger value is one inverted
  // pair), then a bottom-up merge sort from that width: fewer passes over the values.
  for (let left = 0; left < n; left += RUN) {
    const right = Math.min(left + RUN, n);
    for (let i = left + 1; i < right; i++) {
      const value = source[i] as number;
      let j = i - 1;
      while (j >= left && (source[j] as number) > value) {
        source[j + 1] = source[j] as number;
        j--;
      }
      inversions += i - 1 - j;
      source[j + 1] = value;
    }
  }
  for (let width = RUN; width < n; width *= 2) {
    for (let left = 0; left < n; left += 2 * width) {
      const middle = Math.min(left + width, n);
      const right = Math.min(left + 2 * width, n);
      let i = left;
      let j = middle;
      let k = left;
      while (i < middle && j < right) {
        const a = source[i] as number;
        const b = source[j] as number;
        if (a <= b) {
          target[k++] = a;
          i++;
        } else {
          // b is smaller than every value left in the first run: each of those pairs is inverted.
          inversions += middle - i;
          target[k++] = b;
          j++;
        }
      }
      while (i < middle) target[k++] = source[i++] as number;
      while (j < right) target[k++] = source[j++] as number;
    }
    const swap = source;
    source = target;
    target = swap;
  }
  let varianceTerm = 0;
  let tiedPairs = 0;
  let run = 1;
  for (let k = 1; k <= n; k++) {
    if (k < n && source[k] === source[k - 1]) {
      run++;
      continue;
    }
    if (run > 1) {
      varianceTerm += run * (run - 1) * (2 * run + 5);
      tiedPairs += (run * (run - 1)) / 2;
    }
    run = 1;
  }
  const median =
    n === 0 ? Number.NaN : n % 2 === 1 ? (source[(n - 1) / 2] as number) : ((source[n / 2 - 1] as number) + (source[n / 2] as number)) / 2;
  const pairs = (n * (n - 1)) / 2;
  return { s: pairs - tiedPairs - 2 * inversions, varianceTerm, tiedPairs, median };
}
