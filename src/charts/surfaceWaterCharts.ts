/** Chart definitions for surface water, built from the model alone. */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../wording/index.ts';
import { translator, bandKey } from '../text/index.ts';
import { formatMonth, formatNumber, formatPercent } from '../text/format.ts';
import { GREY, OKABE_ITO, OUTLINE } from './palettes.ts';
import { monthLabel } from '../common/months.ts';
import { roundOrNull, VEGA_LITE_SCHEMA, type ChartDefinition } from './render.ts';

const ENVELOPE = '#c6dbef';
const round = (value: number | null | undefined, digits = 1) => roundOrNull(value, digits);
const cell = (value: number | null) => (value === null ? '–' : value);

/**
 * The regional baseline band shared by the charts of the region's months: each month's usual values
 * (median, low and high of its calendar month), the two layers that draw them (shaded band, dashed
 * median) and their data-table columns. `range`: the band is the lowest–highest of fewer than 10
 * baseline years, not percentiles, and the words say so.
 */
type Layer = Extract<TopLevelSpec, { layer: unknown }>['layer'][number];

/** The time axis of the charts of the region's months. */
interface MonthAxis {
  field: 'month';
  type: 'temporal';
  timeUnit: 'yearmonth';
  title: null;
  axis: { format: string; tickCount: number | 'year'; labelAngle?: number };
}

function regionBand(model: BulletinModel) {
  const t = translator(model.meta.locale);
  const envelope = model.surfaceWater.regionEnvelope;
  const range = envelope.some((band) => band.low !== null && band.kind === 'range');
  return {
    range,
    values: (month: number) => {
      const band = envelope[month % 12];
      return { median: round(band?.median), low: round(band?.low), high: round(band?.high) };
    },
    layers: (x: MonthAxis): Layer[] => [
      {
        mark: { type: 'area', color: ENVELOPE, opacity: 0.9 },
        encoding: { x, y: { field: 'low', type: 'quantitative', title: t('view.water'), scale: { zero: false } }, y2: { field: 'high' } },
      },
      {
        mark: { type: 'line', color: GREY, strokeDash: [4, 3], strokeWidth: 1.5 },
        encoding: { x, y: { field: 'median', type: 'quantitative' } },
      },
    ],
    columns: [
      t('chart.baselineMedian'),
      t(range ? 'chart.baselineLowest' : 'chart.baselineP10'),
      t(range ? 'chart.baselineHighest' : 'chart.baselineP90'),
    ],
    cells: (row: { median: number | null; low: number | null; high: number | null }) => [cell(row.median), cell(row.low), cell(row.high)],
  };
}

/**
 * A column for a chart's table saying which months an earlier issue printed with another value
 * ("revised from 55.0 % in the September 2026 issue"), empty for the others; none at all when
 * nothing was revised, so tables without revisions keep their shape.
 */
function revisedColumn(model: BulletinModel): { columns: string[]; cell: (month: string) => string[] } {
  // The charts draw the region: only its own revisions.
  const regional = model.revised.filter((entry) => entry.figure.kind === 'region');
  if (regional.length === 0) return { columns: [], cell: () => [] };
  const t = translator(model.meta.locale);
  const byMonth = new Map(regional.map((entry) => [entry.month, entry]));
  return {
    columns: [t('chart.revised.column')],
    cell: (month) => {
      const entry = byMonth.get(month);
      return [
        entry
          ? t('chart.revised.from', { printed: formatPercent(model.meta.locale, entry.printedPercent, 1), issue: entry.issueMonthName })
          : '',
      ];
    },
  };
}

export function regionalSeriesChart(model: BulletinModel): ChartDefinition {
  const t = translator(model.meta.locale);
  const series = model.surfaceWater.region.series;
  const band = regionBand(model);
  const revised = revisedColumn(model);
  const range = band.range;
  const bulletinYear = Number(model.meta.month.slice(0, 4));
  const values = series.map((entry) => ({
    month: monthLabel(entry.month),
    filling: round(entry.fillingPercent),
    thisYear: Math.floor(entry.month / 12) === bulletinYear ? round(entry.fillingPercent) : null,
    coverage: round(100 * entry.coverageShare),
    ...band.values(entry.month),
  }));
  const x = { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%Y', tickCount: 'year' } } as const;
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: 240,
    padding: 12,
    data: { values },
    layer: [
      ...band.layers(x),
      { mark: { type: 'line', color: OKABE_ITO.blue, strokeWidth: 1.5 }, encoding: { x, y: { field: 'filling', type: 'quantitative' } } },
      {
        mark: { type: 'line', color: OKABE_ITO.vermillion, strokeWidth: 3, point: { filled: true, size: 30, color: OKABE_ITO.vermillion } },
        encoding: { x, y: { field: 'thisYear', type: 'quantitative' } },
      },
    ],
  };
  return {
    id: 'regional-series',
    title: t('chart.regional.title', {
      first: series[0] ? formatMonth(model.meta.locale, series[0].month) : '',
      last: model.meta.monthName,
    }),
    description: `${t('chart.regional.desc', { headline: model.headline })} ${t(range ? 'chart.regional.keyRange' : 'chart.regional.key', { year: bulletinYear })}`,
    spec,
    table: {
      caption: t('chart.regional.caption'),
      columns: [t('chart.month'), t('view.water'), t('chart.coverage'), ...band.columns, ...revised.columns],
      rows: values.map((row) => [
        row.month,
        row.filling ?? t('chart.notStated'),
        row.coverage ?? 0,
        ...band.cells(row),
        ...revised.cell(row.month),
      ]),
    },
  };
}

/** Months the overview's chart of recent months shows. */
export const RECENT_MONTHS = 24;

/**
 * The overview's picture of the region over the last RECENT_MONTHS months: its water surface area
 * against the usual band of each calendar month, the range the estimated bodies give each month as
 * a bar, and the bulletin month (provisional) marked.
 */
export function recentMonthsChart(model: BulletinModel): ChartDefinition {
  const t = translator(model.meta.locale);
  const series = model.surfaceWater.region.series.slice(-RECENT_MONTHS);
  const band = regionBand(model);
  const revised = revisedColumn(model);
  const range = band.range;
  const last = series[series.length - 1]?.month ?? null;
  const values = series.map((entry) => {
    const moved = entry.lowPercent !== null && entry.highPercent !== null && entry.highPercent - entry.lowPercent >= 0.05;
    return {
      month: monthLabel(entry.month),
      filling: round(entry.fillingPercent),
      rangeLow: moved ? round(entry.lowPercent) : null,
      rangeHigh: moved ? round(entry.highPercent) : null,
      estimated: round(100 * entry.estimatedShare, 0),
      ...band.values(entry.month),
      bulletin: entry.month === last ? round(entry.fillingPercent) : null,
    };
  });
  const x = {
    field: 'month',
    type: 'temporal',
    timeUnit: 'yearmonth',
    title: null,
    axis: { format: '%b %Y', labelAngle: 0, tickCount: 6 },
  } as const;
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 440,
    height: 260,
    padding: 12,
    data: { values },
    layer: [
      ...band.layers(x),
      {
        mark: { type: 'rule', color: OKABE_ITO.blue, strokeWidth: 2 },
        encoding: { x, y: { field: 'rangeLow', type: 'quantitative' }, y2: { field: 'rangeHigh' } },
      },
      {
        mark: { type: 'line', color: OKABE_ITO.blue, strokeWidth: 2, point: { filled: true, size: 24, color: OKABE_ITO.blue } },
        encoding: { x, y: { field: 'filling', type: 'quantitative' } },
      },
      {
        mark: { type: 'point', filled: true, size: 140, shape: 'diamond', color: OKABE_ITO.vermillion, stroke: OUTLINE, strokeWidth: 1 },
        encoding: { x, y: { field: 'bulletin', type: 'quantitative' } },
      },
    ],
  };
  return {
    id: 'recent-months',
    title: t('chart.recent.title', { months: series.length, last: model.meta.monthName }),
    description: `${t('chart.recent.desc', { headline: model.headline, month: model.meta.monthName })} ${t(range ? 'chart.recent.keyRange' : 'chart.recent.key')}`,
    spec,
    table: {
      caption: t('chart.recent.caption'),
      columns: [
        t('chart.month'),
        t('view.water'),
        t('chart.recent.low'),
        t('chart.recent.high'),
        t('view.estimated'),
        ...band.columns,
        ...revised.columns,
      ],
      rows: values.map((row) => [
        row.month,
        row.filling ?? t('chart.notStated'),
        cell(row.rangeLow),
        cell(row.rangeHigh),
        row.estimated ?? 0,
        ...band.cells(row),
        ...revised.cell(row.month),
      ]),
    },
  };
}

export function sameMonthChart(model: BulletinModel): ChartDefinition {
  const t = translator(model.meta.locale);
  const entries = model.surfaceWater.sameMonthEachYear;
  const status = model.surfaceWater.region.status;
  const baselineYear = t('chart.baselineYear');
  const otherYear = t('chart.otherYear');
  const values = entries.map((entry) => ({
    year: String(entry.year),
    filling: round(entry.fillingPercent),
    group: entry.inBaseline ? baselineYear : otherYear,
  }));
  const spec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 480,
    height: 220,
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'bar', stroke: OUTLINE, strokeWidth: 0.5 },
        encoding: {
          x: { field: 'year', type: 'ordinal', title: null, axis: { labelAngle: 0 } },
          y: { field: 'filling', type: 'quantitative', title: t('view.water') },
          color: {
            field: 'group',
            type: 'nominal',
            title: null,
            scale: { domain: [baselineYear, otherYear], range: [GREY, OKABE_ITO.blue] },
            legend: { orient: 'bottom' },
          },
        },
      },
      ...(status.kind === 'stated'
        ? [
            {
              data: { values: [{ median: round(status.baseline.median) }] },
              mark: { type: 'rule', color: OKABE_ITO.vermillion, strokeWidth: 2, strokeDash: [6, 3] },
              encoding: { y: { field: 'median', type: 'quantitative' } },
            },
          ]
        : []),
    ],
  } as TopLevelSpec;
  return {
    id: 'same-month',
    title: t('chart.calendar.title', { calendarMonth: model.meta.calendarMonthName }),
    description: t('chart.calendar.desc', {
      calendarMonth: model.meta.calendarMonthName,
      first: entries[0]?.year ?? 0,
      last: entries[entries.length - 1]?.year ?? 0,
      headline: model.headline,
    }),
    spec,
    table: {
      caption: t('chart.calendar.caption', { calendarMonth: model.meta.calendarMonthName }),
      columns: [t('chart.year'), t('view.water'), t('chart.inBaseline')],
      rows: entries.map((entry) => [
        entry.year,
        round(entry.fillingPercent) ?? t('chart.notStated'),
        t(entry.inBaseline ? 'chart.yes' : 'chart.no'),
      ]),
    },
  };
}

export function anomalyBarsChart(model: BulletinModel): ChartDefinition {
  const locale = model.meta.locale;
  const t = translator(locale);
  const rows = model.surfaceWater.regionAnomalies.slice(-36);
  const belowWords = t('chart.anomaly.below');
  const aboveWords = t('chart.anomaly.above');
  const values = rows.map((row) => ({
    month: monthLabel(row.month),
    points: round(row.points),
    sign: row.points < 0 ? belowWords : aboveWords,
  }));
  const below = rows.filter((row) => row.points < 0).length;
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: 200,
    padding: 12,
    data: { values },
    mark: { type: 'bar', stroke: OUTLINE, strokeWidth: 0.5 },
    encoding: {
      x: {
        field: 'month',
        type: 'ordinal',
        title: null,
        axis: { labelAngle: -90, labelExpr: "substring(datum.value, 5) == '01' || substring(datum.value, 5) == '07' ? datum.value : ''" },
      },
      y: { field: 'points', type: 'quantitative', title: t('chart.anomaly.axis') },
      color: {
        field: 'sign',
        type: 'nominal',
        title: null,
        scale: {
          domain: [belowWords, aboveWords],
          range: [model.meta.statusColours[0] as string, model.meta.statusColours[model.meta.statusColours.length - 1] as string],
        },
        legend: { orient: 'bottom' },
      },
    },
  };
  const first = rows[0] ? formatMonth(locale, rows[0].month) : '';
  return {
    id: 'anomaly-bars',
    title: t('chart.anomaly.title', { first, last: model.meta.monthName }),
    description: t('chart.anomaly.desc', { below, months: rows.length }),
    spec,
    table: {
      caption: t('chart.anomaly.caption'),
      columns: [t('chart.month'), t('chart.anomaly.column')],
      rows: values.map((row) => [row.month, row.points ?? '–']),
    },
  };
}

export function subRegionChart(model: BulletinModel): ChartDefinition {
  const locale = model.meta.locale;
  const t = translator(locale);
  const values = model.surfaceWater.subRegions.map((group) => {
    const stated = group.status.kind === 'stated' ? group.status : null;
    return {
      name: group.name,
      percent: round(stated?.percentOfBaseline ?? null, 0),
      label: stated ? `${formatPercent(locale, stated.percentOfBaseline)} · ${t(bandKey(stated.bandKey))}` : t('chart.notStated'),
    };
  });
  const lowest = [...values].filter((row) => row.percent !== null).sort((a, b) => (a.percent as number) - (b.percent as number))[0];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 460,
    height: { step: 36 },
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'bar', color: OKABE_ITO.blue },
        encoding: {
          y: { field: 'name', type: 'nominal', title: null, sort: null },
          x: { field: 'percent', type: 'quantitative', title: t('ui.percentOfUsual'), scale: { domain: [0, 150] } },
        },
      },
      {
        data: { values: [{ usual: 100 }] },
        mark: { type: 'rule', color: OUTLINE, strokeDash: [4, 3], strokeWidth: 1.5 },
        encoding: { x: { field: 'usual', type: 'quantitative' } },
      },
      {
        mark: { type: 'text', align: 'left', dx: 4, color: OUTLINE },
        encoding: {
          y: { field: 'name', type: 'nominal', sort: null },
          x: { field: 'percent', type: 'quantitative' },
          text: { field: 'label' },
        },
      },
    ],
  };
  return {
    id: 'sub-regions',
    title: t('chart.subRegions.title', { month: model.meta.monthName }),
    description: lowest
      ? t('chart.subRegions.desc', { name: lowest.name, percent: formatPercent(locale, lowest.percent as number) })
      : t('chart.subRegions.none'),
    spec,
    table: {
      caption: t('chart.subRegions.caption'),
      columns: [t('chart.subRegion'), t('ui.percentOfUsual'), t('ui.status')],
      rows: values.map((row) => [row.name, row.percent ?? '–', row.label]),
    },
  };
}

export function sizeClassChart(model: BulletinModel): ChartDefinition {
  const locale = model.meta.locale;
  const t = translator(locale);
  const values = model.surfaceWater.sizeClasses.flatMap((entry) => [
    { sizeClass: entry.name, when: model.meta.monthName, dry: round(entry.lossPercent) },
    {
      sizeClass: entry.name,
      when: t('chart.sizeClasses.usual', { calendarMonth: model.meta.calendarMonthName }),
      dry: round(entry.baselineLossPercent),
    },
  ]);
  const worst = [...model.surfaceWater.sizeClasses]
    .filter((entry) => entry.lossPercent !== null && entry.baselineLossPercent !== null)
    .sort(
      (a, b) =>
        (b.lossPercent as number) - (b.baselineLossPercent as number) - ((a.lossPercent as number) - (a.baselineLossPercent as number)),
    )[0];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 460,
    height: 220,
    padding: 12,
    data: { values },
    mark: { type: 'bar', stroke: OUTLINE, strokeWidth: 0.5 },
    encoding: {
      x: { field: 'sizeClass', type: 'nominal', title: null, sort: null, axis: { labelAngle: 0 } },
      xOffset: { field: 'when', sort: null },
      y: { field: 'dry', type: 'quantitative', title: t('chart.sizeClasses.axis') },
      color: {
        field: 'when',
        type: 'nominal',
        title: null,
        sort: null,
        scale: { range: [OKABE_ITO.vermillion, GREY] },
        legend: { orient: 'bottom' },
      },
    },
  };
  return {
    id: 'size-classes',
    title: t('chart.sizeClasses.title', { month: model.meta.monthName }),
    description: worst
      ? t('chart.sizeClasses.desc', {
          calendarMonth: model.meta.calendarMonthName,
          name: worst.name,
          loss: formatPercent(locale, worst.lossPercent as number),
          usual: formatPercent(locale, worst.baselineLossPercent as number),
        })
      : t('chart.sizeClasses.none'),
    spec,
    table: {
      caption: t('chart.sizeClasses.caption'),
      columns: [
        t('view.sizeClass'),
        model.meta.monthName,
        t('chart.sizeClasses.usualColumn', { calendarMonth: model.meta.calendarMonthName }),
      ],
      rows: model.surfaceWater.sizeClasses.map((entry) => [
        entry.name,
        round(entry.lossPercent) ?? '–',
        round(entry.baselineLossPercent) ?? '–',
      ]),
    },
  };
}

export function rainfallChart(model: BulletinModel): ChartDefinition | null {
  const rain = model.rainfall;
  if (!rain) return null;
  const locale = model.meta.locale;
  const t = translator(locale);
  const values = rain.subRegions.flatMap((entry) =>
    entry.monthly.slice(-36).map((row) => ({ month: monthLabel(row.month), subRegion: entry.name, rainfall: round(row.rainfallMm) })),
  );
  const names = rain.subRegions.map((entry) => entry.name);
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: 200,
    padding: 12,
    data: { values },
    mark: { type: 'line', strokeWidth: 2, point: { filled: true, size: 24 } },
    encoding: {
      x: { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%b %Y', tickCount: 6 } },
      y: { field: 'rainfall', type: 'quantitative', title: t('chart.rainfall.axis') },
      color: {
        field: 'subRegion',
        type: 'nominal',
        title: null,
        scale: {
          domain: names,
          range: [OKABE_ITO.blue, OKABE_ITO.vermillion, OKABE_ITO.bluishGreen, OKABE_ITO.reddishPurple, OKABE_ITO.orange],
        },
        legend: { orient: 'bottom' },
      },
      shape: {
        field: 'subRegion',
        type: 'nominal',
        title: null,
        scale: { domain: names, range: ['circle', 'square', 'triangle-up', 'diamond', 'cross'] },
      },
    },
  };
  const parts = rain.subRegions.map(
    (entry) => `${entry.name} ${entry.percentOfBaseline === null ? t('chart.noFigure') : formatPercent(locale, entry.percentOfBaseline)}`,
  );
  return {
    id: 'rainfall',
    title: t('chart.rainfall.title'),
    description: t('chart.rainfall.desc', { month: model.meta.monthName, parts: parts.join(', ') }),
    spec,
    table: {
      caption: t('chart.rainfall.caption'),
      columns: [t('chart.month'), ...names],
      rows:
        rain.subRegions[0]?.monthly
          .slice(-36)
          .map((row, k) => [
            monthLabel(row.month),
            ...rain.subRegions.map((entry) => round(entry.monthly.slice(-36)[k]?.rainfallMm) ?? '–'),
          ]) ?? [],
    },
  };
}

/** A small line per monitored body for tables: the last 36 months of filling, no axes. */
export function sparklineChart(model: BulletinModel, bodyIndex: number, values: Array<number | null>, firstMonth: number): ChartDefinition {
  const t = translator(model.meta.locale);
  const body = model.bodies[bodyIndex] as BulletinModel['bodies'][number];
  const rows = values.map((value, k) => ({ month: monthLabel(firstMonth + k), filling: round(value) }));
  const known = rows.filter((row) => row.filling !== null);
  const last = known[known.length - 1];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 120,
    height: 28,
    padding: 2,
    data: { values: rows },
    mark: { type: 'line', color: OKABE_ITO.blue, strokeWidth: 1.5 },
    encoding: {
      x: { field: 'month', type: 'ordinal', axis: null },
      y: { field: 'filling', type: 'quantitative', axis: null, scale: { zero: false } },
    },
    config: { view: { stroke: null } },
  };
  return {
    id: `spark-${body.id.toLowerCase().replace(/[^a-z0-9-]/g, '-')}`,
    title: t('chart.spark.title', { name: body.name }),
    description: last
      ? t('chart.spark.desc', { name: body.name, value: formatNumber(model.meta.locale, last.filling as number, 0), month: last.month })
      : t('chart.spark.none', { name: body.name }),
    spec,
    table: {
      caption: t('chart.spark.caption', { name: body.name }),
      columns: [t('chart.month'), t('view.water')],
      rows: rows.map((row) => [row.month, row.filling ?? '–']),
    },
  };
}
