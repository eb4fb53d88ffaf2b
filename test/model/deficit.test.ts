/** The deficit rule on series built by hand, so every expected number is worked out in the comments. */
import { describe, expect, it } from 'vitest';
import { deficitOf, usualFrom } from '../../src/model/deficit.ts';
import type { GroupMonth } from '../../src/model/aggregate.ts';
import type { BulletinConfig } from '../../src/ingest/index.ts';

const BANDS = [
  { key: 'much-lower', fromPercent: null },
  { key: 'lower', fromPercent: 75 },
  { key: 'near', fromPercent: 90 },
  { key: 'higher', fromPercent: 110 },
] as BulletinConfig['statusBands'];
const CONFIG = { statusBands: BANDS, baseline: { firstYear: 2018, lastYear: 2019, minYears: 2 } } as BulletinConfig;

/** 2018-01 … 2020-06: every month 50 % in the baseline years, then the given 2020 values. */
function series(values2020: Array<number | null>): GroupMonth[] {
  const row = (month: number, fillingPercent: number | null): GroupMonth => ({
    month,
    fillingPercent,
    coverageShare: 1,
    filledShare: 0,
    estimatedShare: 0,
    lowPercent: null,
    highPercent: null,
    bodiesWithValue: 1,
    bodiesEstimated: 0,
  });
  return [...Array.from({ length: 24 }, (_, k) => row(2018 * 12 + k, 50)), ...values2020.map((value, k) => row(2020 * 12 + k, value))];
}
const JUNE_2020 = 2020 * 12 + 5;

describe('deficitOf', () => {
  it('counts the months in a row below usual back from the bulletin month, and sums the shortfall', () => {
    // Usual starts at 90 % of the 50 % median = 45 %. April 40, May 40, June 30 are below; March 50 is not.
    // Shortfall: (50 − 40) + (50 − 40) + (50 − 30) = 40 point-months; over 1,000 ha of reference area, 400 ha-months.
    const deficit = deficitOf(series([50, 50, 50, 40, 40, 30]), JUNE_2020, 1000, CONFIG);
    expect(deficit).toMatchObject({ months: 3, since: 2020 * 12 + 3, belowPercent: 90, openStart: false });
    expect(deficit.shortfallPointMonths).toBeCloseTo(40, 12);
    expect(deficit.shortfallHaMonths).toBeCloseTo(400, 12);
  });

  it('says the run may be longer when it stops at a month without a figure', () => {
    const deficit = deficitOf(series([40, 40, null, 40, 40, 40]), JUNE_2020, 1000, CONFIG);
    expect(deficit).toMatchObject({ months: 3, since: 2020 * 12 + 3, openStart: true });
  });

  it('is zero when the bulletin month is usual, even after months below', () => {
    // 46 % is 92 % of the median: near usual.
    expect(deficitOf(series([30, 30, 30, 30, 30, 46]), JUNE_2020, 1000, CONFIG)).toMatchObject({
      months: 0,
      since: null,
      shortfallHaMonths: 0,
    });
  });

  it('usualFrom is the lower edge of the band that holds 100 %', () => {
    expect(usualFrom(BANDS)).toBe(90);
    expect(
      usualFrom([
        { key: 'a', fromPercent: null },
        { key: 'b', fromPercent: 120 },
      ] as BulletinConfig['statusBands']),
    ).toBe(100);
  });
});
