/** Season-years: a season listed across the new year is one season. */
import { describe, expect, it } from 'vitest';
import { seasonYearOffsets } from '../../src/model/quality.ts';

describe('seasonYearOffsets', () => {
  it('puts the months after the new year of a season in the next calendar year', () => {
    expect(seasonYearOffsets([11, 12, 1, 2, 3])).toEqual([0, 0, 1, 1, 1]);
    expect(seasonYearOffsets([6, 7, 8, 9])).toEqual([0, 0, 0, 0]);
    expect(seasonYearOffsets([12, 1, 2, 12])).toEqual([0, 1, 1, 1]);
  });
});
