import { describe, expect, it } from 'vitest';
import { pettitt } from '../../src/stats/index.ts';

describe('pettitt', () => {
  it('pettitt(values) finds a step by hand', () => {
    // By hand for 1 1 1 5 5 5: U1 = −3, U2 = −6, U3 = −9, U4 = −6, U5 = −3, so K = 9 after the
    // third value; p = 2·exp(−6·81/(216 + 36)) = 2·exp(−1.928571) = 2·0.145356 = 0.290711.
    const result = pettitt([1, 1, 1, 5, 5, 5]);
    expect(result.k).toBe(9);
    expect(result.location).toBe(3);
    expect(result.p).toBeCloseTo(0.290711, 6);
  });

  it('pettitt(values) with fewer than 3 values makes no statement', () => {
    expect(pettitt([1, 2]).reason).toBe('too-few-values');
  });
});
