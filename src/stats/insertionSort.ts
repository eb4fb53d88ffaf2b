/** Sorts values[left..right] (inclusive) ascending in place: the quick sort of a few values (no NaN). O(k²) for k values. */
export function insertionSort(values: Float64Array, left: number, right: number): void {
  for (let i = left + 1; i <= right; i++) {
    const held = values[i] as number;
    let j = i - 1;
    while (j >= left && (values[j] as number) > held) {
      values[j + 1] = values[j] as number;
      j--;
    }
    values[j + 1] = held;
  }
}
