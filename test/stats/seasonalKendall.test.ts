import { describe, expect, it } from 'vitest';
import { seasonalKendall } from '../../src/stats/index.ts';

const month = (year: number, calendarMonth: number) => year * 12 + calendarMonth - 1;

describe('seasonalKendall', () => {
  it('seasonalKendall(months, values) sums S and Var(S) over seasons, by hand', () => {
    // January 1, 2, 3 over three years (S = 3, Var = 3·2·11/18 = 11/3); July 5, 4, 6 (S = 1, Var = 11/3).
    const months = [month(2020, 1), month(2021, 1), month(2022, 1), month(2020, 7), month(2021, 7), month(2022, 7)];
    const result = seasonalKendall(months, [1, 2, 3, 5, 4, 6]);
    expect(result.s).toBe(4);
    expect(result.varianceS).toBeCloseTo(22 / 3, 12);
    // Z = (4 − 1)/√(22/3) = 1.107823.
    expect(result.z).toBeCloseTo(1.107823, 6);
    // Within-season slopes per year: Jan 1, 1, 1; Jul −1, 0.5, 2 → median of −1 0.5 1 1 1 2 = 1.
    expect(result.slope).toBe(1);
    expect(result.covariance).toEqual({ applied: false, reason: 'too-few-years', fewestYears: 0, neededYears: 10 });
  });

  it('seasonalKendall(months, values) refuses two values for one month', () => {
    expect(() => seasonalKendall([month(2020, 1), month(2020, 1)], [1, 2])).toThrow(RangeError);
  });
});
