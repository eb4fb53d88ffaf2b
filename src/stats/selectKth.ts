/**
 * Rearranges `values[from..to]` (inclusive) so that the element at index k is the one that would
 * stand there after sorting, everything before it is ≤ it and everything after is ≥ it
 * (Hoare's 1961 FIND, "quickselect", with a median-of-three pivot). Expected cost O(to − from);
 * much cheaper than a sort when only a few order statistics are needed, as for Sen's slope.
 * Returns the k-th value. The values must have no NaN.
 */
export function selectKth(values: Float64Array, k: number, from = 0, to = values.length - 1): number {
  if (!(k >= from && k <= to)) throw new RangeError('selectKth requires from ≤ k ≤ to');
  let low = from;
  let high = to;
  while (high > low) {
    const middle = (low + high) >>> 1;
    // Median of three as pivot, moved to values[low].
    if (values[middle]! < values[low]!) swap(values, middle, low);
    if (values[high]! < values[low]!) swap(values, high, low);
    if (values[high]! < values[middle]!) swap(values, high, middle);
    swap(values, low, middle);
    const pivot = values[low]!;
    let i = low;
    let j = high + 1;
    for (;;) {
      do i++; while (i <= high && values[i]! < pivot);
      do j--; while (values[j]! > pivot);
      if (i >= j) break;
      swap(values, i, j);
    }
    swap(values, low, j);
    if (j === k) return values[k]!;
    if (j < k) low = j + 1;
    else high = j - 1;
  }
  return values[k]!;
}

function swap(values: Float64Array, a: number, b: number): void {
  const held = values[a]!;
  values[a] = values[b]!;
  values[b] = held;
}
