import { insertionSort } from './insertionSort.ts';

/**
 * Rearranges `values[from..to]` (inclusive) so that the element at index k is the one that would
 * stand there after sorting, everything before it ≤ it and everything after ≥ it; returns that
 * value. The values must have no NaN.
 *
 * Quickselect (Hoare 1961) with two choices made for speed where selection dominates (Sen's slope):
 * - the pivot is the element of matching rank in a sorted sample of 31 evenly spaced elements, so
 *   it lands near the k-th value and each round keeps only a small part of the range (the idea of
 *   Floyd & Rivest 1975, Communications of the ACM 18(3), 165–172);
 * - partitioning is branch-free (Lomuto's scheme written as in Alexandrescu 2019, "Fastware"): each
 *   element is swapped with the boundary and the boundary moves by the comparison's 0 or 1, so
 *   random data cannot make the processor mispredict half the time. A second pass splits off the
 *   values equal to the pivot, so heavy ties cannot stall the search.
 * Expected O(to − from) time.
 */
export function selectKth(values: Float64Array, k: number, from = 0, to = values.length - 1): number {
  if (!(k >= from && k <= to)) throw new RangeError('selectKth requires from ≤ k ≤ to');
  let left = from;
  let right = to;
  const sample = SAMPLE_BUFFER;
  while (right - left > 32) {
    const pivot = samplePivot(values, left, right, k, sample);
    const below = partitionBelow(values, left, right, pivot);
    if (k < below) {
      right = below - 1;
      continue;
    }
    const notAbove = partitionNotAbove(values, below, right, pivot);
    if (k < notAbove) return pivot;
    left = notAbove;
  }
  insertionSort(values, left, right);
  return values[k] as number;
}

const SAMPLE = 31;
/** Reused between calls (each worker thread has its own): an allocation costs as much as a small selection. */
const SAMPLE_BUFFER = new Float64Array(SAMPLE);

/** The sample element whose rank in the sample matches k's rank in the range. */
function samplePivot(values: Float64Array, left: number, right: number, k: number, sample: Float64Array): number {
  const span = right - left;
  for (let s = 0; s < SAMPLE; s++) sample[s] = values[left + Math.floor((s * span) / (SAMPLE - 1))] as number;
  insertionSort(sample, 0, SAMPLE - 1);
  const rank = Math.round(((k - left) / span) * (SAMPLE - 1));
  return sample[rank] as number;
}

/** Branch-free Lomuto partition of values[left..right]: those below the pivot first; returns where the rest start. */
function partitionBelow(values: Float64Array, left: number, right: number, pivot: number): number {
  let store = left;
  for (let i = left; i <= right; i++) {
    const value = values[i] as number;
    values[i] = values[store] as number;
    values[store] = value;
    store += value < pivot ? 1 : 0;
  }
  return store;
}

/** The same with those not above the pivot first (used on a range with nothing below it). */
function partitionNotAbove(values: Float64Array, left: number, right: number, pivot: number): number {
  let store = left;
  for (let i = left; i <= right; i++) {
    const value = values[i] as number;
    values[i] = values[store] as number;
    values[store] = value;
    store += value <= pivot ? 1 : 0;
  }
  return store;
}
