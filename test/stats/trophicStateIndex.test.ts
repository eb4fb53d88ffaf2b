import { describe, expect, it } from 'vitest';
import { trophicClass, trophicStateIndex } from '../../src/stats/index.ts';

describe('trophicStateIndex', () => {
  it('trophicStateIndex(chl) reproduces Carlson (1977) table values', () => {
    // Carlson (1977), Table 2 (recalled from memory): chlorophyll-a 0.94, 2.6, 20 and 56 µg/L at
    // TSI 30, 40, 60 and 70. (The TSI 50 row, 6.4 µg/L as recalled, does not fit the paper's own
    // equation, which gives 7.3 µg/L, so it is not used here.)
    expect(trophicStateIndex(0.94)).toBeCloseTo(30, 0);
    expect(trophicStateIndex(2.6)).toBeCloseTo(40, 0);
    expect(trophicStateIndex(20)).toBeCloseTo(60, 0);
    expect(trophicStateIndex(56)).toBeCloseTo(70, 0);
  });

  it('trophicStateIndex(chl) is exactly 60 at e³ µg/L and NaN for non-positive values', () => {
    // By hand: ln Chl = 3 makes 2.04 − 0.68·3 = 0, so TSI = 10·6 = 60.
    expect(trophicStateIndex(Math.exp(3))).toBeCloseTo(60, 12);
    expect(trophicStateIndex(0)).toBeNaN();
  });

  it('trophicClass(chl) follows the OECD (1982) fixed boundaries 1, 2.5, 8 and 25 µg/L', () => {
    expect([0.5, 1, 2, 2.5, 5, 8, 10, 25, 60].map(trophicClass)).toEqual([
      'ultra-oligotrophic',
      'ultra-oligotrophic',
      'oligotrophic',
      'oligotrophic',
      'mesotrophic',
      'mesotrophic',
      'eutrophic',
      'eutrophic',
      'hypertrophic',
    ]);
    expect(trophicClass(Number.NaN)).toBeNull();
  });
});
