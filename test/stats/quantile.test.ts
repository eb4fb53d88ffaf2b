import { describe, expect, it } from 'vitest';
import { median, quantile } from '../../src/stats/index.ts';

describe('quantile', () => {
  it('quantile(1..10, p) follows Hyndman & Fan type 7', () => {
    const values = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    // numpy 2.4.6 numpy.quantile(np.arange(1, 11), [.1, .25, .5, .75, .9]) (method 'linear' = H&F type 7):
    // 1.9 3.25 5.5 7.75 9.1
    expect([0.1, 0.25, 0.5, 0.75, 0.9].map((p) => quantile(values, p))).toEqual([1.9, 3.25, 5.5, 7.75, 9.1]);
  });

  it('quantile(x, p) matches R quantile(type = 7) on a small unsorted sample', () => {
    const x = [2.3, 7.1, 1.8, 4.4, 9.6, 5.0, 3.3];
    // R 4.2.2: quantile(c(2.3, 7.1, 1.8, 4.4, 9.6, 5.0, 3.3), c(0, .1, .25, .5, .75, .9, 1), type = 7)
    const r = [1.8, 2.1, 2.8, 4.4, 6.05, 8.1, 9.6];
    [0, 0.1, 0.25, 0.5, 0.75, 0.9, 1].forEach((p, k) => expect(quantile(x, p)).toBeCloseTo(r[k] as number, 12));
  });

  it('quantile(values, p) skips null and NaN the same way as median', () => {
    // By hand: the sample left is 1 3 5 7; h = 3 × 0.25 = 0.75 → 1 + 0.75 × (3 − 1) = 2.5.
    expect(quantile([7, null, 1, Number.NaN, 5, 3, undefined], 0.25)).toBe(2.5);
    expect(median([null, 4, 2, Number.POSITIVE_INFINITY])).toBe(3);
  });

  it('quantile([], p) is NaN and a probability outside 0–1 is a RangeError', () => {
    expect(quantile([], 0.5)).toBeNaN();
    expect(() => quantile([1], 1.5)).toThrow(RangeError);
  });
});
