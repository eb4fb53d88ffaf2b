import { scratch, scratchInts, scratchShorts } from './scratch.ts';
import { insertionSort } from './insertionSort.ts';
import { selectKth } from './selectKth.ts';

/** Below this many values the plain successive selections are already cheap. */
const DIRECT = 400;
/** Sample size for the bracket; its ranks have a standard deviation of at most √SAMPLE / 2 = 4. */
const SAMPLE = 64;
/** Bracket margin in sample ranks: three standard deviations and one for rounding. */
const MARGIN = 13;
/** Equal-width buckets inside the bracket. */
const BUCKETS = 1024;

/**
 * The values at the given 0-based ranks (ascending, distinct) among the first `count` entries of
 * `values`, as if they were sorted. `values` must have no NaN; its order may change.
 *
 * A bucket selection in two passes, with the bracket chosen from a sample as in Floyd & Rivest
 * (1975, Communications of the ACM 18(3), 165–172):
 * 1. a systematic sample of 64 values is sorted; two of its elements, a little below the lowest
 *    wanted rank and a little above the highest, bracket the wanted values;
 * 2. the first pass counts the values in 1024 equal-width buckets over the bracket (with one
 *    bucket below it and one above it); running sums of the counts tell which bucket holds each
 *    wanted rank and how many values lie below that bucket;
 * 3. the second pass copies the values of those few buckets (each value's bucket was kept from
 *    the first pass) to a work buffer, where the wanted ranks are selected among a handful of
 *    values (see selectKth).
 * The bucket of a value is computed with no data-dependent branch. If a wanted rank falls outside the bracket (the sample misled it: rare, with a
 * three-standard-deviation margin) or the bracket is empty, the selection runs on the whole
 * array, so the result is exact whatever the sample. Expected O(count) time, O(count) work memory
 * reused between calls.
 */
export function selectRanks(values: Float64Array, count: number, ranks: readonly number[]): number[] {
  const lowest = ranks[0];
  const highest = ranks[ranks.length - 1];
  if (lowest === undefined || highest === undefined) return [];
  if (!(lowest >= 0 && highest < count)) throw new RangeError('selectRanks requires ranks within 0..count − 1');
  if (count < DIRECT) return successive(values, count, ranks);

  const sample = scratch('select-sample', SAMPLE);
  for (let s = 0; s < SAMPLE; s++) sample[s] = values[Math.floor(((s + 0.5) * count) / SAMPLE)] as number;
  insertionSort(sample, 0, SAMPLE - 1);
  const from = sample[Math.max(0, Math.floor((lowest * SAMPLE) / count) - MARGIN)] as number;
  const to = sample[Math.min(SAMPLE - 1, Math.ceil(((highest + 1) * SAMPLE) / count) + MARGIN)] as number;
  if (!(to > from) || !Number.isFinite(to - from)) return successive(values, count, ranks);
  const scale = BUCKETS / (to - from);

  // Pass 1: counts per bucket; bucket 0 holds the values below the bracket, BUCKETS + 1 those above.
  const counts = scratchInts('select-counts', BUCKETS + 2);
  counts.fill(0, 0, BUCKETS + 2);
  const bucket = scratchShorts('select-bucket', count);
  for (let i = 0; i < count; i++) {
    const b = bucketOf(values[i] as number, from, scale);
    bucket[i] = b;
    counts[b] = (counts[b] as number) + 1;
  }

  // Which bucket holds each rank, and how many values come before that bucket.
  const bucketOfRank = new Int32Array(ranks.length);
  const beforeBucket = new Int32Array(ranks.length);
  let r = 0;
  let cumulative = 0;
  for (let b = 0; b < BUCKETS + 2 && r < ranks.length; b++) {
    const next = cumulative + (counts[b] as number);
    while (r < ranks.length && (ranks[r] as number) < next) {
      bucketOfRank[r] = b;
      beforeBucket[r] = cumulative;
      r++;
    }
    cumulative = next;
  }
  if (bucketOfRank[0] === 0 || bucketOfRank[ranks.length - 1] === BUCKETS + 1) return successive(values, count, ranks);

  // Pass 2: the values of the wanted buckets, each bucket a contiguous run of the work buffer.
  const slot = scratchInts('select-slot', BUCKETS + 2);
  const start = scratchInts('select-start', ranks.length + 1);
  const fill = scratchInts('select-fill', ranks.length + 1);
  let buckets = 0;
  let size = 0;
  for (let k = 0; k < ranks.length; k++) {
    const b = bucketOfRank[k] as number;
    if (k > 0 && b === bucketOfRank[k - 1]) continue;
    buckets++;
    slot[b] = buckets;
    start[buckets] = size;
    fill[buckets] = size;
    size += counts[b] as number;
  }
  const inside = scratch('select-inside', size);
  for (let i = 0; i < count; i++) {
    const s = slot[bucket[i] as number] as number;
    if (s !== 0) {
      const at = fill[s] as number;
      inside[at] = values[i] as number;
      fill[s] = at + 1;
    }
  }
  const found = ranks.map((rank, k) => {
    const b = bucketOfRank[k] as number;
    const s = slot[b] as number;
    const first = start[s] as number;
    return selectKth(inside, first + rank - (beforeBucket[k] as number), first, first + (counts[b] as number) - 1);
  });
  for (let k = 0; k < ranks.length; k++) slot[bucketOfRank[k] as number] = 0;
  return found;
}

/**
 * 0 below the bracket, 1..BUCKETS inside it, BUCKETS + 1 above it. Comparisons turned into 0 or 1
 * rather than branches or Math.min/max (both slower here on values that fall either way at random).
 */
function bucketOf(value: number, from: number, scale: number): number {
  const x = (value - from) * scale;
  const inside = +(x >= 0) & +(x < BUCKETS);
  return inside * (((x * inside) | 0) + 1) + +(x >= BUCKETS) * (BUCKETS + 1);
}

/** Each rank selected in the part of the array the previous selection left above it. */
function successive(values: Float64Array, count: number, ranks: readonly number[]): number[] {
  let from = 0;
  return ranks.map((rank) => {
    const value = selectKth(values, rank, from, count - 1);
    from = rank;
    return value;
  });
}
