/**
 * Page views: the model's figures formatted for people (Intl numbers, plain words for states), as
 * tables and short lists that the templates only place. No figure is computed here.
 */
import { parseMonth } from '../ingest/index.ts';
import type { BulletinModel, GroupSurface, Status } from '../model/index.ts';
import { evidenceFor } from '../model/evidence.ts';
import type { TrendEntry } from '../model/trends.ts';
import { formatMessage, loadMessages } from '../text/index.ts';
import { formatMonth, formatNumber, formatPercent } from '../text/format.ts';

export interface TableView {
  id: string;
  caption: string;
  columns: string[];
  /** The first cell of each row is its header cell. */
  rows: string[][];
  note?: string;
}

/** The page formatters of one locale: a missing or undefined figure always prints as "–". */
function formatters(locale: string) {
  const missing = (value: number | null | undefined): value is null | undefined => value === null || value === undefined || !Number.isFinite(value);
  return {
    t: (key: string, params?: Record<string, string | number>) => formatMessage(loadMessages(locale), key, params),
    pct: (value: number | null | undefined, digits = 0) => (missing(value) ? '–' : formatPercent(locale, value, digits)),
    num: (value: number | null | undefined, digits = 1) => (missing(value) ? '–' : formatNumber(locale, value, digits)),
    signed: (value: number | null | undefined, digits = 1) => (missing(value) ? '–' : `${value > 0 ? '+' : value < 0 ? '−' : ''}${formatNumber(locale, Math.abs(value), digits)}`),
    p: (value: number | null | undefined) => (missing(value) ? '–' : value < 0.001 ? '< 0.001' : formatNumber(locale, value, 3)),
  };
}

export function views(model: BulletinModel) {
  const locale = model.meta.locale;
  const { t, pct, num, signed, p } = formatters(locale);

  const statusWords = (status: Status) => (status.kind === 'stated' ? t(`band.${status.bandKey}`) : status.kind === 'low-coverage' ? 'not stated: too little seen' : 'not stated: baseline too short');
  const statusRow = (name: string, group: GroupSurface) => {
    const s = group.status;
    const stated = s.kind === 'stated' ? s : null;
    return [name, String(group.bodies), pct(s.kind === 'low-coverage' ? null : s.fillingPercent), pct(stated?.baseline.median), pct(stated?.percentOfBaseline), signed(stated?.standardized, 2), stated ? formatNumber(locale, stated.percentileRank, 0) : '–', statusWords(s), pct(s.coveragePercent)];
  };
  const statusColumns = ['Area', 'Water bodies', 'Water, % of reference area', 'Baseline median', 'Percent of usual', 'Standardized anomaly', 'Percentile rank', 'Status', 'Seen by satellite'];

  const sw = model.surfaceWater;
  const regionStatus = sw.region.status;
  const regionStated = regionStatus.kind === 'stated' ? regionStatus : null;
  const surfaceTables: TableView[] = [
    {
      id: 'status',
      caption: `The region in ${model.meta.monthName} against ${model.meta.calendarMonthName} of ${model.meta.baseline.firstYear}–${model.meta.baseline.lastYear}`,
      columns: ['Figure', 'Value'],
      rows: [
        ['Water, % of reference area', pct(regionStatus.kind === 'low-coverage' ? null : regionStatus.fillingPercent, 1)],
        ['Baseline median', pct(regionStated?.baseline.median, 1)],
        ['Baseline 10th–90th percentile', regionStated ? `${pct(regionStated.baseline.p10, 1)} – ${pct(regionStated.baseline.p90, 1)}` : '–'],
        ['Difference from the median, percentage points', signed(regionStated?.anomalyPoints)],
        ['Percent of usual (of the baseline median)', pct(regionStated?.percentOfBaseline)],
        ['Standardized anomaly', signed(regionStated?.standardized, 2)],
        ['Percentile rank among baseline years', regionStated ? formatNumber(locale, regionStated.percentileRank, 0) : '–'],
        ['Status', statusWords(regionStatus)],
        [`Change from ${formatMonth(locale, (parseMonth(model.meta.month) as number) - 12)}, percentage points`, signed(regionStated?.changeFromLastYear)],
        [`Change from ${formatMonth(locale, (parseMonth(model.meta.month) as number) - 1)}, percentage points`, signed(regionStated?.changeFromPreviousMonth)],
        ['Seen by satellite', pct(regionStatus.coveragePercent)],
        ['Filled in from neighbouring months', pct(regionStated?.filledPercent)],
      ],
    },
    { id: 'sub-regions', caption: `Sub-regions in ${model.meta.monthName}`, columns: statusColumns, rows: sw.subRegions.map((group) => statusRow(group.name, group)) },
    {
      id: 'size-classes',
      caption: `Loss from maximum filling by size class in ${model.meta.monthName}`,
      columns: ['Size class', 'Water bodies', 'Dry share of reference area', `Dry share in a usual ${model.meta.calendarMonthName}`, 'Status'],
      rows: sw.sizeClasses.map((entry) => [entry.name, String(entry.bodies), pct(entry.lossPercent), pct(entry.baselineLossPercent), statusWords(entry.status)]),
    },
    {
      id: 'grid',
      caption: `Grid cells of ${formatNumber(locale, model.grid.cellDegrees, 2)}° in ${model.meta.monthName}`,
      columns: ['Cell (south-west corner)', 'Water bodies', 'Water, % of reference area', 'Baseline mean', 'Standardized anomaly', 'State'],
      rows: model.grid.cells.map((cell) => [`${formatNumber(locale, Math.abs(cell.south), 2)}° ${cell.south < 0 ? 'S' : 'N'}, ${formatNumber(locale, Math.abs(cell.west), 2)}° ${cell.west < 0 ? 'W' : 'E'}`, String(cell.bodies), pct(cell.fillingPercent), pct(cell.baselineMean), signed(cell.standardized, 2), cellWords[cell.state] ?? cell.state]),
      note: `Cells with fewer than ${model.grid.minBodies} water bodies, too little seen, or too short a baseline show no anomaly.`,
    },
  ];

  const bodyName = new Map(model.bodies.map((body) => [body.id, body.name]));
  const trendRow = (entry: TrendEntry): string[] => [entry.name, methodWords[entry.test?.method ?? ''] ?? 'not tested', signed(entry.test?.slopePerYear, 2), p(entry.test?.p), p(entry.pAdjusted), directionWords[entry.direction] ?? entry.direction];
  const trendColumns = ['Water body', 'Test', 'Trend, points a year', 'p', 'Adjusted p', 'After adjustment'];
  const tested = model.trends.bodies.entries.filter((entry) => entry.test);
  const declines = tested.filter((entry) => (entry.test?.slopePerYear ?? 0) < 0).sort((a, b) => (a.test?.slopePerYear ?? 0) - (b.test?.slopePerYear ?? 0)).slice(0, 10);
  const rises = tested.filter((entry) => (entry.test?.slopePerYear ?? 0) > 0).sort((a, b) => (b.test?.slopePerYear ?? 0) - (a.test?.slopePerYear ?? 0)).slice(0, 10);
  const regionTrend = model.trends.region.entries[0];
  const change = model.trends.changePoint;
  const trendTables: TableView[] = [
    { id: 'region', caption: 'The regional series', columns: trendColumns, rows: regionTrend ? [trendRow(regionTrend)] : [], note: change.month !== null ? `Change point (Pettitt test): the series shifts from ${formatMonth(locale, change.month)} by ${signed((change.meanAfter ?? 0) - (change.meanBefore ?? 0))} points against the seasonal cycle (p ${p(change.p)}).` : 'No change point can be tested.' },
    { id: 'sub-region-trends', caption: 'Sub-regions', columns: trendColumns, rows: model.trends.subRegions.entries.map(trendRow) },
    { id: 'declines', caption: 'The ten strongest declines among water bodies', columns: trendColumns, rows: declines.map(trendRow) },
    { id: 'rises', caption: 'The ten strongest rises among water bodies', columns: trendColumns, rows: rises.map(trendRow) },
  ];

  const quality = model.quality;
  const qualityTables: TableView[] = [];
  if (quality) {
    for (const parameter of quality.parameters) {
      const name = parameter.parameter === 'chlorophyll_a' ? 'Chlorophyll-a' : 'Turbidity';
      const last = parameter.monthly[parameter.monthly.length - 1];
      qualityTables.push({
        id: `${parameter.parameter}-classes`,
        caption: `${name} (${parameter.unit}) by size class in ${model.meta.monthName}: percentiles of the water bodies' medians`,
        columns: ['Size class', 'Water bodies', '10th', '25th', '50th', '75th', '90th'],
        rows: parameter.bySizeClass.map((entry) => [entry.label, String(entry.bodies), num(entry.p10), num(entry.p25), num(entry.p50), num(entry.p75), num(entry.p90)]),
        note: `Region median ${num(last?.median ?? null)} ${parameter.unit} (each body counted once), ${num(last?.weightedMedian ?? null)} ${parameter.unit} weighted by area. Trends: ${parameter.trends.rising} of ${parameter.trends.tested} bodies rising and ${parameter.trends.falling} falling after adjustment for testing many at once.`,
      });
    }
    qualityTables.push({
      id: 'trophic',
      caption: `Trophic classes from chlorophyll-a in ${model.meta.monthName} (OECD 1982 boundaries)`,
      columns: ['Class', 'Chlorophyll-a up to', 'Water bodies'],
      rows: quality.trophic.counts.map((entry) => [entry.trophicClass, entry.upperBound === null ? 'above 25 µg/L' : `${num(entry.upperBound, 1)} µg/L`, String(entry.bodies)]),
    });
    qualityTables.push({
      id: 'who',
      caption: `Water bodies above the WHO (2003) recreational guidance levels for chlorophyll-a in ${model.meta.monthName}`,
      columns: ['Level', 'Water bodies above', 'Share of those with a value'],
      rows: quality.who.levels.map((level) => [`${level.level} µg/L`, `${level.bodiesAbove} of ${quality.who.bodiesWithValue}`, pct(level.sharePercent)]),
    });
    const seasonal = quality.parameters.flatMap((parameter) => parameter.seasonal.map((entry) => ({ ...entry, parameter: parameter.parameter === 'chlorophyll_a' ? 'Chlorophyll-a' : 'Turbidity', unit: parameter.unit })));
    if (seasonal.length > 0) {
      qualityTables.push({
        id: 'seasonal-trends',
        caption: 'Seasonal trends by size class (median of the bodies\' seasonal means, year by year)',
        columns: ['Parameter, season and size class', 'Years', 'Trend a year', 'p', 'Evidence'],
        rows: seasonal.map((entry) => [`${entry.parameter}, ${entry.season} season, ${entry.sizeClass}`, String(entry.years), entry.slopePerYear === null ? '–' : `${signed(entry.slopePerYear, 2)} ${entry.unit}`, p(entry.p), entry.p === null ? '–' : t(`evidence.${evidenceFor(entry.p)}`)]),
      });
    }
  }
  const validationTables: TableView[] = model.validation.length === 0 ? [] : [{
    id: 'validation',
    caption: 'Agreement of satellite estimates with field measurements',
    columns: ['Parameter', 'Pairs', 'Bias (satellite − field)', 'Mean absolute error', 'RMSE', 'R²', 'Line: satellite = a + b × field'],
    rows: model.validation.map((entry) => [entry.parameter === 'chlorophyll_a' ? 'Chlorophyll-a (µg/L)' : 'Turbidity (FNU)', String(entry.agreement.n), signed(entry.agreement.bias, 2), num(entry.agreement.meanAbsoluteError, 2), num(entry.agreement.rootMeanSquareError, 2), num(entry.agreement.rSquared, 2), `a = ${num(entry.agreement.intercept, 2)}, b = ${num(entry.agreement.slope, 2)}`]),
    note: `Field samples are matched to the satellite month that contains them, or to the next or previous month when within ${model.validation[0]?.windowDays ?? 0} days of it.`,
  }];

  const monitored = model.monitored.map((entry) => {
    const status = model.bodyStatus[entry.body];
    const last = [...entry.filling].reverse().find((value) => value !== null) ?? null;
    return {
      id: entry.id,
      name: entry.name,
      last: pct(last),
      status: status?.bandKey ? t(`band.${status.bandKey}`) : status?.state === 'low-coverage' ? 'not seen well enough' : 'baseline too short',
      trend: entry.slopePerYear === null ? 'not tested' : `${signed(entry.slopePerYear, 2)} points a year (${directionWords[entry.direction] ?? entry.direction})`,
    };
  });

  return {
    monitored,
    surfaceTables,
    trendTables,
    qualityTables,
    validationTables,
    trendSummary: model.trends.bodies,
    bodyName: Object.fromEntries(bodyName),
    figures: {
      percentOfBaseline: pct(regionStated?.percentOfBaseline),
      band: statusWords(regionStatus),
      coverage: pct(regionStatus.coveragePercent),
      declines: `${model.trends.bodies.declining} of ${model.trends.bodies.tested}`,
      minObservedShare: pct(100 * model.meta.minObservedShare),
      minRegionCoverage: pct(100 * model.meta.minRegionCoverage),
    },
  };
}

const cellWords: Record<string, string> = { stated: 'shown', 'too-few-bodies': 'too few water bodies', 'low-coverage': 'too little seen', 'short-baseline': 'baseline too short' };
const methodWords: Record<string, string> = { 'seasonal-kendall': 'seasonal Kendall', 'seasonal-kendall-covariance': 'seasonal Kendall, covariance-corrected', 'mann-kendall-hamed-rao': 'Mann-Kendall, autocorrelation-corrected' };
const directionWords: Record<string, string> = { decline: 'decline holds', rise: 'rise holds', none: 'no trend shown', untested: 'not tested' };

export interface BodyListPage<T> {
  number: number;
  /** Site path of the page, with trailing slash. */
  href: string;
  first: number;
  last: number;
  bodies: T[];
}

/** Pages of at most `size` items: the first at `base`, the others at base + page-N/. */
export function paginate<T>(items: T[], base: string, size: number): Array<BodyListPage<T>> {
  const pages: Array<BodyListPage<T>> = [];
  for (let from = 0; from < items.length; from += size) {
    const number = pages.length + 1;
    pages.push({ number, href: number === 1 ? base : `${base}page-${number}/`, first: from + 1, last: Math.min(items.length, from + size), bodies: items.slice(from, from + size) });
  }
  return pages;
}

/** One sub-region's page: its status, trend, water bodies and rainfall, formatted. */
export function subRegionView(model: BulletinModel, id: string) {
  const locale = model.meta.locale;
  const { t, pct } = formatters(locale);
  const group = model.surfaceWater.subRegions.find((entry) => entry.id === id);
  const trend = model.trends.subRegions.entries.find((entry) => entry.id === id);
  const rain = model.rainfall?.subRegions.find((entry) => entry.id === id);
  const status = group?.status;
  const bodies = model.bodies
    .map((body, k) => ({ body, k }))
    .filter(({ body }) => body.subRegionId === id)
    .map(({ body, k }) => {
      const own = model.bodyStatus[k];
      return { id: body.id, name: body.name, kind: body.kind, area: formatNumber(locale, body.referenceHa, 1), status: own?.bandKey ? t(`band.${own.bandKey}`) : own?.state === 'low-coverage' ? 'not seen well enough' : 'baseline too short', percent: pct(own?.percentOfBaseline), href: body.ownPage ? `${model.meta.issuePath}water-bodies/${slugOf(body.id)}/` : null };
    });
  const slug = slugOf(id);
  // Up to site.bodiesPerListPage bodies are listed on the sub-region's page and the index; more get numbered pages.
  const perPage = model.meta.bodiesPerListPage;
  const listPages = bodies.length > perPage ? paginate(bodies, `${model.meta.issuePath}sub-regions/${slug}/water-bodies/`, perPage) : [];
  return {
    id,
    slug,
    name: group?.name ?? id,
    bodies: listPages.length > 0 ? [] : bodies,
    bodyCount: bodies.length,
    listPages,
    summary: [
      ['Water bodies', String(group?.bodies ?? 0)],
      ['Reference area', `${formatNumber(locale, group?.referenceHa ?? 0, 0)} ha`],
      ['Water, % of reference area', pct(status && status.kind !== 'low-coverage' ? status.fillingPercent : null)],
      ['Percent of usual', pct(status?.kind === 'stated' ? status.percentOfBaseline : null)],
      ['Status', status?.kind === 'stated' ? t(`band.${status.bandKey}`) : status?.kind === 'low-coverage' ? 'not stated: too little seen' : 'not stated: baseline too short'],
      ['Seen by satellite', pct(status?.coveragePercent)],
      ['Trend since the first month, points a year', trend?.test ? formatNumber(locale, trend.test.slopePerYear, 2) : 'not tested'],
      ['Trend after adjustment for testing many at once', trend ? (directionWords[trend.direction] ?? trend.direction) : 'not tested'],
      [`Rainfall in ${model.meta.monthName}`, rain?.bulletinMonthMm === null || rain?.bulletinMonthMm === undefined ? '–' : `${formatNumber(locale, rain.bulletinMonthMm, 0)} mm (${pct(rain.percentOfBaseline)} of usual)`],
    ],
  };
}

/** One monitored water body's page, formatted. */
export function bodyView(model: BulletinModel, index: number) {
  const locale = model.meta.locale;
  const { t } = formatters(locale);
  const body = model.bodies[index] as BulletinModel['bodies'][number];
  const own = model.bodyStatus[index];
  const monitored = model.monitored.find((entry) => entry.body === index);
  const trophic = model.quality?.trophic.bodies.find((entry) => entry.id === body.id);
  const subRegion = model.boundaries.find((entry) => entry.id === body.subRegionId);
  return {
    id: body.id,
    slug: slugOf(body.id),
    name: body.name,
    subRegion: { name: subRegion?.name ?? body.subRegionId, href: `${model.meta.issuePath}sub-regions/${slugOf(body.subRegionId)}/` },
    summary: [
      ['Kind', body.kind],
      ['Reference area', `${formatNumber(locale, body.referenceHa, 1)} ha`],
      ['Location', `${formatNumber(locale, Math.abs(body.lat), 3)}° ${body.lat < 0 ? 'S' : 'N'}, ${formatNumber(locale, Math.abs(body.lon), 3)}° ${body.lon < 0 ? 'W' : 'E'}`],
      ['Percent of usual', own?.percentOfBaseline === null || own?.percentOfBaseline === undefined ? '–' : formatPercent(locale, own.percentOfBaseline)],
      ['Status', own?.bandKey ? t(`band.${own.bandKey}`) : own?.state === 'low-coverage' ? 'not seen well enough this month' : 'baseline too short'],
      ['Trend since the first month, points a year', monitored?.slopePerYear === null || monitored?.slopePerYear === undefined ? 'not tested' : formatNumber(locale, monitored.slopePerYear, 2)],
      ['Trend after adjustment for testing many at once', directionWords[monitored?.direction ?? 'untested'] ?? 'not tested'],
      ['Chlorophyll-a this month', trophic ? `${formatNumber(locale, trophic.chlorophyll, 1)} µg/L (trophic state index ${formatNumber(locale, trophic.index, 0)}, ${trophic.trophicClass})` : 'no estimate'],
    ],
  };
}

export const slugOf = (id: string) => id.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'item';
