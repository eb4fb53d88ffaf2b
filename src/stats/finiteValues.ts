/**
 * The one convention for missing values in stats/: `null`, `undefined`, `NaN` and ±Infinity are
 * skipped; every other number counts, in its original order. Cost O(n).
 */
export function finiteValues(values: Iterable<number | null | undefined>): Float64Array {
  const kept: number[] = [];
  for (const value of values) if (typeof value === 'number' && Number.isFinite(value)) kept.push(value);
  return Float64Array.from(kept);
}

/**
 * The same convention for paired series (time and value): a pair counts only when both members
 * are finite. Cost O(n).
 */
export function finitePairs(times: ArrayLike<number | null | undefined>, values: ArrayLike<number | null | undefined>): { times: Float64Array; values: Float64Array } {
  if (times.length !== values.length) throw new RangeError('times and values must have the same length');
  const keptTimes = new Float64Array(values.length);
  const keptValues = new Float64Array(values.length);
  let n = 0;
  for (let k = 0; k < values.length; k++) {
    const time = times[k];
    const value = values[k];
    if (typeof time === 'number' && Number.isFinite(time) && typeof value === 'number' && Number.isFinite(value)) {
      keptTimes[n] = time;
      keptValues[n++] = value;
    }
  }
  return { times: keptTimes.subarray(0, n), values: keptValues.subarray(0, n) };
}
