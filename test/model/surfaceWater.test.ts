import { describe, expect, it } from 'vitest';
import type { BulletinInputs } from '../../src/ingest/index.ts';
import { configSchema } from '../../src/ingest/config.ts';
import { aggregate } from '../../src/model/aggregate.ts';
import { bodySeries, FILLED, fillShortGaps, OBSERVED } from '../../src/model/bodySeries.ts';
import { bandFor, statusOf } from '../../src/model/status.ts';
import { surfaceWater } from '../../src/model/surfaceWater.ts';
import { areaTable, body } from '../support/inputs.ts';

const config = configSchema.parse({
  title: 'T',
  publisher: 'P',
  region: { name: 'R' },
  issue: { month: '2023-05', published: '2023-06-02' },
  baseline: { firstYear: 2020, lastYear: 2022, minYears: 3 },
  coverage: { minObservedShare: 0.6, minRegionCoverage: 0.5, maxFilledGap: 2 },
  statusBands: [
    { key: 'lower', fromPercent: null },
    { key: 'near', fromPercent: 90 },
    { key: 'higher', fromPercent: 110 },
  ],
  site: { baseUrl: 'https://example.org/' },
  inputs: { inventory: 'a', surfaceArea: 'b', boundaries: 'c' },
});

const may = (year: number) => year * 12 + 4;

/** Two bodies of 100 and 300 ha. */
function inputs(area: Array<[string, number, number, number]>): BulletinInputs {
  const bodies = [body('A', 100), body('B', 300)];
  return {
    config,
    bulletinMonth: may(2023),
    bodies,
    area: areaTable(bodies, area),
    quality: null,
    distribution: [],
    rainfall: [],
    field: [],
    storage: [],
    storageFits: [],
    subRegions: [],
    files: [],
    content: {},
    wording: {},
    logo: null,
    sources: {},
  };
}

const MAY_ROWS: Array<[string, number, number, number]> = [
  ['A', may(2020), 80, 1],
  ['B', may(2020), 240, 1], // (80 + 240) / 400 = 80 %
  ['A', may(2021), 60, 1],
  ['B', may(2021), 240, 1], // 300 / 400 = 75 %
  ['A', may(2022), 90, 1],
  ['B', may(2022), 270, 1], // 360 / 400 = 90 %
];

describe('surface water', () => {
  it('statusOf(region) compares the bulletin month with the baseline median, by hand', () => {
    const data = inputs([...MAY_ROWS, ['A', may(2023), 50, 1], ['B', may(2023), 150, 0.9]]); // 200 / 400 = 50 %
    const status = surfaceWater(data, bodySeries(data)).region.status;
    // Baseline fillings 80, 75, 90 → median 80, mean 81.667, sd √((1.667² + 6.667² + 8.333²)/2) = 7.638;
    // 50 / 80 = 62.5 % of usual → lowest band; z would be (50 − 81.667)/7.638 = −4.146, but three
    // baseline years are too few for it (STANDARDIZED_MIN_YEARS = 10): none is given. Below all three → rank 0,
    // and in words: 0 of the 3 baseline years were lower, 3 higher. The envelope of 3 values is their range.
    expect(status).toMatchObject({
      kind: 'stated',
      fillingPercent: 50,
      coverageShare: 1,
      percentOfBaseline: 62.5,
      anomalyPoints: -30,
      bandKey: 'lower',
      percentileRank: 0,
    });
    if (status.kind !== 'stated') return;
    expect(status.baseline.median).toBe(80);
    expect(status.standardized).toBeNull();
    expect(status.rank).toEqual({ lower: 0, higher: 3, of: 3 });
    expect(status.baseline.envelope).toEqual({ low: 75, high: 90, kind: 'range' });
    // Change from May 2022 (90 %): −40 points; April 2023 has no value.
    expect(status.changeFromLastYear).toBe(-40);
    expect(status.changeFromPreviousMonth).toBeNull();
  });

  it('statusOf(region) states no figure when too little of the region was seen', () => {
    // B seen over 50 % < 60 %: only A counts; coverage 100 / 400 = 25 % < 50 %.
    const data = inputs([...MAY_ROWS, ['A', may(2023), 50, 1], ['B', may(2023), 150, 0.5]]);
    expect(surfaceWater(data, bodySeries(data)).region.status).toEqual({ kind: 'low-coverage', coverageShare: 0.25, thresholdShare: 0.5 });
  });

  it('statusOf(region) refuses a comparison with fewer baseline years than minYears', () => {
    const data = inputs([
      ['A', may(2021), 60, 1],
      ['B', may(2021), 240, 1],
      ['A', may(2023), 50, 1],
      ['B', may(2023), 150, 1],
    ]);
    expect(surfaceWater(data, bodySeries(data)).region.status).toEqual({
      kind: 'short-baseline',
      fillingPercent: 50,
      coverageShare: 1,
      // Both bodies seen: nothing estimated, so the range is the figure itself.
      estimatedShare: 0,
      range: { low: 50, high: 50, percentOfBaselineLow: null, percentOfBaselineHigh: null },
      usableYears: 1,
      neededYears: 3,
    });
  });

  it('fillShortGaps fills gaps up to the limit linearly and flags them; longer gaps stay missing', () => {
    const values = Float64Array.from([10, Number.NaN, Number.NaN, 40, Number.NaN, Number.NaN, Number.NaN, 0]);
    const state = Uint8Array.from([OBSERVED, 0, 0, OBSERVED, 0, 0, 0, OBSERVED]);
    fillShortGaps(values, state, 2);
    // By hand: 10 → 40 over three steps gives 20 and 30; the three-month gap is too long.
    expect(Array.from(values.slice(0, 4))).toEqual([10, 20, 30, 40]);
    expect(Array.from(state)).toEqual([OBSERVED, FILLED, FILLED, OBSERVED, 0, 0, 0, OBSERVED]);
    expect(values[5]).toBeNaN();
  });

  it('aggregate counts filled months in the filling but not in the coverage', () => {
    const data = inputs([
      ['A', may(2023) - 2, 40, 1],
      ['A', may(2023), 60, 1],
      ['B', may(2023) - 1, 150, 1],
    ]);
    const series = bodySeries(data);
    const april = aggregate(series, [0, 1], [100, 300], 0).find((row) => row.month === may(2023) - 1);
    // April: A filled at 50 %, B seen at 50 % → (50·100 + 50·300)/400 = 50 %; seen 300 of 400 = 75 %; filled 25 %.
    expect(april).toMatchObject({ fillingPercent: 50, coverageShare: 0.75, filledShare: 0.25, bodiesWithValue: 2 });
  });

  it('bandFor(percent, bands) takes the highest band whose lower bound is reached', () => {
    const bands = config.statusBands;
    expect([50, 89.99, 90, 109, 110, 300].map((value) => bandFor(value, bands))).toEqual([
      'lower',
      'lower',
      'near',
      'near',
      'higher',
      'higher',
    ]);
  });

  it('statusOf ignores months outside the baseline for the climatology', () => {
    const data = inputs([...MAY_ROWS, ['A', may(2019), 10, 1], ['B', may(2019), 10, 1], ['A', may(2023), 80, 1], ['B', may(2023), 240, 1]]);
    const status = statusOf(surfaceWater(data, bodySeries(data)).region.series, may(2023), config);
    expect(status.kind === 'stated' && status.baseline.values).toEqual([75, 80, 90]);
  });
});
