/**
 * A small valid bulletin folder written to a temporary directory: two water bodies in one
 * sub-region, monthly rows for 2018-01 to 2020-06, and every optional table. Tests change one
 * file at a time to check one kind of problem.
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface MiniFiles {
  'bulletin.json': string;
  'bodies.csv': string;
  'area.csv': string;
  'quality.csv': string;
  'rain.csv': string;
  'field.csv': string;
  'bins.csv': string;
  'regions.geojson': string;
}

export const MINI_CONFIG = {
  title: 'Mini bulletin',
  publisher: 'Test office',
  region: { name: 'Test region' },
  issue: { month: '2020-06', published: '2020-07-02' },
  baseline: { firstYear: 2018, lastYear: 2019, minYears: 2 },
  coverage: { minObservedShare: 0.6, minRegionCoverage: 0.5 },
  statusBands: [
    { key: 'lower', fromPercent: null },
    { key: 'near', fromPercent: 90 },
    { key: 'higher', fromPercent: 110 },
  ],
  site: { baseUrl: 'https://example.org/' },
  inputs: {
    inventory: 'bodies.csv',
    surfaceArea: 'area.csv',
    quality: 'quality.csv',
    rainfall: 'rain.csv',
    field: 'field.csv',
    distribution: 'bins.csv',
    boundaries: 'regions.geojson',
  },
};

export function miniFiles(): MiniFiles {
  const months: string[] = [];
  for (let year = 2018; year <= 2020; year++)
    for (let month = 1; month <= 12; month++) if (year < 2020 || month <= 6) months.push(`${year}-${String(month).padStart(2, '0')}`);
  const area = ['body_id,month,water_area_ha,observed_share,scenes'];
  const quality = ['body_id,month,parameter,unit,p10,p25,median,p75,p90,valid_pixels'];
  months.forEach((month, k) => {
    area.push(`A,${month},${(8 + (k % 3)).toFixed(1)},0.95,3`, `B,${month},${(180 + k).toFixed(1)},0.9,2`);
    quality.push(`A,${month},chlorophyll_a,ug/L,2,3,4,5,6,150`, `A,${month},turbidity,FNU,1,2,3,4,5,150`);
  });
  return {
    'bulletin.json': JSON.stringify(MINI_CONFIG, null, 2),
    'bodies.csv':
      'body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page\nA,Lake One,R1,10.1,50.1,10,lake,no\nB,Two Reservoir,R1,10.2,50.2,200,reservoir,yes\n',
    'area.csv': `${area.join('\n')}\n`,
    'quality.csv': `${quality.join('\n')}\n`,
    'rain.csv': `subregion_id,month,rainfall_mm\n${months.map((month) => `R1,${month},50`).join('\n')}\n`,
    'field.csv': 'body_id,date,parameter,value,unit\nA,2019-05-14,chlorophyll_a,4.2,ug/L\nB,2019-06-02,turbidity,3.1,FNU\n',
    'bins.csv':
      'subregion_id,month,parameter,bin_lower,bin_upper,pixel_count\nR1,2020-06,chlorophyll_a,1,2,40\nR1,2020-06,chlorophyll_a,2,4,60\n',
    'regions.geojson': JSON.stringify({
      type: 'FeatureCollection',
      features: [
        {
          type: 'Feature',
          properties: { subregion_id: 'R1', name: 'Region one' },
          geometry: {
            type: 'Polygon',
            coordinates: [
              [
                [10, 50],
                [11, 50],
                [11, 51],
                [10, 51],
                [10, 50],
              ],
            ],
          },
        },
      ],
    }),
  };
}

/** Writes the mini bulletin with some files replaced (a Buffer for raw bytes); returns its folder. */
export function writeMini(changes: Partial<Record<keyof MiniFiles, string | Buffer>> = {}): string {
  const folder = join(mkdtempSync(join(tmpdir(), 'limnopress-mini-')), 'bulletin');
  mkdirSync(folder);
  const files = { ...miniFiles(), ...changes };
  for (const [name, content] of Object.entries(files)) writeFileSync(join(folder, name), content);
  return folder;
}
