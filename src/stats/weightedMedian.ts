/**
 * Weighted median: the smallest value whose cumulative weight, in ascending order of value,
 * reaches half the total weight; when it reaches exactly half, the mean of that value and the next
 * (so equal weights give the ordinary median). Pairs with a missing value or a weight that is not
 * positive are skipped; NaN when none is left. Cost O(n log n).
 */
export function weightedMedian(values: ArrayLike<number | null | undefined>, weights: ArrayLike<number>): number {
  const pairs: Array<[number, number]> = [];
  let total = 0;
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    const weight = weights[k] as number;
    if (typeof value === 'number' && Number.isFinite(value) && weight > 0 && Number.isFinite(weight)) {
      pairs.push([value, weight]);
      total += weight;
    }
  }
  if (pairs.length === 0) return Number.NaN;
  pairs.sort((a, b) => a[0] - b[0]);
  let cumulative = 0;
  for (let k = 0; k < pairs.length; k++) {
    const [value, weight] = pairs[k] as [number, number];
    cumulative += weight;
    if (Math.abs(cumulative - total / 2) <= 1e-12 * total) return (value + (pairs[k + 1]?.[0] ?? value)) / 2;
    if (cumulative > total / 2) return value;
  }
  return (pairs[pairs.length - 1] as [number, number])[0];
}
