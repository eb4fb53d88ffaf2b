/**
 * Maps from the sub-region boundaries (equirectangular projection, north up, a labelled graticule
 * every half degree): the coarse-grid anomaly map, sub-regions by status, and water bodies as
 * symbols sized by area and shaped by status. Rings come rewound from ingest (exterior clockwise,
 * as d3-geo wants).
 */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../wording/index.ts';
import { translator, bandKey } from '../text/index.ts';
import { formatDegrees, formatNumber, formatPosition } from '../text/format.ts';
import { NO_DATA_FILL, OUTLINE } from './palettes.ts';
import { VEGA_LITE_SCHEMA, type ChartDefinition } from './render.ts';

const SIZE = { width: 520, height: 420 };

interface Bounds {
  west: number;
  east: number;
  south: number;
  north: number;
}

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
function graticule(bounds: Bounds, locale: string, step = 0.5) {
  const lines: unknown[] = [];
  const labels: Array<{ lon: number; lat: number; text: string; align: string }> = [];
  for (let lon = Math.ceil(bounds.west / step) * step; lon <= bounds.east + 1e-9; lon += step) {
    lines.push({
      type: 'Feature',
      properties: {},
      geometry: {
        type: 'LineString',
        coordinates: [
          [lon, bounds.south],
          [lon, bounds.north],
        ],
      },
    });
    labels.push({ lon, lat: bounds.south, text: formatDegrees(locale, lon, 'lon', 1), align: 'center' });
  }
  for (let lat = Math.ceil(bounds.south / step) * step; lat <= bounds.north + 1e-9; lat += step) {
    lines.push({
      type: 'Feature',
      properties: {},
      geometry: {
        type: 'LineString',
        coordinates: [
          [bounds.west, lat],
          [bounds.east, lat],
        ],
      },
    });
    labels.push({ lon: bounds.west, lat, text: formatDegrees(locale, lat, 'lat', 1), align: 'right' });
  }
  return { lines, labels };
}

function baseLayers(model: BulletinModel) {
  const bounds = boundsOf(model);
  const grid = graticule(bounds, model.meta.locale);
  return [
    { data: { values: grid.lines }, mark: { type: 'geoshape', filled: false, stroke: '#bdbdbd', strokeWidth: 0.6 } },
    {
      data: { values: grid.labels.filter((label) => label.align === 'center') },
      mark: { type: 'text', dy: 12, fontSize: 10, color: '#333333' },
      encoding: {
        longitude: { field: 'lon', type: 'quantitative' },
        latitude: { field: 'lat', type: 'quantitative' },
        text: { field: 'text' },
      },
    },
    {
      data: { values: grid.labels.filter((label) => label.align === 'right') },
      mark: { type: 'text', dx: -4, align: 'right', fontSize: 10, color: '#333333' },
      encoding: {
        longitude: { field: 'lon', type: 'quantitative' },
        latitude: { field: 'lat', type: 'quantitative' },
        text: { field: 'text' },
      },
    },
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

/** A string as a single-quoted Vega expression literal. */
const expressionString = (text: string) => `'${text.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;

/**
 * Grid cells coloured by the same status bands as every other figure (percent of the baseline
 * median), so the map never speaks a second vocabulary; a cell without a figure is hatched-grey
 * with a dashed outline and says why in its table row.
 */
export function gridMapChart(model: BulletinModel): ChartDefinition {
  const style = bandStyle(model);
  const t = style.t;
  const notEnough = t('map.notEnough');
  const cells = model.grid.cells.map((cell) => {
    const percent = cell.status.kind === 'stated' ? cell.status.percentOfBaseline : null;
    const label = cell.status.kind === 'stated' ? style.label(cell.status.bandKey) : notEnough;
    const e = cell.west + cell.size;
    const n = cell.south + cell.size;
    return {
      type: 'Feature',
      properties: { label, bodies: cell.bodies, percent: percent === null ? null : Math.round(percent) },
      geometry: {
        type: 'Polygon',
        coordinates: [
          [
            [cell.west, cell.south],
            [cell.west, n],
            [e, n],
            [e, cell.south],
            [cell.west, cell.south],
          ],
        ],
      },
    };
  });
  const domain = [...style.labels, notEnough];
  const spec = mapSpec(model, [
    {
      data: { values: cells },
      mark: { type: 'geoshape', stroke: OUTLINE, strokeWidth: 0.8 },
      encoding: {
        color: {
          field: 'properties.label',
          type: 'nominal',
          title: t('ui.status'),
          scale: { domain, range: [...style.colours, NO_DATA_FILL] },
          legend: { orient: 'right', symbolStrokeColor: OUTLINE, symbolStrokeWidth: 1 },
        },
        strokeDash: { condition: { test: `datum.properties.label === ${expressionString(notEnough)}`, value: [3, 2] }, value: [1, 0] },
      },
    },
    { data: { values: subRegionFeatures(model) }, mark: { type: 'geoshape', filled: false, stroke: '#000000', strokeWidth: 1.8 } },
  ]);
  const stated = model.grid.cells.flatMap((cell) => (cell.status.kind === 'stated' ? [cell.status.percentOfBaseline] : []));
  const belowCount = stated.filter((percent) => percent < model.meta.usualFromPercent).length;
  return {
    id: 'grid-map',
    title: t('map.grid.title', { month: model.meta.monthName }),
    description: t('map.grid.desc', {
      degrees: formatNumber(model.meta.locale, model.grid.cellDegrees, 2),
      below: belowCount,
      stated: stated.length,
      missing: model.grid.cells.length - stated.length,
    }),
    spec,
    table: {
      caption: t('map.grid.caption'),
      columns: [t('view.grid.cell'), t('ui.bodies'), t('ui.percentOfUsual'), t('ui.status')],
      rows: model.grid.cells.map((cell, k) => [
        formatPosition(model.meta.locale, cell.south, cell.west, 2),
        cell.bodies,
        (cells[k] as (typeof cells)[number]).properties.percent ?? '–',
        (cells[k] as (typeof cells)[number]).properties.label,
      ]),
    },
  };
}

function bandStyle(model: BulletinModel) {
  const t = translator(model.meta.locale);
  const keys = model.meta.statusBands;
  const labels = keys.map((key) => t(bandKey(key)));
  const colours = model.meta.statusColours;
  const shapes = keys.map(
    (_, k) =>
      ['triangle-down', 'triangle-down', 'circle', 'triangle-up', 'triangle-up'][
        Math.round((k * 4) / Math.max(1, keys.length - 1))
      ] as string,
  );
  const notStated = t('chart.notStated');
  return { keys, labels, colours, shapes, notStated, t, label: (key: string | null) => (key === null ? notStated : t(bandKey(key))) };
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
    {
      data: { values: features },
      mark: { type: 'geoshape', stroke: '#000000', strokeWidth: 1.5 },
      encoding: {
        color: {
          field: 'properties.band',
          type: 'nominal',
          title: style.t('ui.status'),
          scale: { domain: [...style.labels, style.notStated], range: [...style.colours, NO_DATA_FILL] },
          legend: { orient: 'right', symbolStrokeColor: OUTLINE, symbolStrokeWidth: 1 },
        },
      },
    },
    {
      data: { values: labels },
      mark: { type: 'text', fontSize: 11, fontWeight: 'bold', dy: -7, color: '#000000' },
      encoding: {
        longitude: { field: 'lon', type: 'quantitative' },
        latitude: { field: 'lat', type: 'quantitative' },
        text: { field: 'name' },
      },
    },
    {
      data: { values: labels },
      mark: { type: 'text', fontSize: 10, dy: 7, color: '#000000' },
      encoding: {
        longitude: { field: 'lon', type: 'quantitative' },
        latitude: { field: 'lat', type: 'quantitative' },
        text: { field: 'text' },
      },
    },
  ]);
  return {
    id: 'sub-region-map',
    title: style.t('map.subRegions.title', { month: model.meta.monthName }),
    description: style.t('map.subRegions.desc', { list: labels.map((label) => `${label.name} ${label.text}`).join('; ') }),
    spec,
    table: {
      caption: style.t('map.subRegions.caption'),
      columns: [style.t('chart.subRegion'), style.t('ui.percentOfUsual'), style.t('ui.status')],
      rows: features.map((feature) => [feature.properties.name, feature.properties.percent ?? '–', feature.properties.band]),
    },
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
  const chosen = all
    .sort(
      (a, b) =>
        Number(model.bodies[b]?.ownPage) - Number(model.bodies[a]?.ownPage) ||
        (model.bodies[b]?.referenceHa ?? 0) - (model.bodies[a]?.referenceHa ?? 0) ||
        a - b,
    )
    .slice(0, MAP_BODY_LIMIT);
  return chosen.sort((a, b) => a - b);
}

export function bodiesMapChart(model: BulletinModel): ChartDefinition {
  const style = bandStyle(model);
  const shown = mappedBodies(model);
  const values = shown.map((k) => {
    const body = model.bodies[k] as BulletinModel['bodies'][number];
    const status = model.bodyStatus[k];
    return {
      name: body.name,
      lon: body.lon,
      lat: body.lat,
      area: Math.round(body.referenceHa * 10) / 10,
      status: style.label(status?.kind === 'stated' ? status.bandKey : null),
    };
  });
  const t = style.t;
  const subset =
    shown.length < model.bodies.length ? ` ${t('map.bodies.subset', { shown: shown.length, total: model.bodies.length })}` : '';
  const domain = [...style.labels, style.notStated];
  const spec = mapSpec(model, [
    { data: { values: subRegionFeatures(model) }, mark: { type: 'geoshape', filled: false, stroke: '#000000', strokeWidth: 1.2 } },
    {
      data: { values },
      mark: { type: 'point', filled: true, stroke: OUTLINE, strokeWidth: 0.8, opacity: 0.95 },
      encoding: {
        longitude: { field: 'lon', type: 'quantitative' },
        latitude: { field: 'lat', type: 'quantitative' },
        size: { field: 'area', type: 'quantitative', title: t('ui.referenceHa'), scale: { type: 'sqrt', range: [12, 600] } },
        shape: { field: 'status', type: 'nominal', title: t('ui.status'), scale: { domain, range: [...style.shapes, 'cross'] } },
        color: { field: 'status', type: 'nominal', title: t('ui.status'), scale: { domain, range: [...style.colours, '#bdbdbd'] } },
      },
    },
  ]);
  // The overview's picture: the legends go below the map, so the map takes the whole width of its column and its text stays legible when scaled down.
  (spec as { config?: unknown }).config = {
    legend: { orient: 'bottom', direction: 'vertical', labelFontSize: 13, titleFontSize: 13, symbolSize: 120, columns: 1 },
    axis: { labelFontSize: 12 },
  };
  const counts = domain.map((label) => `${values.filter((row) => row.status === label).length} ${label}`);
  return {
    id: 'bodies-map',
    title: t('map.bodies.title', { month: model.meta.monthName }),
    description: `${t('map.bodies.desc', { counts: counts.join(', ') })}${subset}`,
    spec,
    table: {
      caption: t('map.bodies.caption'),
      columns: [t('ui.body'), t('ui.referenceHa'), t('ui.status')],
      rows: values.map((row) => [row.name, row.area, row.status]),
    },
  };
}
