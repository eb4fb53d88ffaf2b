/**
 * Stage 3, model: turns the typed inputs into the issue's figures: every number the site prints,
 * and the method each rests on (ids into METHOD_IDS), the same in every language. No words: the
 * wording stage (src/wording/) turns the figures and a locale into the bulletin model that charts
 * and pages read, so a second language costs only its words.
 */
import type { MethodId } from './methods.ts';
import type { BulletinInputs } from '../ingest/index.ts';
import { QUALITY_PARAMETERS } from '../ingest/index.ts';
import { aggregate, statusMonths } from './aggregate.ts';
import { bodySeries, type BodySeries } from './bodySeries.ts';
import type { WorkerPool } from '../parallel/pool.ts';
import { statusOf, type GroupStatus } from './status.ts';
import { grid, type Grid } from './grid.ts';
import { prepareQuality, quality, type PreparedQuality, type QualityFigures } from './quality.ts';
import { rainfall, type RainfallSummary } from './rainfall.ts';
import { referenceAreasOf, surfaceWater, type SurfaceFigures } from './surfaceWater.ts';
import {
  bodyTrends,
  bodyTrendTests,
  groupTrends,
  regionalChangePoint,
  type ChangePoint,
  type TrendEntry,
  type TrendSummary,
  type TrendTest,
} from './trends.ts';
import { validation, type ValidationSummary } from './validation.ts';
import { storage, type StorageFigures } from './storage.ts';

export type { GroupStatus, Status } from './status.ts';
export type { GroupMonth } from './aggregate.ts';
export type { SurfaceWater, SurfaceFigures, GroupSurface, SizeClassSurface } from './surfaceWater.ts';

/** An issue's figures: computed once, shared by its languages. */
export interface IssueFigures {
  /** First month of the record (month index). */
  firstMonth: number;
  surface: SurfaceFigures;
  quality: QualityFigures | null;
  bodies: Array<{
    id: string;
    name: string;
    subRegionId: string;
    kind: string;
    referenceHa: number;
    lon: number;
    lat: number;
    ownPage: boolean;
  }>;
  /** Each body's own status in the bulletin month (its band, or why none), in inventory order. */
  /** Each water body's own status in the bulletin month, the same shape as a group's. */
  bodyStatus: GroupStatus[];
  /** Water bodies flagged for their own page: the last 36 months of filling (observed or filled) and the trend. */
  monitored: Array<{
    body: number;
    id: string;
    name: string;
    firstMonth: number;
    filling: Array<number | null>;
    direction: TrendEntry['direction'];
    slopePerYear: number | null;
  }>;
  grid: Grid;
  trends: { methods: MethodId[]; bodies: TrendSummary; subRegions: TrendSummary; region: TrendSummary; changePoint: ChangePoint };
  rainfall: RainfallSummary | null;
  /** Boundaries of the sub-regions, rings rewound for drawing (exterior clockwise). */
  boundaries: Array<{ id: string; name: string; polygons: Array<Array<Array<[number, number]>>> }>;
  /** Method 'validation'. */
  validation: ValidationSummary[];
  /** Method 'storage': level and volume from the reservoirs' curves; null without inputs.storageCurves. */
  storage: StorageFigures | null;
  /** Bodies flagged for a page of their own, and how many of them got one (site.maxBodyPages, largest first). */
  pages: { flagged: number; shown: number };
  /**
   * The share of the region's reference area actually seen in the bulletin month: each body's
   * observed share weighted by its reference area, over every body of the inventory (a body
   * without a row counts as unseen). Not the same as the coverage of a group figure, which counts
   * the reference area of the bodies seen well enough to use.
   */
  seenShare: number;
}

export interface PreparedModel {
  series: BodySeries;
  bodyTests: Array<TrendTest | null>;
  quality: PreparedQuality | null;
}

/** Trend series of an issue: one per body, and one per body and quality parameter when there are quality data. */
export function trendSeriesCount(inputs: BulletinInputs): number {
  return inputs.bodies.length * (1 + (inputs.quality && inputs.quality.length > 0 ? QUALITY_PARAMETERS.length : 0));
}

/** The parts of the model worth spreading over worker threads for a large inventory; `onSeries` counts the trend series done. */
export async function prepareModel(inputs: BulletinInputs, pool: WorkerPool, onSeries?: (series: number) => void): Promise<PreparedModel> {
  const series = bodySeries(inputs);
  const [bodyTests, waterQuality] = await Promise.all([
    bodyTrendTests(series, inputs.config.trends, pool, onSeries),
    prepareQuality(inputs, pool, onSeries),
  ]);
  return { series, bodyTests, quality: waterQuality };
}

/** Every figure of an issue; `prepared` when the series and trend tests were computed beforehand (prepareModel). */
export function issueFigures(inputs: BulletinInputs, prepared?: PreparedModel): IssueFigures {
  const { config, bulletinMonth } = inputs;
  const series = prepared?.series ?? bodySeries(inputs);
  const surface = surfaceWater(inputs, series);
  const trendsOfBodies = bodyTrends(series, inputs.bodies, config, prepared?.bodyTests);
  const trendsOfRegion = groupTrends([surface.region], config);
  // Pages of their own for the flagged bodies, the largest first, up to the configured cap.
  const flagged = inputs.bodies
    .map((body, k) => ({ body, k }))
    .filter(({ body }) => body.ownPage)
    .sort((a, b) => b.body.referenceHa - a.body.referenceHa || a.k - b.k);
  const pageBodies = new Set(flagged.slice(0, config.site.maxBodyPages).map(({ k }) => k));
  const referenceAreas = referenceAreasOf(inputs);
  const forStatus = statusMonths(bulletinMonth);
  return {
    firstMonth: series.firstMonth,
    surface,
    quality: quality(inputs, prepared?.quality),
    bodies: inputs.bodies.map(({ id, name, subRegionId, kind, referenceHa, lon, lat, ownPage }) => ({
      id,
      name,
      subRegionId,
      kind,
      referenceHa,
      lon,
      lat,
      ownPage,
    })),
    bodyStatus: inputs.bodies.map((_, k) =>
      statusOf(aggregate(series, [k], referenceAreas, config.coverage.minObservedShare, forStatus), bulletinMonth, config),
    ),
    monitored: inputs.bodies.flatMap((body, k) => {
      if (!pageBodies.has(k)) return [];
      const from = Math.max(0, series.months - 36);
      const trend = trendsOfBodies.entries[k];
      return [
        {
          body: k,
          id: body.id,
          name: body.name,
          firstMonth: series.firstMonth + from,
          filling: Array.from((series.filling[k] as Float64Array).slice(from), (value) => (Number.isFinite(value) ? value : null)),
          direction: trend?.direction ?? 'untested',
          slopePerYear: trend?.test?.slopePerYear ?? null,
        },
      ];
    }),
    grid: grid(inputs, series),
    trends: {
      methods: ['trend-bodies', 'trend-region', 'change-point', 'evidence'],
      bodies: trendsOfBodies,
      subRegions: groupTrends(surface.subRegions, config),
      region: trendsOfRegion,
      changePoint: regionalChangePoint(surface.region.series),
    },
    rainfall: rainfall(inputs),
    boundaries: inputs.subRegions.map(({ id, name, polygons }) => ({ id, name, polygons })),
    validation: validation(inputs),
    storage: storage(inputs, series),
    pages: { flagged: flagged.length, shown: pageBodies.size },
    seenShare: seenShare(inputs),
  };
}

/** Percent of the inventory's reference area seen in the bulletin month (observed shares weighted by reference area). */
function seenShare(inputs: BulletinInputs): number {
  const reference = referenceAreasOf(inputs);
  let total = 0;
  for (const ha of reference) total += ha;
  let seen = 0;
  const area = inputs.area;
  for (let k = 0; k < area.length; k++) {
    if (area.month[k] !== inputs.bulletinMonth) continue;
    seen += (area.observedShare[k] as number) * (reference[area.body[k] as number] as number);
  }
  return total > 0 ? seen / total : 0;
}
