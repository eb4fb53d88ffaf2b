import { describe, expect, it } from 'vitest';
import { selectKth } from '../../src/stats/selectKth.ts';
import { selectRanks } from '../../src/stats/selectRanks.ts';
import { sortedPositions } from '../../src/stats/sortedPositions.ts';
import { sortValues } from '../../src/stats/sortValues.ts';
import { quantile, quantileSorted, sensSlope } from '../../src/stats/index.ts';
import { mulberry32 } from '../../scripts/random.ts';

// The oracle is a full numeric sort (Float64Array.prototype.sort, ECMAScript §23.2.3.29): the
// k-th smallest value is the value at index k of the sorted array.
const sorted = (values: Float64Array) => Float64Array.from(values).sort();

function cases() {
  const random = mulberry32(20261202);
  const continuous = Float64Array.from({ length: 7140 }, () => random() + random() - 1);
  // Rounded to one decimal: most values tied, as slopes of rounded monthly data are.
  const tied = Float64Array.from({ length: 5000 }, () => Math.round(10 * (random() - 0.5) * 3) / 10 + 0); // + 0: no −0, which sorts apart from 0
  // Heavy tails like pairwise slopes over short time steps.
  const tails = Float64Array.from({ length: 3000 }, () => (random() - 0.5) / (random() + 1e-6));
  const allEqual = new Float64Array(2000).fill(1.5);
  // Where the 64-value systematic sample looks, values just below all others: the bracket holds
  // only those, misses every wanted rank above the first few, and the selection must fall back to
  // the whole array.
  const misleading = Float64Array.from({ length: 6400 }, (_, k) => k);
  for (let s = 0; s < 64; s++) misleading[Math.floor(((s + 0.5) * 6400) / 64)] = -1 + s / 1000;
  const withInfinity = Float64Array.from(continuous.subarray(0, 1000));
  withInfinity[10] = Infinity;
  withInfinity[20] = -Infinity;
  return { continuous, tied, tails, allEqual, misleading, withInfinity, small: continuous.slice(0, 37) };
}

describe('selectKth and selectRanks', () => {
  for (const [name, values] of Object.entries(cases())) {
    it(`select the same values as a full sort (${name}, ${values.length} values)`, () => {
      const order = sorted(values);
      const n = values.length;
      // Close middle ranks (as Sen's slope asks: its limits and median) and the extremes.
      const middle = [...new Set([Math.floor(n * 0.44), Math.floor((n - 1) / 2), Math.ceil((n - 1) / 2), Math.floor(n * 0.56)])].sort(
        (a, b) => a - b,
      );
      for (const ranks of [middle, [0, n - 1], [0, ...middle, n - 1]]) {
        expect(selectRanks(Float64Array.from(values), n, ranks)).toEqual(ranks.map((rank) => order[rank]));
        for (const rank of ranks) expect(selectKth(Float64Array.from(values), rank)).toBe(order[rank]);
      }
    });
  }

  it('selectRanks reads only the first count values', () => {
    const values = Float64Array.from([5, 4, 3, 2, 1, -100, -100]);
    expect(selectRanks(values, 5, [0, 2, 4])).toEqual([1, 3, 5]);
  });

  it('selectRanks refuses ranks outside the values', () => {
    expect(() => selectRanks(new Float64Array(3), 3, [3])).toThrow(RangeError);
  });

  it('sensSlope does not depend on the order of the pairs (tied and unordered times too)', () => {
    const random = mulberry32(7);
    const times = Array.from({ length: 150 }, (_, k) => 2010 + Math.floor(k / 2) / 12); // two values per month
    const values = times.map((time) => Math.round(10 * (0.3 * (time - 2010) + random())) / 10);
    const order = times.map((_, k) => k).sort((a, b) => ((a * 7919) % 151) - ((b * 7919) % 151));
    const straight = sensSlope(times, values);
    const shuffled = sensSlope(
      order.map((k) => times[k] as number),
      order.map((k) => values[k] as number),
    );
    expect(shuffled).toEqual(straight);
    // 75 pairs tied in time have no slope: 150·149/2 − 75.
    expect(straight.slopes).toBe(11100);
  });
});

describe('sortValues and sortedPositions on many values (radix sort)', () => {
  const random = mulberry32(99);
  // Ties, both zeros, negatives, huge and tiny magnitudes, subnormals.
  const values = Float64Array.from({ length: 20_000 }, (_, k) => {
    const pick = k % 7;
    if (pick === 0) return Math.round(random() * 20 - 10);
    if (pick === 1) return k % 2 === 0 ? -0 : 0;
    if (pick === 2) return (random() - 0.5) * 1e300;
    if (pick === 3) return (random() - 0.5) * 1e-310;
    return (random() - 0.5) * 100;
  });

  it('sortValues gives what Float64Array.prototype.sort gives, −0 before +0 included', () => {
    const expected = Float64Array.from(values).sort();
    const actual = sortValues(Float64Array.from(values));
    expect(Array.from(actual, (value) => (Object.is(value, -0) ? '-0' : String(value)))).toEqual(
      Array.from(expected, (value) => (Object.is(value, -0) ? '-0' : String(value))),
    );
  });

  it('sortedPositions is the stable order by value (as a stable sort by `<` of the positions)', () => {
    const positions = Array.from(values, (_, k) => k).sort((a, b) => (values[a] as number) - (values[b] as number) || a - b);
    expect(Array.from(sortedPositions(values, values.length))).toEqual(positions);
  });
});

describe('quantile on many values (selection instead of sorting)', () => {
  it('gives what quantileSorted gives on the sorted values, at every probability tried', () => {
    const random = mulberry32(5);
    const values = Array.from({ length: 9001 }, (_, k) => (k % 10 === 0 ? null : Math.round(1000 * random()) / 10));
    const sortedValues = Float64Array.from(values.filter((value): value is number => value !== null)).sort();
    for (const p of [0, 0.1, 0.25, 0.5, 0.75, 0.9, 0.999, 1]) expect(quantile(values, p), `p = ${p}`).toBe(quantileSorted(sortedValues, p));
  });
});
