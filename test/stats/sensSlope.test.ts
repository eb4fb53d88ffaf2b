import { describe, expect, it } from 'vitest';
import { sensSlope } from '../../src/stats/index.ts';

describe('sensSlope', () => {
  it('sensSlope(t, a + b·t) is exactly b with a zero-width interval', () => {
    // By hand: every pairwise slope of a straight line equals b = 0.25 (exact in binary).
    const t = [2018, 2018.5, 2019, 2020.25, 2021, 2023];
    const result = sensSlope(
      t,
      t.map((time) => 3 + 0.25 * (time - 2018)),
    );
    expect(result.slope).toBe(0.25);
    expect(result.lower).toBe(0.25);
    expect(result.upper).toBe(0.25);
  });

  it('sensSlope(t, y) ignores missing months', () => {
    const t = [0, 1, 2, 3, 4, 5];
    const y = [1, null, 2, Number.NaN, 8, 3];
    // By hand over (0,1) (2,2) (4,8) (5,3): slopes 1/2, 7/4, 2/5, 6/2, 1/3, −5/1 → sorted
    // −5, 0.333, 0.4, 0.5, 1.75, 3 → median (0.4 + 0.5)/2 = 0.45.
    expect(sensSlope(t, y).slope).toBeCloseTo(0.45, 15);
    expect(sensSlope(t, y).n).toBe(4);
  });

  it('sensSlope(t, y) reports too few values instead of throwing', () => {
    expect(sensSlope([1], [5]).reason).toBe('too-few-values');
    expect(sensSlope([1, 1], [5, 6]).slope).toBeNaN();
  });
});
