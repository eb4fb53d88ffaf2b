/**
 * The bulletin's trend rule on simulated series (generated here from a fixed seed; the data are the
 * check's input, not a check value): a drought step is a shift, not a trend; a steady decline is a
 * trend even though Pettitt's test also fires on it; and the worker encoding carries the shift.
 */
import { describe, expect, it } from 'vitest';
import { encodedTestBatch, summarize, trendTest, type TrendSettings } from '../../src/model/trends.ts';
import { mulberry32 } from '../../scripts/random.ts';

const TRENDS: TrendSettings = { minMonths: 36, seasonalityP: 0.05, falseDiscoveryRate: 0.05 } as TrendSettings;
const random = mulberry32(16);
const normal = () => {
  let u = 0;
  while (u === 0) u = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
};
const MONTHS = 108;
const months = Float64Array.from({ length: MONTHS }, (_, k) => 2018 * 12 + k);

/** Filling in percent: a seasonal cycle, AR(1) noise (φ = 0.5, sd about 2.3 points), and either a step or a trend. */
function series(step: number, stepAt: number, slopePerYear: number): Float64Array {
  let state = 0;
  return Float64Array.from({ length: MONTHS }, (_, k) => {
    state = 0.5 * state + 2 * normal();
    return 70 + 8 * Math.cos((2 * Math.PI * k) / 12) + state + (k >= stepAt ? step : 0) + (slopePerYear * k) / 12;
  });
}

function directions(make: () => Float64Array, count: number) {
  const entries = Array.from({ length: count }, (_, k) => ({ id: String(k), test: trendTest(months, make(), { trends: TRENDS }) }));
  const family = summarize(entries, TRENDS.falseDiscoveryRate);
  return { family, share: (direction: string) => family.entries.filter((entry) => entry.direction === direction).length / count };
}

describe('trends: a single shift is not a trend', () => {
  it('a series with one drop in level and no trend is reported as a one-step drop, not a decline', () => {
    // A drop of 15 points (about 6 noise sd) two thirds of the way through, no trend before or after.
    const { share } = directions(() => series(-15, 72, 0), 200);
    expect(share('decline')).toBeLessThanOrEqual(0.05);
    expect(share('shift-down')).toBeGreaterThanOrEqual(0.8);
  });

  it('a steady decline with no step is still a decline (the months before Pettitt’s change point hold it too)', () => {
    const { share } = directions(() => series(0, MONTHS, -3), 200);
    expect(share('decline')).toBeGreaterThanOrEqual(0.8);
    expect(share('shift-down')).toBeLessThanOrEqual(0.2);
  });

  it('a trend-free series without a step is rarely anything', () => {
    const { family } = directions(() => series(0, MONTHS, 0), 200);
    expect((family.declining + family.rising + family.shiftedDown + family.shiftedUp) / 200).toBeLessThanOrEqual(0.1);
  });

  it('the shift found is at the step, and the worker encoding gives back the same tests', () => {
    const values = series(-15, 72, 0);
    const test = trendTest(months, values, { trends: TRENDS });
    expect(test?.shift?.month).toBeGreaterThanOrEqual(months[68] as number);
    expect(test?.shift?.month).toBeLessThanOrEqual(months[76] as number);
    const encoded = encodedTestBatch({
      firstMonth: months[0] as number,
      months: MONTHS,
      values: Float64Array.from(values),
      trends: TRENDS,
    });
    expect(encoded.shiftMonth[0]).toBe(test?.shift?.month);
    expect(encoded.beforeP[0]).toBe(test?.shift?.beforeP ?? Number.NaN);
  });
});
