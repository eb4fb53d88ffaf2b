/** Chart definitions for the surface-water page, built from the model alone. */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../model/index.ts';
import { formatMessage, loadMessages } from '../text/index.ts';
import type { ChartDefinition } from './render.ts';

/** Okabe & Ito (2008) colour-universal-design palette: blue, vermillion; a mid grey; a light blue band. */
const INK = '#0072B2';
const HIGHLIGHT = '#D55E00';
const MUTED = '#6b6b6b';
const ENVELOPE = '#c6dbef';

const monthText = (index: number) => `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
const round = (value: number | null, digits = 1) => (value === null ? null : Math.round(value * 10 ** digits) / 10 ** digits);

export function regionalSeriesChart(model: BulletinModel): ChartDefinition {
  const messages = loadMessages(model.meta.locale);
  const series = model.surfaceWater.region.series;
  const envelope = model.surfaceWater.regionEnvelope;
  const last = series[series.length - 1]?.month;
  const values = series.map((entry) => {
    const band = envelope[entry.month % 12];
    return { month: monthText(entry.month), filling: round(entry.fillingPercent), coverage: round(entry.coveragePercent), median: round(band?.median ?? null), p10: round(band?.p10 ?? null), p90: round(band?.p90 ?? null), isBulletin: entry.month === last };
  });
  const x = { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%Y', tickCount: 'year' } } as const;
  const spec: TopLevelSpec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 640,
    height: 240,
    padding: 12,
    data: { values },
    layer: [
      { mark: { type: 'area', color: ENVELOPE, opacity: 0.9 }, encoding: { x, y: { field: 'p10', type: 'quantitative', title: 'Water, % of reference area', scale: { zero: false } }, y2: { field: 'p90' } } },
      { mark: { type: 'line', color: MUTED, strokeDash: [4, 3], strokeWidth: 1.5 }, encoding: { x, y: { field: 'median', type: 'quantitative' } } },
      { mark: { type: 'line', color: INK, strokeWidth: 2 }, encoding: { x, y: { field: 'filling', type: 'quantitative' } } },
      { transform: [{ filter: 'datum.isBulletin' }], mark: { type: 'point', shape: 'diamond', size: 120, filled: true, color: HIGHLIGHT }, encoding: { x, y: { field: 'filling', type: 'quantitative' } } },
    ],
  };
  return {
    id: 'regional-series',
    title: formatMessage(messages, 'chart.regional.title', { first: values[0]?.month ?? '', last: model.meta.month }),
    description: formatMessage(messages, 'chart.regional.desc', { headline: model.headline }),
    spec,
    table: {
      caption: 'Regional filling, coverage and baseline by month',
      columns: ['Month', 'Water, % of reference area', 'Coverage, %', 'Baseline median, %', 'Baseline 10th percentile, %', 'Baseline 90th percentile, %'],
      rows: values.map((row) => [row.month, row.filling ?? 'not stated', row.coverage ?? 0, row.median ?? '–', row.p10 ?? '–', row.p90 ?? '–']),
    },
  };
}

export function sameMonthChart(model: BulletinModel): ChartDefinition {
  const messages = loadMessages(model.meta.locale);
  const entries = model.surfaceWater.sameMonthEachYear;
  const status = model.surfaceWater.region.status;
  const values = entries.map((entry) => ({ year: String(entry.year), filling: round(entry.fillingPercent), group: entry.inBaseline ? 'baseline year' : 'other year' }));
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 480,
    height: 220,
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'bar', stroke: '#1a1a1a', strokeWidth: 0.5 },
        encoding: {
          x: { field: 'year', type: 'ordinal', title: null, axis: { labelAngle: 0 } },
          y: { field: 'filling', type: 'quantitative', title: 'Water, % of reference area' },
          color: { field: 'group', type: 'nominal', title: null, scale: { domain: ['baseline year', 'other year'], range: [MUTED, INK] }, legend: { orient: 'bottom' } },
        },
      },
      ...(status.kind === 'stated'
        ? [{ data: { values: [{ median: round(status.baseline.median) }] }, mark: { type: 'rule', color: HIGHLIGHT, strokeWidth: 2, strokeDash: [6, 3] }, encoding: { y: { field: 'median', type: 'quantitative' } } }]
        : []),
    ],
  } as TopLevelSpec;
  const first = entries[0]?.year ?? 0;
  const last = entries[entries.length - 1]?.year ?? 0;
  return {
    id: 'same-month',
    title: formatMessage(messages, 'chart.calendar.title', { calendarMonth: model.meta.calendarMonthName }),
    description: formatMessage(messages, 'chart.calendar.desc', { calendarMonth: model.meta.calendarMonthName, first, last, headline: model.headline }),
    spec,
    table: {
      caption: `Regional filling in ${model.meta.calendarMonthName} of each year`,
      columns: ['Year', 'Water, % of reference area', 'In baseline'],
      rows: entries.map((entry) => [entry.year, round(entry.fillingPercent) ?? 'not stated', entry.inBaseline ? 'yes' : 'no']),
    },
  };
}
