/** Chart definitions for the surface-water page, built from the model alone. */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../model/index.ts';
import { formatMessage, loadMessages } from '../text/index.ts';
import type { ChartDefinition } from './render.ts';

/** Okabe & Ito (2008) colour-universal-design palette: blue, vermillion, and a mid grey. */
const INK = '#0072B2';
const HIGHLIGHT = '#D55E00';
const MUTED = '#6b6b6b';

const monthText = (index: number) => `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

export function regionalSeriesChart(model: BulletinModel): ChartDefinition {
  const messages = loadMessages(model.meta.locale);
  const series = model.surfaceWater.series;
  const first = monthText(series[0]?.month ?? 0);
  const last = model.meta.month;
  const values = series.map((entry) => ({ month: monthText(entry.month), filling: entry.fillingPercent === null ? null : round(entry.fillingPercent, 1), coverage: round(entry.coveragePercent, 1), isBulletin: entry.month === series[series.length - 1]?.month }));
  const spec: TopLevelSpec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 640,
    height: 240,
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'line', color: INK, strokeWidth: 2, interpolate: 'linear' },
        encoding: {
          x: { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%Y', tickCount: 'year' } },
          y: { field: 'filling', type: 'quantitative', title: 'Water, % of reference area', scale: { zero: false } },
        },
      },
      {
        transform: [{ filter: 'datum.isBulletin' }],
        mark: { type: 'point', shape: 'diamond', size: 120, filled: true, color: HIGHLIGHT },
        encoding: {
          x: { field: 'month', type: 'temporal', timeUnit: 'yearmonth' },
          y: { field: 'filling', type: 'quantitative' },
        },
      },
    ],
  };
  return {
    id: 'regional-series',
    title: formatMessage(messages, 'chart.regional.title', { first, last }),
    description: formatMessage(messages, 'chart.regional.desc', { headline: model.headline }),
    spec,
    table: {
      caption: 'Regional filling and coverage by month',
      columns: ['Month', 'Water, % of reference area', 'Coverage, %'],
      rows: values.map((row) => [row.month, row.filling === null ? 'not stated' : row.filling, row.coverage]),
    },
  };
}

export function sameMonthChart(model: BulletinModel): ChartDefinition {
  const messages = loadMessages(model.meta.locale);
  const entries = model.surfaceWater.sameMonthEachYear;
  const comparison = model.surfaceWater.bulletin;
  const values = entries.map((entry) => ({
    year: String(entry.year),
    filling: entry.fillingPercent === null ? null : round(entry.fillingPercent, 1),
    group: entry.inBaseline ? 'baseline year' : 'other year',
  }));
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
      ...(comparison.kind === 'stated'
        ? [
            {
              data: { values: [{ median: round(comparison.baselineMedianPercent, 1) }] },
              mark: { type: 'rule', color: HIGHLIGHT, strokeWidth: 2, strokeDash: [6, 3] },
              encoding: { y: { field: 'median', type: 'quantitative' } },
            },
          ]
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
      rows: entries.map((entry) => [entry.year, entry.fillingPercent === null ? 'not stated' : round(entry.fillingPercent, 1), entry.inBaseline ? 'yes' : 'no']),
    },
  };
}
