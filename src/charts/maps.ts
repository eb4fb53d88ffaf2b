/**
 * Maps from the sub-region boundaries (equirectangular projection, north up, a labelled graticule
 * every half degree): the coarse-grid anomaly map, sub-regions by status, and water bodies as
 * symbols sized by area and shaped by status. Rings come rewound from ingest (exterior clockwise,
 * as d3-geo wants).
 */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../model/index.ts';
import { formatMessage, loadMessages } from '../text/index.ts';
import { formatNumber } from '../text/format.ts';
import { BROWN_BLUE_GREEN_5, NO_DATA_FILL, OUTLINE } from './palettes.ts';
import { VEGA_LITE_SCHEMA, type ChartDefinition } from './render.ts';

const SIZE = { width: 520, height: 420 };

interface Bounds { west: number; east: number; south: number; north: number }

function boundsOf(model: BulletinModel): Bounds {
  const points = model.boundaries.flatMap((region) => region.polygons.flatMap((polygon) => polygon.flat()));
  const lons = points.map(([lon]) => lon);
  const lats = points.map(([, lat]) => lat);
  return { west: Math.min(...lons), east: Math.max(...lons), south: Math.min(...lats), north: Math.max(...lats) };
}

function subRegionFeatures<T extends object>(model: BulletinModel, properties: (id: string) => T = () => ({}) as T) {
  return model.boundaries.map((region) => ({
    type: 'Feature',
    properties: { id: region.id, name: region.name, ...properties(region.id) },
    geometry: { type: 'MultiPolygon', coordinates: region.polygons },
  }));
}

/** Graticule lines every `step` degrees inside the bounds, and their labels along the south and west edges. */
function graticule(bounds: Bounds, step = 0.5) {
  const lines: unknown[] = [];
  const labels: Array<{ lon: number; lat: number; text: string; align: string }> = [];
  const degrees = (value: number, positive: string, negative: string) => `${formatNumber('en', Math.abs(value), 1)}° ${value < 0 ? negative : positive}`;
  for (let lon = Math.ceil(bounds.west / step) * step; lon <= bounds.east + 1e-9; lon += step) {
    lines.push({ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[lon, bounds.south], [lon, bounds.north]] } });
    labels.push({ lon, lat: bounds.south, text: degrees(lon, 'E', 'W'), align: 'center' });
  }
  for (let lat = Math.ceil(bounds.south / step) * step; lat <= bounds.north + 1e-9; lat += step) {
    lines.push({ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[bounds.west, lat], [bounds.east, lat]] } });
    labels.push({ lon: bounds.west, lat, text: degrees(lat, 'N', 'S'), align: 'right' });
  }
  return { lines, labels };
}

function baseLayers(model: BulletinModel) {
  const bounds = boundsOf(model);
  const grid = graticule(bounds);
  return [
    { data: { values: grid.lines }, mark: { type: 'geoshape', filled: false, stroke: '#bdbdbd', strokeWidth: 0.6 } },
    { data: { values: grid.labels.filter((label) => label.align === 'center') }, mark: { type: 'text', dy: 12, fontSize: 10, color: '#333333' }, encoding: { longitude: { field: 'lon', type: 'quantitative' }, latitude: { field: 'lat', type: 'quantitative' }, text: { field: 'text' } } },
    { data: { values: grid.labels.filter((label) => label.align === 'right') }, mark: { type: 'text', dx: -4, align: 'right', fontSize: 10, color: '#333333' }, encoding: { longitude: { field: 'lon', type: 'quantitative' }, latitude: { field: 'lat', type: 'quantitative' }, text: { field: 'text' } } },
  ];
}

/** Every map: one size and projection, the graticule underneath, then the map's own layers. */
function mapSpec(model: BulletinModel, layers: unknown[]): TopLevelSpec {
  return {
    $schema: VEGA_LITE_SCHEMA,
    ...SIZE,
    padding: { left: 50, top: 10, right: 10, bottom: 24 },
    projection: { type: 'equirectangular' },
    layer: [...baseLayers(model), ...layers],
  } as TopLevelSpec;
}

/** Anomaly classes on the standardized anomaly, with their words. */
const ANOMALY_CLASSES: Array<{ below: number; label: string }> = [
  { below: -1.5, label: 'far below usual (z < −1.5)' },
  { below: -0.5, label: 'below usual (−1.5 to −0.5)' },
  { below: 0.5, label: 'near usual (−0.5 to 0.5)' },
  { below: 1.5, label: 'above usual (0.5 to 1.5)' },
  { below: Number.POSITIVE_INFINITY, label: 'far above usual (z > 1.5)' },
];
const NOT_ENOUGH = 'not enough data';

export function gridMapChart(model: BulletinModel): ChartDefinition {
  const cells = model.grid.cells.map((cell) => {
    const z = cell.standardized;
    const label = z === null ? NOT_ENOUGH : (ANOMALY_CLASSES.find((entry) => z < entry.below) as { label: string }).label;
    const e = cell.west + cell.size;
    const n = cell.south + cell.size;
    return {
      type: 'Feature',
      properties: { label, bodies: cell.bodies, z: z === null ? null : Math.round(z * 100) / 100 },
      geometry: { type: 'Polygon', coordinates: [[[cell.west, cell.south], [cell.west, n], [e, n], [e, cell.south], [cell.west, cell.south]]] },
    };
  });
  const domain = [...ANOMALY_CLASSES.map((entry) => entry.label), NOT_ENOUGH];
  const spec = mapSpec(model, [
      { data: { values: cells }, mark: { type: 'geoshape', stroke: OUTLINE, strokeWidth: 0.8 }, encoding: { color: { field: 'properties.label', type: 'nominal', title: 'Standardized anomaly', scale: { domain, range: [...BROWN_BLUE_GREEN_5, NO_DATA_FILL] }, legend: { orient: 'right', symbolStrokeColor: OUTLINE, symbolStrokeWidth: 1 } }, strokeDash: { condition: { test: `datum.properties.label === '${NOT_ENOUGH}'`, value: [3, 2] }, value: [1, 0] } } },
      { data: { values: subRegionFeatures(model) }, mark: { type: 'geoshape', filled: false, stroke: '#000000', strokeWidth: 1.8 } },
  ]);
  const stated = model.grid.cells.filter((cell) => cell.standardized !== null);
  const belowCount = stated.filter((cell) => (cell.standardized as number) < -0.5).length;
  return {
    id: 'grid-map',
    title: `Grid cells against usual, ${model.meta.monthName}`,
    description: `Map of ${formatNumber(model.meta.locale, model.grid.cellDegrees, 2)}° cells shaded by the standardized anomaly of their water; cells with too little data are light grey with dashed outlines. ${belowCount} of ${stated.length} cells with a figure are below usual; ${model.grid.cells.length - stated.length} cells have not enough data.`,
    spec,
    table: { caption: 'Grid cells', columns: ['Cell (south-west corner)', 'Water bodies', 'Standardized anomaly', 'Class'], rows: model.grid.cells.map((cell, k) => [`${cell.south}°, ${cell.west}°`, cell.bodies, cell.standardized === null ? '–' : Math.round(cell.standardized * 100) / 100, (cells[k] as { properties: { label: string } }).properties.label]) },
  };
}

function bandStyle(model: BulletinModel) {
  const t = (key: string) => formatMessage(loadMessages(model.meta.locale), key);
  const keys = model.meta.statusBands;
  const labels = keys.map((key) => t(`band.${key}`));
  const colours = keys.map((_, k) => BROWN_BLUE_GREEN_5[Math.round((k * (BROWN_BLUE_GREEN_5.length - 1)) / Math.max(1, keys.length - 1))] as string);
  const shapes = keys.map((_, k) => ['triangle-down', 'triangle-down', 'circle', 'triangle-up', 'triangle-up'][Math.round((k * 4) / Math.max(1, keys.length - 1))] as string);
  return { keys, labels, colours, shapes, label: (key: string | null) => (key === null ? 'not stated' : t(`band.${key}`)) };
}

export function subRegionMapChart(model: BulletinModel): ChartDefinition {
  const style = bandStyle(model);
  const byId = new Map(model.surfaceWater.subRegions.map((group) => [group.id, group]));
  const features = subRegionFeatures(model, (id) => {
    const status = byId.get(id)?.status;
    const key = status?.kind === 'stated' ? status.bandKey : null;
    return { band: style.label(key), percent: status?.kind === 'stated' ? Math.round(status.percentOfBaseline) : null };
  });
  const labels = model.boundaries.map((region) => {
    const ring = region.polygons[0]?.[0] ?? [];
    const lon = ring.reduce((sum, [x]) => sum + x, 0) / Math.max(1, ring.length);
    const lat = ring.reduce((sum, [, y]) => sum + y, 0) / Math.max(1, ring.length);
    const feature = features.find((entry) => entry.properties.id === region.id);
    return { lon, lat, name: region.name, text: `${feature?.properties.percent ?? '–'} % · ${feature?.properties.band}` };
  });
  const spec = mapSpec(model, [
      { data: { values: features }, mark: { type: 'geoshape', stroke: '#000000', strokeWidth: 1.5 }, encoding: { color: { field: 'properties.band', type: 'nominal', title: 'Status', scale: { domain: [...style.labels, 'not stated'], range: [...style.colours, NO_DATA_FILL] }, legend: { orient: 'right', symbolStrokeColor: OUTLINE, symbolStrokeWidth: 1 } } } },
      { data: { values: labels }, mark: { type: 'text', fontSize: 11, fontWeight: 'bold', dy: -7, color: '#000000' }, encoding: { longitude: { field: 'lon', type: 'quantitative' }, latitude: { field: 'lat', type: 'quantitative' }, text: { field: 'name' } } },
      { data: { values: labels }, mark: { type: 'text', fontSize: 10, dy: 7, color: '#000000' }, encoding: { longitude: { field: 'lon', type: 'quantitative' }, latitude: { field: 'lat', type: 'quantitative' }, text: { field: 'text' } } },
  ]);
  return {
    id: 'sub-region-map',
    title: `Sub-regions by status, ${model.meta.monthName}`,
    description: `Map of the sub-regions shaded and labelled with their status: ${labels.map((label) => `${label.name} ${label.text}`).join('; ')}.`,
    spec,
    table: { caption: 'Sub-regions by status', columns: ['Sub-region', 'Percent of usual', 'Status'], rows: features.map((feature) => [feature.properties.name, feature.properties.percent ?? '–', feature.properties.band]) },
  };
}

/**
 * The most bodies the status map draws. Beyond it the symbols would hide each other and the page
 * would outgrow its weight limit, so the map keeps the bodies with pages of their own and then the
 * largest, and says so; the grid map and the water-body index still cover every body.
 */
export const MAP_BODY_LIMIT = 1000;

/** Positions of the bodies the status map draws, in inventory order. */
export function mappedBodies(model: BulletinModel): number[] {
  const all = model.bodies.map((_, k) => k);
  if (all.length <= MAP_BODY_LIMIT) return all;
  const chosen = all.sort((a, b) => Number(model.bodies[b]?.ownPage) - Number(model.bodies[a]?.ownPage) || (model.bodies[b]?.referenceHa ?? 0) - (model.bodies[a]?.referenceHa ?? 0) || a - b).slice(0, MAP_BODY_LIMIT);
  return chosen.sort((a, b) => a - b);
}

export function bodiesMapChart(model: BulletinModel): ChartDefinition {
  const style = bandStyle(model);
  const shown = mappedBodies(model);
  const values = shown.map((k) => {
    const body = model.bodies[k] as BulletinModel['bodies'][number];
    const status = model.bodyStatus[k];
    return { name: body.name, lon: body.lon, lat: body.lat, area: Math.round(body.referenceHa * 10) / 10, status: style.label(status?.bandKey ?? null) };
  });
  const subset = shown.length < model.bodies.length ? ` It shows ${shown.length} of the ${model.bodies.length} water bodies: those with a page of their own, then the largest; the grid map and the water-body index cover them all.` : '';
  const domain = [...style.labels, 'not stated'];
  const spec = mapSpec(model, [
      { data: { values: subRegionFeatures(model) }, mark: { type: 'geoshape', filled: false, stroke: '#000000', strokeWidth: 1.2 } },
      {
        data: { values },
        mark: { type: 'point', filled: true, stroke: OUTLINE, strokeWidth: 0.8, opacity: 0.95 },
        encoding: {
          longitude: { field: 'lon', type: 'quantitative' },
          latitude: { field: 'lat', type: 'quantitative' },
          size: { field: 'area', type: 'quantitative', title: 'Reference area, ha', scale: { type: 'sqrt', range: [12, 600] } },
          shape: { field: 'status', type: 'nominal', title: 'Status', scale: { domain, range: [...style.shapes, 'cross'] } },
          color: { field: 'status', type: 'nominal', title: 'Status', scale: { domain, range: [...style.colours, '#bdbdbd'] } },
        },
      },
  ]);
  const counts = domain.map((label) => `${values.filter((row) => row.status === label).length} ${label}`);
  return {
    id: 'bodies-map',
    title: `Water bodies by status, ${model.meta.monthName}`,
    description: `Map of the water bodies as symbols sized by reference area; the symbol's shape and colour give its status (down-pointing below usual, circle near usual, up-pointing above usual, cross not stated): ${counts.join(', ')}.${subset}`,
    spec,
    table: { caption: 'Water bodies by status', columns: ['Water body', 'Reference area, ha', 'Status'], rows: values.map((row) => [row.name, row.area, row.status]) },
  };
}
