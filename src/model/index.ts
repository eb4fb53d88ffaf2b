/**
 * Stage 2, model: turns the typed inputs into the bulletin model: every figure the site prints,
 * the words that go with it in one language, and the method each rests on (ids into METHOD_IDS,
 * written out in that language). The model is written out as JSON beside the site, one per language.
 */
import type { BulletinInputs, InputFile, Problem } from '../ingest/index.ts';
import { QUALITY_PARAMETERS } from '../ingest/index.ts';
import { calendarMonthOf, monthLabel } from '../common/months.ts';
import { translator } from '../text/index.ts';
import { formatCalendarMonth, formatDate, formatMonth, formatPercent } from '../text/format.ts';
import { aggregate, statusMonths } from './aggregate.ts';
import { bodySeries, type BodySeries } from './bodySeries.ts';
import type { WorkerPool } from '../parallel/pool.ts';
import { statusOf } from './status.ts';
import { grid, type Grid } from './grid.ts';
import { keyMessages, type KeyMessage } from './keyMessages.ts';
import { methodTexts, type MethodId } from './methods.ts';
import { prepareQuality, quality, relabelQuality, type PreparedQuality, type Quality } from './quality.ts';
import { rainfall, type RainfallSummary } from './rainfall.ts';
import { referenceAreasOf, relabelSurface, surfaceWater, type SurfaceWater } from './surfaceWater.ts';
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
import { warningText, type ShownWarning } from './warnings.ts';

export type { Status } from './status.ts';
export type { GroupMonth } from './aggregate.ts';
export type { SurfaceWater, GroupSurface, SizeClassSurface } from './surfaceWater.ts';
export type { KeyMessage } from './keyMessages.ts';

export interface Notice {
  kind: 'notice' | 'caveat' | 'caution';
  text: string;
}

export interface BulletinModel {
  meta: {
    title: string;
    publisher: string;
    region: string;
    locale: string;
    month: string;
    monthName: string;
    calendarMonthName: string;
    revision: number;
    published: string;
    publishedName: string;
    draft: boolean;
    baseUrl: string;
    /** Site path of the issue, with leading and trailing slash. */
    issuePath: string;
    /** Correction notes in the model's language where the configuration gives one; `lang` says which. */
    corrections: Array<{ date: string; dateName: string; text: string; lang: string }>;
    baseline: { firstYear: number; lastYear: number; minYears: number };
    minObservedShare: number;
    minRegionCoverage: number;
    maxFilledGap: number;
    firstMonth: string;
    toolVersion: string;
    /** The configured status band keys, lowest first. */
    statusBands: string[];
    /** site.bodiesPerListPage. */
    bodiesPerListPage: number;
  };
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
  surfaceWater: SurfaceWater;
  /** Each body's own status in the bulletin month (its band, or why none), in inventory order. */
  bodyStatus: Array<{ bandKey: string | null; percentOfBaseline: number | null; state: 'stated' | 'low-coverage' | 'short-baseline' }>;
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
  trends: { methods: string[]; bodies: TrendSummary; subRegions: TrendSummary; region: TrendSummary; changePoint: ChangePoint };
  quality: Quality | null;
  rainfall: RainfallSummary | null;
  /** Boundaries of the sub-regions, rings rewound for drawing (exterior clockwise). */
  boundaries: Array<{ id: string; name: string; polygons: Array<Array<Array<[number, number]>>> }>;
  /** Method 'validation'. */
  validation: ValidationSummary[];
  keyMessages: KeyMessage[];
  /** The sentence the overview leads with: the first key message, or the caveat that replaces it. */
  headline: string;
  notices: Notice[];
  methods: Record<MethodId, string>;
  /** The input check's warnings, worded in the model's language where the catalogue can. */
  warnings: ShownWarning[];
  inputs: InputFile[];
}

export interface ModelOptions {
  /** Site path of the issue; by default /issues/YYYY-MM/. Earlier revisions live below it. */
  issuePath?: string;
  /** The body series and their trend tests when computed beforehand (prepareModel, on worker threads). */
  prepared?: PreparedModel;
  /** Language of the model's words; by default the first configured locale. */
  locale?: string;
  /**
   * The same issue's model in another language: its figures are reused (shared, not copied) and
   * only the words are made anew, so a second language costs little time or memory.
   */
  base?: BulletinModel;
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

/** The parts of the model that hold no words: computed once per issue, shared by its languages. */
type Figures = Pick<BulletinModel, 'bodies' | 'bodyStatus' | 'monitored' | 'grid' | 'trends' | 'rainfall' | 'boundaries' | 'validation'>;

function sharedFigures(base: BulletinModel): Figures {
  return {
    bodies: base.bodies,
    bodyStatus: base.bodyStatus,
    monitored: base.monitored,
    grid: base.grid,
    trends: base.trends,
    rainfall: base.rainfall,
    boundaries: base.boundaries,
    validation: base.validation,
  };
}

function figuresOf(
  inputs: BulletinInputs,
  series: BodySeries,
  trendsOfBodies: TrendSummary,
  trendsOfRegion: TrendSummary,
  surface: SurfaceWater,
  pageBodies: Set<number>,
): Figures {
  const { config, bulletinMonth } = inputs;
  const referenceAreas = referenceAreasOf(inputs);
  const forStatus = statusMonths(bulletinMonth);
  return {
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
    bodyStatus: inputs.bodies.map((_, k) => {
      const status = statusOf(
        aggregate(series, [k], referenceAreas, 100 * config.coverage.minObservedShare, forStatus),
        bulletinMonth,
        config,
      );
      return status.kind === 'stated'
        ? { bandKey: status.bandKey, percentOfBaseline: status.percentOfBaseline, state: 'stated' as const }
        : { bandKey: null, percentOfBaseline: null, state: status.kind };
    }),
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
  };
}

export function buildModel(inputs: BulletinInputs, warnings: Problem[], toolVersion: string, options: ModelOptions = {}): BulletinModel {
  const { config, bulletinMonth } = inputs;
  const locale = options.locale ?? config.locales[0] ?? 'en';
  const t = translator(locale);
  const pct = (value: number) => formatPercent(locale, value);

  const base = options.base;
  const series = options.prepared?.series ?? bodySeries(inputs);
  const surface = base ? relabelSurface(base.surfaceWater, locale) : surfaceWater(inputs, series, locale);
  const trendsOfBodies = base ? base.trends.bodies : bodyTrends(series, inputs.bodies, config, options.prepared?.bodyTests);
  const trendsOfRegion = base ? base.trends.region : groupTrends([surface.region], config);
  const waterQuality = base ? relabelQuality(base.quality, config, locale) : quality(inputs, options.prepared?.quality, locale);
  const firstYear = Math.floor(series.firstMonth / 12);
  const key = keyMessages({
    locale,
    bulletinMonth,
    firstYear,
    surface,
    bodyTrends: trendsOfBodies,
    regionTrend: trendsOfRegion.entries[0]?.test ?? null,
    quality: waterQuality,
  });

  const monthName = formatMonth(locale, bulletinMonth);
  const calendarMonthName = formatCalendarMonth(locale, calendarMonthOf(bulletinMonth));
  const baselineParams = { baselineFirst: config.baseline.firstYear, baselineLast: config.baseline.lastYear };
  const notices: Notice[] = key.caveats.map((text) => ({ kind: 'notice' as const, text }));
  // Pages of their own for the flagged bodies, the largest first, up to the configured cap.
  const flagged = inputs.bodies
    .map((body, k) => ({ body, k }))
    .filter(({ body }) => body.ownPage)
    .sort((a, b) => b.body.referenceHa - a.body.referenceHa || a.k - b.k);
  const pageBodies = new Set(flagged.slice(0, config.site.maxBodyPages).map(({ k }) => k));
  if (flagged.length > pageBodies.size)
    notices.push({ kind: 'notice', text: t('notice.pageCap', { flagged: flagged.length, shown: pageBodies.size }) });
  const region = surface.region.status;
  if (region.kind === 'stated' && region.filledPercent >= 1)
    notices.push({ kind: 'caveat', text: t('caveat.filled', { filled: pct(region.filledPercent) }) });
  notices.push({ kind: 'caveat', text: t('caveat.baseline', baselineParams) });
  const baselineYears = config.baseline.lastYear - config.baseline.firstYear + 1;
  if (baselineYears < 10) notices.push({ kind: 'caveat', text: t('caveat.shortBaseline', { years: baselineYears, ...baselineParams }) });
  notices.push({ kind: 'caveat', text: t('caveat.optical', { minShare: pct(100 * config.coverage.minObservedShare) }) });
  if (waterQuality) notices.push({ kind: 'caveat', text: t('caveat.estimate') });
  if (region.kind === 'stated' && region.percentOfBaseline < 90) notices.push({ kind: 'caution', text: t('caution.lowWater') });
  if (waterQuality) notices.push({ kind: 'caution', text: t('caution.algae') });

  const figures = base ? sharedFigures(base) : figuresOf(inputs, series, trendsOfBodies, trendsOfRegion, surface, pageBodies);
  return {
    meta: {
      title: config.title,
      publisher: config.publisher,
      region: config.region.name,
      locale,
      month: monthLabel(bulletinMonth),
      monthName,
      calendarMonthName,
      revision: config.issue.revision,
      published: config.issue.published,
      publishedName: formatDate(locale, config.issue.published),
      draft: config.issue.draft,
      baseUrl: config.site.baseUrl,
      issuePath: options.issuePath ?? `/issues/${monthLabel(bulletinMonth)}/`,
      corrections: config.issue.corrections.map(({ date, text, translations }) => {
        const translated = translations?.[locale as keyof typeof translations];
        return {
          date,
          dateName: formatDate(locale, date),
          text: translated ?? text,
          lang: translated === undefined ? (config.locales[0] ?? locale) : locale,
        };
      }),
      baseline: config.baseline,
      minObservedShare: config.coverage.minObservedShare,
      minRegionCoverage: config.coverage.minRegionCoverage,
      maxFilledGap: config.coverage.maxFilledGap,
      firstMonth: monthLabel(series.firstMonth),
      toolVersion,
      statusBands: config.statusBands.map((band) => band.key),
      bodiesPerListPage: config.site.bodiesPerListPage,
    },
    // The order of the JSON fields as it has always been, figures and words interleaved.
    bodies: figures.bodies,
    surfaceWater: surface,
    bodyStatus: figures.bodyStatus,
    monitored: figures.monitored,
    grid: figures.grid,
    trends: figures.trends,
    quality: waterQuality,
    rainfall: figures.rainfall,
    boundaries: figures.boundaries,
    validation: figures.validation,
    keyMessages: key.messages,
    headline: key.messages[0]?.text ?? key.caveats[0] ?? '',
    notices,
    methods: methodTexts(locale),
    warnings: warnings.map((problem) => warningText(problem, locale)),
    inputs: inputs.files,
  };
}
