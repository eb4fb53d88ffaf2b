import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readBoundaries, rewindForRendering } from '../../src/ingest/geojson.ts';
import { ProblemList } from '../../src/ingest/problems.ts';

describe('readBoundaries', () => {
  it('readBoundaries(file) rewinds exterior rings clockwise for rendering', () => {
    // Counter-clockwise unit square, as RFC 7946 asks; d3-geo wants it clockwise.
    const square: Array<[number, number]> = [
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 1],
      [0, 0],
    ];
    const path = join(mkdtempSync(join(tmpdir(), 'limnopress-geo-')), 'b.geojson');
    writeFileSync(
      path,
      JSON.stringify({
        type: 'FeatureCollection',
        features: [{ type: 'Feature', properties: { subregion_id: 'S', name: 'S' }, geometry: { type: 'Polygon', coordinates: [square] } }],
      }),
    );
    const problems = new ProblemList();
    const [region] = readBoundaries(path, 'b.geojson', problems);
    expect(problems.items).toEqual([]);
    expect(region?.polygons[0]?.[0]).toEqual([...square].reverse());
  });

  it('rewindForRendering(polygon) makes holes counter-clockwise and leaves correct rings alone', () => {
    const outerClockwise: Array<[number, number]> = [
      [0, 0],
      [0, 4],
      [4, 4],
      [4, 0],
      [0, 0],
    ];
    const holeClockwise: Array<[number, number]> = [
      [1, 1],
      [1, 2],
      [2, 2],
      [2, 1],
      [1, 1],
    ];
    const [outer, hole] = rewindForRendering([outerClockwise, holeClockwise]);
    expect(outer).toEqual(outerClockwise);
    expect(hole).toEqual([...holeClockwise].reverse());
  });
});
