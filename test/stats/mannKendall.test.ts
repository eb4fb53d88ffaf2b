import { describe, expect, it } from 'vitest';
import { mannKendall } from '../../src/stats/index.ts';

// Little, "A Mann-Kendall Example (By Hand)", College of the Holy Cross course notes.
const LITTLE = [12.9, 14.8, 13.2, 15.7, 13.8, 15.6, 12.9, 11.0, 17.3, 15.9, 19.0, 18.3, 20.1, 21.7];

describe('mannKendall', () => {
  it('mannKendall(values) reproduces the hand-worked 14-value example', () => {
    const result = mannKendall(LITTLE);
    // Little: S = 54, Var(S) = 332.667 with one tied pair (12.9 twice), Z = 2.9058, one-sided p = 0.0018.
    expect(result.s).toBe(54);
    expect(result.varianceS).toBeCloseTo(332.667, 3);
    expect(result.z).toBeCloseTo(2.9058, 4);
    expect(result.p / 2).toBeCloseTo(0.0018, 4);
  });

  it('mannKendall(values) skips missing values', () => {
    const withGaps = [null, ...LITTLE.slice(0, 5), Number.NaN, ...LITTLE.slice(5), undefined];
    expect(mannKendall(withGaps)).toEqual(mannKendall(LITTLE));
  });

  it('mannKendall(values) gives a defined result for n < 3 and for all-equal values', () => {
    const short = mannKendall([1, 2]);
    // By hand: S = 1, Var(S) = 2·1·9/18 = 1; too few values for a statement.
    expect(short).toMatchObject({ n: 2, s: 1, varianceS: 1, reason: 'too-few-values' });
    expect(short.p).toBeNaN();
    expect(mannKendall([4, 4, 4, 4, 4])).toMatchObject({ s: 0, varianceS: 0, z: 0, p: 1, reason: 'no-variance' });
  });

  it('mannKendall(reversed) changes the sign of S and Z and keeps p', () => {
    const forward = mannKendall(LITTLE);
    const backward = mannKendall([...LITTLE].reverse());
    expect(backward.s).toBe(-forward.s);
    expect(backward.z).toBe(-forward.z);
    expect(backward.p).toBe(forward.p);
  });

  it('mannKendall(f(values)) is unchanged by a strictly increasing transform f', () => {
    const plain = mannKendall(LITTLE);
    const transformed = mannKendall(LITTLE.map((value) => Math.exp(value / 3) - 7));
    expect(transformed).toEqual(plain);
  });
});
