import { describe, expect, it } from 'vitest';
import type { BulletinInputs } from '../../src/ingest/index.ts';
import { configSchema } from '../../src/ingest/config.ts';
import { bandFor, surfaceWater } from '../../src/model/surfaceWater.ts';
import { areaTable, body } from '../support/inputs.ts';

const config = configSchema.parse({
  title: 'T', publisher: 'P', region: { name: 'R' },
  issue: { month: '2023-05', published: '2023-06-02' },
  baseline: { firstYear: 2020, lastYear: 2022, minYears: 3 },
  coverage: { minObservedShare: 0.6, minRegionCoverage: 0.5 },
  statusBands: [{ key: 'lower', fromPercent: null }, { key: 'near', fromPercent: 90 }, { key: 'higher', fromPercent: 110 }],
  site: { baseUrl: 'https://example.org/' },
  inputs: { inventory: 'a', surfaceArea: 'b', boundaries: 'c' },
});

const may = (year: number) => year * 12 + 4;

/** Two bodies of 100 and 300 ha; May in 2020–2023. */
function inputs(area: Array<[string, number, number, number]>): BulletinInputs {
  const bodies = [body('A', 100), body('B', 300)];
  return { config, bulletinMonth: may(2023), bodies, area: areaTable(bodies, area), quality: null, distribution: [], rainfall: [], field: [], subRegions: [], files: [] };
}

describe('surfaceWater', () => {
  it('surfaceWater(inputs) compares the bulletin month with the baseline median, by hand', () => {
    const result = surfaceWater(inputs([
      ['A', may(2020), 80, 1], ['B', may(2020), 240, 1], // (80 + 240) / 400 = 80 %
      ['A', may(2021), 60, 1], ['B', may(2021), 240, 1], // 300 / 400 = 75 %
      ['A', may(2022), 90, 1], ['B', may(2022), 270, 1], // 360 / 400 = 90 %
      ['A', may(2023), 50, 1], ['B', may(2023), 150, 0.5], // B seen over 50 % < 60 %: only A counts, 50 / 100 = 50 %, coverage 100 / 400 = 25 %
    ]));
    // Coverage 25 % is below the 50 % threshold: no figure for May 2023.
    expect(result.bulletin).toEqual({ kind: 'low-coverage', coveragePercent: 25, thresholdPercent: 50 });
  });

  it('surfaceWater(inputs) states percent of baseline and the band when coverage suffices', () => {
    const result = surfaceWater(inputs([
      ['A', may(2020), 80, 1], ['B', may(2020), 240, 1],
      ['A', may(2021), 60, 1], ['B', may(2021), 240, 1],
      ['A', may(2022), 90, 1], ['B', may(2022), 270, 1],
      ['A', may(2023), 50, 1], ['B', may(2023), 150, 0.9], // 200 / 400 = 50 %
    ]));
    // Baseline fillings 80, 75, 90 → median 80; 50 / 80 = 62.5 % of baseline → lowest band.
    expect(result.bulletin).toMatchObject({ kind: 'stated', fillingPercent: 50, coveragePercent: 100, baselineMedianPercent: 80, percentOfBaseline: 62.5, bandKey: 'lower' });
  });

  it('surfaceWater(inputs) refuses a comparison with fewer baseline years than minYears', () => {
    const result = surfaceWater(inputs([['A', may(2021), 60, 1], ['B', may(2021), 240, 1], ['A', may(2023), 50, 1], ['B', may(2023), 150, 1]]));
    expect(result.bulletin).toEqual({ kind: 'short-baseline', usableYears: 1, neededYears: 3 });
  });

  it('bandFor(percent, bands) takes the highest band whose lower bound is reached', () => {
    const bands = config.statusBands;
    expect([50, 89.99, 90, 109, 110, 300].map((value) => bandFor(value, bands))).toEqual(['lower', 'lower', 'near', 'near', 'higher', 'higher']);
  });
});
