/**
 * The one convention for missing values in stats/: `null`, `undefined`, `NaN` and ±Infinity are
 * skipped; every other number counts, in its original order. Returns a new array. Cost O(n).
 */
export function finiteValues(values: Iterable<number | null | undefined> | ArrayLike<number | null | undefined>): Float64Array {
  if (!isArrayLike(values)) return finiteValues(Array.from(values));
  // Indexed loops: far cheaper than the iterator protocol on the hot path of the trend tests.
  const kept = new Float64Array(values.length);
  let n = 0;
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    if (typeof value === 'number' && value - value === 0) kept[n++] = value; // finite: ∞ − ∞ and NaN − NaN are NaN
  }
  return n === kept.length ? kept : kept.slice(0, n);
}

function isArrayLike(values: object): values is ArrayLike<number | null | undefined> {
  return typeof (values as { length?: unknown }).length === 'number';
}

/**
 * The same convention for paired series (time and value): a pair counts only when both members
 * are finite. Returns new arrays. Cost O(n).
 */
export function finitePairs(
  times: ArrayLike<number | null | undefined>,
  values: ArrayLike<number | null | undefined>,
): { times: Float64Array; values: Float64Array } {
  const keptTimes = new Float64Array(values.length);
  const keptValues = new Float64Array(values.length);
  const n = copyFinitePairs(times, values, keptTimes, keptValues);
  return n === values.length ? { times: keptTimes, values: keptValues } : { times: keptTimes.slice(0, n), values: keptValues.slice(0, n) };
}

/**
 * Copies the finite values into `into` (which must be long enough) and returns how many there
 * were: finiteValues without an allocation, for hot loops with a work buffer. Cost O(n).
 */
export function copyFinite(values: ArrayLike<number | null | undefined>, into: Float64Array): number {
  let n = 0;
  for (let k = 0; k < values.length; k++) {
    const value = values[k];
    if (typeof value === 'number' && value - value === 0) into[n++] = value;
  }
  return n;
}

/**
 * finitePairs without an allocation: copies the pairs where both members are finite into
 * `intoTimes` and `intoValues` (long enough) and returns how many there were. Cost O(n).
 */
export function copyFinitePairs(
  times: ArrayLike<number | null | undefined>,
  values: ArrayLike<number | null | undefined>,
  intoTimes: Float64Array,
  intoValues: Float64Array,
): number {
  if (times.length !== values.length) throw new RangeError('times and values must have the same length');
  let n = 0;
  for (let k = 0; k < values.length; k++) {
    const time = times[k];
    const value = values[k];
    if (typeof time === 'number' && time - time === 0 && typeof value === 'number' && value - value === 0) {
      intoTimes[n] = time;
      intoValues[n++] = value;
    }
  }
  return n;
}

/** A number as the model stores it: itself when finite, null otherwise (null is the model's only "no value"). */
export const finiteOrNull = (value: number) => (Number.isFinite(value) ? value : null);
