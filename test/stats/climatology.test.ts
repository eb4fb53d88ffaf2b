import { describe, expect, it } from 'vitest';
import { anomaly, climatology } from '../../src/stats/index.ts';

describe('climatology and anomaly', () => {
  it('climatology(months, values, baseline) keeps baseline years only and applies minYears', () => {
    const months = [2019 * 12 + 4, 2020 * 12 + 4, 2021 * 12 + 4, 2022 * 12 + 4, 2025 * 12 + 4, 2020 * 12 + 5];
    const result = climatology(months, [60, 80, 70, null, 10, 5], { firstYear: 2019, lastYear: 2022, minYears: 3 });
    const may = result[4];
    // By hand: May baseline values 60, 80, 70 (2022 missing, 2025 outside): median 70, mean 70,
    // sd √((100 + 100 + 0)/2) = 10, p10 = 60 + 0.2·(70 − 60) = 62.
    expect(may).toMatchObject({ calendarMonth: 5, count: 3, median: 70, mean: 70, standardDeviation: 10, p10: 62, enough: true });
    expect(result[5]?.enough).toBe(false);
    expect(result[5]?.median).toBeNaN();
  });

  it('anomaly(value, entry) gives absolute, percent, standardized and percentile rank, by hand', () => {
    const [entry] = climatology([0, 12, 24], [60, 80, 70], { firstYear: 0, lastYear: 2, minYears: 3 });
    // 55 against median 70, mean 70, sd 10: −15, 78.571 %, z = −1.5; below all three values → rank 0.
    const result = anomaly(55, entry!);
    expect(result.absolute).toBe(-15);
    expect(result.percentOfBaseline).toBeCloseTo(78.5714286, 6);
    expect(result.standardized).toBe(-1.5);
    expect(result.percentileRank).toBe(0);
    // 70 equals one of three: (1 below + ½·1 equal)/3 = 50 %.
    expect(anomaly(70, entry!).percentileRank).toBe(50);
  });
});
