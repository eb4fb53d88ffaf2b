/**
 * Sub-region boundaries from GeoJSON (RFC 7946). Rings are checked for closure and rewound to
 * clockwise exterior rings, the order d3-geo (and so Vega) expects; RFC 7946 asks the reverse.
 */
import { say } from '../common/problemMessages.ts';
import { readFileSync } from 'node:fs';
import type { ProblemList } from './problems.ts';
import { slugOf } from '../text/slug.ts';
import { isolateBidi } from '../text/bidi.ts';

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

/** A position in longitude and latitude degrees, within their ranges (RFC 7946 §3.1.1 and WGS 84). */
function isPosition(value: unknown): value is [number, number] {
  if (!Array.isArray(value) || value.length < 2) return false;
  const [lon, lat] = value as unknown[];
  return (
    typeof lon === 'number' &&
    typeof lat === 'number' &&
    Number.isFinite(lon) &&
    Number.isFinite(lat) &&
    Math.abs(lon) <= 180 &&
    Math.abs(lat) <= 90
  );
}

/** Most positions read from one boundaries file (a coarse map needs far fewer). */
export const MAX_POSITIONS = 2_000_000;
/** Longest sub-region id and name, in characters. */
export const MAX_ID_LENGTH = 64;
export const MAX_NAME_LENGTH = 200;

export function readBoundaries(path: string, label: string, problems: ProblemList): SubRegion[] {
  let doc: unknown;
  try {
    doc = JSON.parse(readFileSync(path, 'utf8').replace(/^\uFEFF/, ''));
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    problems.error({
      code: 'geojson-unreadable',
      file: label,
      line: 0,
      column: '',
      value: '',
      expected: 'a GeoJSON FeatureCollection',
      message: say('geojson-unreadable', { detail: message }),
    });
    return [];
  }
  const features = (doc as { type?: unknown; features?: unknown }).features;
  if ((doc as { type?: unknown }).type !== 'FeatureCollection' || !Array.isArray(features)) {
    problems.error({
      code: 'geojson-not-collection',
      file: label,
      line: 0,
      column: 'type',
      value: '',
      expected: 'a FeatureCollection',
      message: say('geojson-not-collection'),
    });
    return [];
  }
  const regions: SubRegion[] = [];
  const slugs = new Map<string, string>();
  let positions = 0;
  features.forEach((raw: unknown, index: number) => {
    const at = `features[${index}]`;
    if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
      problems.error({
        code: 'geojson-feature',
        file: label,
        line: 0,
        column: at,
        value: '',
        expected: 'a GeoJSON Feature object',
        message: say('geojson-feature'),
      });
      return;
    }
    const feature = raw as { properties?: Record<string, unknown> | null; geometry?: { type?: string; coordinates?: unknown } | null };
    const id = feature.properties?.subregion_id;
    const name = feature.properties?.name;
    if (typeof id !== 'string' || typeof name !== 'string' || id.trim() === '' || name.trim() === '') {
      problems.error({
        code: 'geojson-properties',
        file: label,
        line: 0,
        column: `${at}.properties`,
        value: '',
        expected: 'subregion_id and name as text',
        message: say('geojson-properties'),
      });
      return;
    }
    if (id.length > MAX_ID_LENGTH || name.length > MAX_NAME_LENGTH) {
      problems.error({
        code: 'value-too-long',
        file: label,
        line: 0,
        column: `${at}.properties`,
        value: id,
        expected: `an id of at most ${MAX_ID_LENGTH} and a name of at most ${MAX_NAME_LENGTH} characters`,
        message: say('geojson-too-long'),
      });
      return;
    }
    // Each sub-region gets a page whose path comes from its id: two ids may not make the same path.
    const slug = slugOf(id);
    const other = slugs.get(slug);
    if (other !== undefined && other !== id) {
      problems.error({
        code: 'id-path-collision',
        file: label,
        line: 0,
        column: `${at}.properties.subregion_id`,
        value: id,
        expected: `an id that differs from "${other}" in more than case or punctuation`,
        message: say('geojson-id-collision'),
      });
      return;
    }
    slugs.set(slug, id);
    const geometry = feature.geometry;
    const shapes = geometry?.type === 'Polygon' ? [geometry.coordinates] : geometry?.type === 'MultiPolygon' ? geometry.coordinates : null;
    if (!Array.isArray(shapes) || shapes.length === 0) {
      problems.error({
        code: 'geojson-geometry',
        file: label,
        line: 0,
        column: `${at}.geometry`,
        value: String(geometry?.type ?? ''),
        expected: 'Polygon or MultiPolygon',
        message: say('geojson-geometry'),
      });
      return;
    }
    const polygons: Ring[][] = [];
    for (const polygon of shapes as unknown[]) {
      if (!Array.isArray(polygon) || polygon.length === 0) {
        problems.error({
          code: 'geojson-ring',
          file: label,
          line: 0,
          column: `${at}.geometry`,
          value: '',
          expected: 'a polygon of at least one ring',
          message: say('geojson-no-rings'),
        });
        return;
      }
      const rings: Ring[] = [];
      for (const ring of polygon as unknown[]) {
        const list = Array.isArray(ring) ? (ring as unknown[]) : [];
        positions += list.length;
        if (positions > MAX_POSITIONS) {
          problems.error({
            code: 'geojson-too-large',
            file: label,
            line: 0,
            column: `${at}.geometry`,
            value: '',
            expected: `at most ${MAX_POSITIONS} positions in all`,
            message: say('geojson-too-large'),
          });
          return;
        }
        const bad = list.findIndex((position) => !isPosition(position));
        if (bad >= 0) {
          problems.error({
            code: 'geojson-position',
            file: label,
            line: 0,
            column: `${at}.geometry`,
            value: JSON.stringify(list[bad]) ?? '',
            expected: 'a position [longitude, latitude] in degrees, longitude −180 to 180, latitude −90 to 90',
            message: say('geojson-position'),
          });
          return;
        }
        const points = list.map((position) => [(position as number[])[0], (position as number[])[1]] as [number, number]);
        const first = points[0];
        const last = points[points.length - 1];
        if (points.length < 4 || !first || !last || first[0] !== last[0] || first[1] !== last[1]) {
          problems.error({
            code: 'geojson-ring',
            file: label,
            line: 0,
            column: `${at}.geometry`,
            value: String(points.length),
            expected: 'a closed ring of at least 4 positions, the last equal to the first',
            message: say('geojson-ring-open'),
          });
          return;
        }
        rings.push(points);
      }
      polygons.push(rewindForRendering(rings));
    }
    regions.push({ id, name: isolateBidi(name), polygons });
  });
  return regions;
}
