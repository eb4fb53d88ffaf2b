import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '../../src/stats/index.ts';

describe('benjaminiHochberg', () => {
  it('benjaminiHochberg(p, 0.05) rejects 4 of the 15 p values of the original example', () => {
    // Benjamini & Hochberg (1995), section 4 example: 4 hypotheses rejected at q = 0.05.
    const p = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1.0];
    const result = benjaminiHochberg(p, 0.05);
    expect(result.rejectedCount).toBe(4);
    expect(result.rejected.slice(0, 5)).toEqual([true, true, true, true, false]);
  });

  it('benjaminiHochberg(p) keeps input order and leaves missing values out of m', () => {
    // By hand, m = 3: sorted 0.01, 0.02, 0.9 → 3·0.01/1 = 0.03, 3·0.02/2 = 0.03, 3·0.9/3 = 0.9.
    const result = benjaminiHochberg([0.9, null, 0.01, 0.02]);
    expect(result.tested).toBe(3);
    expect(result.adjusted[1]).toBeNaN();
    expect([result.adjusted[0], result.adjusted[2], result.adjusted[3]].map((v) => Number(v?.toFixed(12)))).toEqual([0.9, 0.03, 0.03]);
  });
});
