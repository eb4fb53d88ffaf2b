import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readBoundaries } from '../../src/ingest/geojson.ts';
import { ProblemList } from '../../src/ingest/problems.ts';
import { readInventory, readSurfaceArea } from '../../src/ingest/tables.ts';

function file(name: string, text: string): string {
  const path = join(mkdtempSync(join(tmpdir(), 'limnopress-ingest-')), name);
  writeFileSync(path, text);
  return path;
}

const summary = (problems: ProblemList) => problems.sorted().map((p) => `${p.severity} ${p.code} ${p.line} ${p.column}`);

describe('readSurfaceArea', () => {
  it('readSurfaceArea(file) reports every bad value with its line and column, not just the first', async () => {
    const path = file('area.csv', [
      'body_id,month,water_area_ha,observed_share,scenes',
      'A,2024-01,10.5,0.9,2',
      'A,2024-13,10.5,0.9,2',
      'A,2024-02,abc,1.4,2',
      'A,2024-01,9,0.9,2',
      'Z,2024-03,9,0.9,2',
      'A,2024-04,NaN,-0.1,1',
      'A,2024-05,Infinity,,1',
      'A,2024-06,1',
    ].join('\r\n'));
    const problems = new ProblemList();
    const rows = await readSurfaceArea(path, 'area.csv', new Set(['A']), problems);
    expect(rows).toHaveLength(1);
    expect(summary(problems)).toEqual([
      'error month-invalid 3 month',
      'error value-out-of-range 4 observed_share',
      'error value-not-number 4 water_area_ha',
      'error duplicate-row 5 month',
      'error unknown-body 6 body_id',
      'error value-out-of-range 7 observed_share',
      'error value-not-number 7 water_area_ha',
      'error value-empty 8 observed_share',
      'error value-not-number 8 water_area_ha',
      'error field-count 9 ',
    ]);
  });

  it('readSurfaceArea(file) reports a missing required column once and an unknown column as a warning', async () => {
    const path = file('area.csv', '\uFEFFbody_id,month,observed_share,cloud\nA,2024-01,0.9,x\n');
    const problems = new ProblemList();
    await readSurfaceArea(path, 'area.csv', new Set(['A']), problems);
    expect(summary(problems)).toEqual(['warning column-unknown 1 cloud', 'error column-missing 1 water_area_ha']);
  });

  it('readInventory(file) reports an empty file and a header without rows', async () => {
    const empty = new ProblemList();
    await readInventory(file('bodies.csv', ''), 'bodies.csv', empty);
    expect(summary(empty)).toEqual(['error file-empty 0 ']);
    const headerOnly = new ProblemList();
    await readInventory(file('bodies.csv', 'body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page\n'), 'bodies.csv', headerOnly);
    expect(summary(headerOnly)).toEqual(['error no-rows 1 ']);
  });
});

describe('readBoundaries', () => {
  it('readBoundaries(file) rewinds exterior rings clockwise for rendering', () => {
    // Counter-clockwise unit square, as RFC 7946 asks; d3-geo wants it clockwise.
    const square = [[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]];
    const path = file('b.geojson', JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: { subregion_id: 'S', name: 'S' }, geometry: { type: 'Polygon', coordinates: [square] } }] }));
    const problems = new ProblemList();
    const [region] = readBoundaries(path, 'b.geojson', problems);
    expect(problems.items).toEqual([]);
    expect(region?.polygons[0]?.[0]).toEqual([...square].reverse());
  });

  it('readBoundaries(file) reports bad JSON, an unclosed ring and missing properties', () => {
    const bad = new ProblemList();
    readBoundaries(file('b.geojson', '{"type": "FeatureCollection", '), 'b.geojson', bad);
    expect(summary(bad)).toEqual(['error geojson-unreadable 0 ']);
    const open = new ProblemList();
    readBoundaries(file('b.geojson', JSON.stringify({ type: 'FeatureCollection', features: [
      { type: 'Feature', properties: { subregion_id: 'S', name: 'S' }, geometry: { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1]]] } },
      { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [] } },
    ] })), 'b.geojson', open);
    expect(summary(open)).toEqual(['error geojson-ring 0 features[0].geometry', 'error geojson-properties 0 features[1].properties']);
  });
});
