/**
 * Sub-region boundaries from GeoJSON (RFC 7946). Rings are checked for closure and rewound to
 * clockwise exterior rings, the order d3-geo (and so Vega) expects; RFC 7946 asks the reverse.
 */
import { readFileSync } from 'node:fs';
import type { ProblemList } from './problems.ts';

export type Ring = Array<[number, number]>;

export interface SubRegion {
  id: string;
  name: string;
  /** Polygons, each an exterior ring then holes, rewound for rendering. */
  polygons: Ring[][];
}

/** Twice the signed area by the shoelace formula: positive when counter-clockwise. */
function signedArea(ring: Ring): number {
  let sum = 0;
  for (let k = 0; k + 1 < ring.length; k++) {
    const [x1, y1] = ring[k] as [number, number];
    const [x2, y2] = ring[k + 1] as [number, number];
    sum += x1 * y2 - x2 * y1;
  }
  return sum;
}

/** Exterior rings clockwise, holes counter-clockwise (the d3-geo convention). */
export function rewindForRendering(polygon: Ring[]): Ring[] {
  return polygon.map((ring, k) => {
    const counterClockwise = signedArea(ring) > 0;
    const wantCounterClockwise = k > 0;
    return counterClockwise === wantCounterClockwise ? ring : [...ring].reverse();
  });
}

function isPosition(value: unknown): value is [number, number] {
  return Array.isArray(value) && value.length >= 2 && value.slice(0, 2).every((n) => typeof n === 'number' && Number.isFinite(n));
}

export function readBoundaries(path: string, label: string, problems: ProblemList): SubRegion[] {
  let doc: unknown;
  try {
    doc = JSON.parse(readFileSync(path, 'utf8').replace(/^\uFEFF/, ''));
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    problems.error({ code: 'geojson-unreadable', file: label, line: 0, column: '', value: '', expected: 'a GeoJSON FeatureCollection', message: `cannot read the GeoJSON: ${message}` });
    return [];
  }
  const features = (doc as { type?: unknown; features?: unknown }).features;
  if ((doc as { type?: unknown }).type !== 'FeatureCollection' || !Array.isArray(features)) {
    problems.error({ code: 'geojson-not-collection', file: label, line: 0, column: 'type', value: '', expected: 'a FeatureCollection', message: 'the file is not a GeoJSON FeatureCollection' });
    return [];
  }
  const regions: SubRegion[] = [];
  features.forEach((feature: { properties?: Record<string, unknown>; geometry?: { type?: string; coordinates?: unknown } }, index: number) => {
    const at = `features[${index}]`;
    const id = feature.properties?.subregion_id;
    const name = feature.properties?.name;
    if (typeof id !== 'string' || typeof name !== 'string') {
      problems.error({ code: 'geojson-properties', file: label, line: 0, column: `${at}.properties`, value: '', expected: 'subregion_id and name as text', message: 'a feature lacks its sub-region id or name' });
      return;
    }
    const geometry = feature.geometry;
    const raw = geometry?.type === 'Polygon' ? [geometry.coordinates] : geometry?.type === 'MultiPolygon' ? geometry.coordinates : null;
    if (!Array.isArray(raw)) {
      problems.error({ code: 'geojson-geometry', file: label, line: 0, column: `${at}.geometry`, value: String(geometry?.type ?? ''), expected: 'Polygon or MultiPolygon', message: 'the feature has no polygon geometry' });
      return;
    }
    const polygons: Ring[][] = [];
    for (const polygon of raw as unknown[]) {
      if (!Array.isArray(polygon)) continue;
      const rings: Ring[] = [];
      for (const ring of polygon as unknown[]) {
        const points = Array.isArray(ring) ? ring.filter(isPosition).map(([x, y]) => [x, y] as [number, number]) : [];
        const first = points[0];
        const last = points[points.length - 1];
        if (points.length < 4 || !first || !last || first[0] !== last[0] || first[1] !== last[1]) {
          problems.error({ code: 'geojson-ring', file: label, line: 0, column: `${at}.geometry`, value: String(points.length), expected: 'a closed ring of at least 4 positions, the last equal to the first', message: 'a polygon ring is not closed' });
          return;
        }
        rings.push(points);
      }
      polygons.push(rewindForRendering(rings));
    }
    regions.push({ id, name, polygons });
  });
  return regions;
}
