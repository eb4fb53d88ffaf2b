/** Chart definitions for water quality and its field checks, built from the model alone. */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../wording/index.ts';
import type { QualityParameterSummary } from '../model/quality.ts';
import type { QualityParameter } from '../ingest/index.ts';
import { formatNumber } from '../text/format.ts';
import { translator } from '../text/index.ts';
import { GREY, OKABE_ITO, OUTLINE, YELLOW_GREEN_BLUE_5 } from './palettes.ts';
import { monthLabel } from '../common/months.ts';
import { roundOrNull, VEGA_LITE_SCHEMA, type ChartDefinition } from './render.ts';

const round = (value: number | null | undefined, digits = 2) => roundOrNull(value, digits);
const nameOf = (model: BulletinModel, parameter: { parameter: QualityParameter }) =>
  translator(model.meta.locale)(`parameter.${parameter.parameter}`);
const slug = (parameter: QualityParameterSummary) => (parameter.parameter === 'chlorophyll_a' ? 'chlorophyll' : 'turbidity');

/** Binned strip: months across, value bins up, the number of water bodies in each bin as colour and as text. */
export function distributionChart(model: BulletinModel, parameter: QualityParameterSummary): ChartDefinition {
  const edges = parameter.distribution.edges;
  const label = (k: number) =>
    `${formatNumber(model.meta.locale, edges[k] as number, (edges[k] as number) < 1 ? 2 : 0)}–${formatNumber(model.meta.locale, edges[k + 1] as number, (edges[k + 1] as number) < 1 ? 2 : 0)}`;
  const values = parameter.distribution.months
    .flatMap((row) => row.counts.map((count, k) => ({ month: monthLabel(row.month), bin: label(k), order: k, bodies: count })))
    .filter((row) => row.bodies > 0);
  const bins = [...new Set(values.sort((a, b) => a.order - b.order).map((row) => row.bin))];
  const busiest = [...values].sort((a, b) => b.bodies - a.bodies)[0];
  const t = translator(model.meta.locale);
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: { step: 18 },
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'rect', stroke: '#ffffff', strokeWidth: 0.5 },
        encoding: {
          x: { field: 'month', type: 'ordinal', title: null, axis: { labelAngle: -90 } },
          y: { field: 'bin', type: 'ordinal', sort: [...bins].reverse(), title: `${nameOf(model, parameter)}, ${parameter.unit}` },
          color: {
            field: 'bodies',
            type: 'quantitative',
            title: t('ui.bodies'),
            scale: { range: [YELLOW_GREEN_BLUE_5[0], YELLOW_GREEN_BLUE_5[4]] },
          },
        },
      },
      {
        mark: { type: 'text', fontSize: 9 },
        encoding: {
          x: { field: 'month', type: 'ordinal' },
          y: { field: 'bin', type: 'ordinal', sort: [...bins].reverse() },
          text: { field: 'bodies' },
          color: { condition: { test: 'datum.bodies > 6', value: '#ffffff' }, value: '#000000' },
        },
      },
    ],
  };
  return {
    id: `${slug(parameter)}-distribution`,
    title: t('chart.distribution.title', { name: nameOf(model, parameter) }),
    description: `${t(parameter.parameter === 'chlorophyll_a' ? 'chart.distribution.descLog' : 'chart.distribution.desc')}${busiest ? ` ${t('chart.distribution.busiest', { bin: busiest.bin, unit: parameter.unit, month: busiest.month, bodies: busiest.bodies })}` : ''}`,
    spec,
    table: {
      caption: t('chart.distribution.caption', { name: nameOf(model, parameter) }),
      columns: [t('chart.month'), t('chart.bin'), t('ui.bodies')],
      rows: values.map((row) => [row.month, row.bin, row.bodies]),
    },
  };
}

/** Region medians by month with Sen's trend line. */
export function medianTrendChart(model: BulletinModel, parameter: QualityParameterSummary): ChartDefinition {
  const trend = parameter.medianTrend;
  const values = parameter.monthly.map((row) => ({
    month: monthLabel(row.month),
    median: round(row.median),
    weighted: round(row.weightedMedian),
    trend: trend ? round(trend.intercept + (trend.slopePerYear * row.month) / 12) : null,
  }));
  const x = { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%Y', tickCount: 'year' } } as const;
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: 200,
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'line', color: OKABE_ITO.bluishGreen, strokeWidth: 1.5 },
        encoding: { x, y: { field: 'median', type: 'quantitative', title: `${nameOf(model, parameter)}, ${parameter.unit}` } },
      },
      {
        mark: { type: 'line', color: OKABE_ITO.vermillion, strokeWidth: 2, strokeDash: [6, 3] },
        encoding: { x, y: { field: 'trend', type: 'quantitative' } },
      },
    ],
  };
  const locale = model.meta.locale;
  const t = translator(locale);
  return {
    id: `${slug(parameter)}-medians`,
    title: t('chart.medians.title', { name: nameOf(model, parameter) }),
    description: `${t('chart.medians.desc', { name: nameOf(model, parameter).toLocaleLowerCase(locale) })}${trend ? ` ${t('chart.medians.slope', { slope: formatNumber(locale, trend.slopePerYear, 2), unit: parameter.unit })}` : ''}`,
    spec,
    table: {
      caption: t('chart.medians.caption', { name: nameOf(model, parameter) }),
      columns: [
        t('chart.month'),
        t('chart.medians.median', { unit: parameter.unit }),
        t('chart.medians.weighted', { unit: parameter.unit }),
        t('chart.medians.line', { unit: parameter.unit }),
      ],
      rows: values.map((row) => [row.month, row.median ?? '–', row.weighted ?? '–', row.trend ?? '–']),
    },
  };
}

/** Quantiles by size class: the 10th–90th percentile as a line, 25th–75th as a bar, the median as a tick. */
export function sizeClassQuantileChart(model: BulletinModel, parameter: QualityParameterSummary): ChartDefinition {
  const values = parameter.bySizeClass
    .filter((row) => row.bodies > 0)
    .map((row) => ({
      sizeClass: row.label,
      bodies: row.bodies,
      p10: round(row.p10),
      p25: round(row.p25),
      p50: round(row.p50),
      p75: round(row.p75),
      p90: round(row.p90),
    }));
  const y = { field: 'sizeClass', type: 'nominal', title: null, sort: null } as const;
  const highest = [...values].sort((a, b) => (b.p50 ?? 0) - (a.p50 ?? 0))[0];
  const t = translator(model.meta.locale);
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 460,
    height: { step: 34 },
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'rule', color: OUTLINE },
        encoding: {
          y,
          x: { field: 'p10', type: 'quantitative', title: `${nameOf(model, parameter)}, ${parameter.unit}` },
          x2: { field: 'p90' },
        },
      },
      {
        mark: { type: 'bar', color: OKABE_ITO.skyBlue, stroke: OUTLINE, strokeWidth: 1, size: 16 },
        encoding: { y, x: { field: 'p25', type: 'quantitative' }, x2: { field: 'p75' } },
      },
      { mark: { type: 'tick', color: OUTLINE, thickness: 3, size: 22 }, encoding: { y, x: { field: 'p50', type: 'quantitative' } } },
    ],
  };
  return {
    id: `${slug(parameter)}-size-classes`,
    title: t('chart.quantiles.title', { name: nameOf(model, parameter), month: model.meta.monthName }),
    description: `${t('chart.quantiles.desc')}${highest ? ` ${t('chart.quantiles.highest', { sizeClass: highest.sizeClass, value: highest.p50 ?? '–', unit: parameter.unit })}` : ''}`,
    spec,
    table: {
      caption: t('chart.quantiles.caption', { name: nameOf(model, parameter) }),
      columns: [t('view.sizeClass'), t('ui.bodies'), t('view.p10'), t('view.p25'), t('view.p50'), t('view.p75'), t('view.p90')],
      rows: values.map((row) => [
        row.sizeClass,
        row.bodies,
        row.p10 ?? '–',
        row.p25 ?? '–',
        row.p50 ?? '–',
        row.p75 ?? '–',
        row.p90 ?? '–',
      ]),
    },
  };
}

export function trophicChart(model: BulletinModel): ChartDefinition | null {
  const trophic = model.quality?.trophic;
  if (!trophic) return null;
  const t = translator(model.meta.locale);
  const values = trophic.counts.map((row) => ({ trophicClass: t(`trophic.${row.trophicClass}`), bodies: row.bodies }));
  const most = [...values].sort((a, b) => b.bodies - a.bodies)[0];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 460,
    height: { step: 30 },
    padding: 12,
    data: { values },
    layer: [
      {
        mark: { type: 'bar', color: OKABE_ITO.bluishGreen },
        encoding: {
          y: { field: 'trophicClass', type: 'nominal', title: null, sort: null },
          x: { field: 'bodies', type: 'quantitative', title: t('ui.bodies') },
        },
      },
      {
        mark: { type: 'text', align: 'left', dx: 4, color: OUTLINE },
        encoding: {
          y: { field: 'trophicClass', type: 'nominal', sort: null },
          x: { field: 'bodies', type: 'quantitative' },
          text: { field: 'bodies' },
        },
      },
    ],
  };
  return {
    id: 'trophic-classes',
    title: t('chart.trophic.title', { year: trophic.year }),
    description: `${t('chart.trophic.desc')}${most ? ` ${t('chart.trophic.most', { bodies: most.bodies, trophicClass: most.trophicClass })}` : ''}`,
    spec,
    table: {
      caption: t('chart.trophic.caption'),
      columns: [t('view.trophic.class'), t('ui.bodies')],
      rows: values.map((row) => [row.trophicClass, row.bodies]),
    },
  };
}

export function validationChart(model: BulletinModel, index: number): ChartDefinition | null {
  const entry = model.validation[index];
  if (!entry || entry.pairs.length === 0) return null;
  const t = translator(model.meta.locale);
  const name = nameOf(model, entry);
  const unit = entry.unit;
  const values = entry.pairs.map((pair) => ({
    field: round(pair.field),
    satellite: round(pair.satellite),
    body: pair.bodyId,
    date: pair.date,
  }));
  const top = Math.max(...values.map((row) => Math.max(row.field ?? 0, row.satellite ?? 0)));
  const a = entry.agreement;
  const locale = model.meta.locale;
  const figure = (value: number | null) => (value === null ? '–' : formatNumber(locale, value, 2));
  const stats = t('chart.validation.stats', {
    n: a.n ?? 0,
    bias: figure(a.bias),
    rmse: figure(a.rootMeanSquareError),
    r2: figure(a.rSquared),
    unit,
  });
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 320,
    height: 320,
    padding: 12,
    layer: [
      {
        data: { values: [{ v: 0 }, { v: round(top * 1.05) }] },
        mark: { type: 'line', color: GREY, strokeDash: [4, 3] },
        encoding: { x: { field: 'v', type: 'quantitative' }, y: { field: 'v', type: 'quantitative' } },
      },
      {
        data: { values },
        mark: { type: 'point', filled: false, color: OKABE_ITO.blue, size: 30, strokeWidth: 1.2 },
        encoding: {
          x: { field: 'field', type: 'quantitative', title: t('chart.validation.field', { unit }) },
          y: { field: 'satellite', type: 'quantitative', title: t('chart.validation.satellite', { unit }) },
        },
      },
    ],
  };
  return {
    id: `validation-${entry.parameter === 'chlorophyll_a' ? 'chlorophyll' : 'turbidity'}`,
    title: t('chart.validation.title', { name }),
    description: t('chart.validation.desc', { stats }),
    spec,
    table: {
      caption: t('chart.validation.caption', { name }),
      columns: [t('ui.body'), t('chart.date'), t('chart.validation.field', { unit }), t('chart.validation.satellite', { unit })],
      rows: values.map((row) => [row.body, row.date, row.field ?? '–', row.satellite ?? '–']),
    },
  };
}
