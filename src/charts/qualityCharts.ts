/** Chart definitions for water quality and its field checks, built from the model alone. */
import type { TopLevelSpec } from 'vega-lite';
import type { BulletinModel } from '../model/index.ts';
import type { QualityParameterSummary } from '../model/quality.ts';
import { formatNumber } from '../text/format.ts';
import { GREY, OKABE_ITO, OUTLINE, YELLOW_GREEN_BLUE_5 } from './palettes.ts';
import { monthLabel } from '../ingest/index.ts';
import { roundOrNull, VEGA_LITE_SCHEMA, type ChartDefinition } from './render.ts';

const round = (value: number | null | undefined, digits = 2) => roundOrNull(value, digits);
const nameOf = (parameter: QualityParameterSummary) => (parameter.parameter === 'chlorophyll_a' ? 'Chlorophyll-a' : 'Turbidity');
const slug = (parameter: QualityParameterSummary) => (parameter.parameter === 'chlorophyll_a' ? 'chlorophyll' : 'turbidity');

/** Binned strip: months across, value bins up, the number of water bodies in each bin as colour and as text. */
export function distributionChart(model: BulletinModel, parameter: QualityParameterSummary): ChartDefinition {
  const edges = parameter.distribution.edges;
  const label = (k: number) => `${formatNumber(model.meta.locale, edges[k] as number, edges[k] as number < 1 ? 2 : 0)}–${formatNumber(model.meta.locale, edges[k + 1] as number, (edges[k + 1] as number) < 1 ? 2 : 0)}`;
  const values = parameter.distribution.months.flatMap((row) => row.counts.map((count, k) => ({ month: monthLabel(row.month), bin: label(k), order: k, bodies: count }))).filter((row) => row.bodies > 0);
  const bins = [...new Set(values.sort((a, b) => a.order - b.order).map((row) => row.bin))];
  const busiest = [...values].sort((a, b) => b.bodies - a.bodies)[0];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: { step: 18 },
    padding: 12,
    data: { values },
    layer: [
      { mark: { type: 'rect', stroke: '#ffffff', strokeWidth: 0.5 }, encoding: { x: { field: 'month', type: 'ordinal', title: null, axis: { labelAngle: -90 } }, y: { field: 'bin', type: 'ordinal', sort: [...bins].reverse(), title: `${nameOf(parameter)}, ${parameter.unit}` }, color: { field: 'bodies', type: 'quantitative', title: 'Water bodies', scale: { range: [YELLOW_GREEN_BLUE_5[0], YELLOW_GREEN_BLUE_5[4]] } } } },
      { mark: { type: 'text', fontSize: 9 }, encoding: { x: { field: 'month', type: 'ordinal' }, y: { field: 'bin', type: 'ordinal', sort: [...bins].reverse() }, text: { field: 'bodies' }, color: { condition: { test: 'datum.bodies > 6', value: '#ffffff' }, value: '#000000' } } },
    ],
  };
  return {
    id: `${slug(parameter)}-distribution`,
    title: `${nameOf(parameter)} across water bodies, month by month`,
    description: `Binned strip of the water bodies' monthly medians${parameter.parameter === 'chlorophyll_a' ? ' on a log scale (four bins a decade)' : ''}; each cell gives the number of bodies in the bin.${busiest ? ` The fullest cell is ${busiest.bin} ${parameter.unit} in ${busiest.month} with ${busiest.bodies} bodies.` : ''}`,
    spec,
    table: { caption: `${nameOf(parameter)}: water bodies per bin and month`, columns: ['Month', 'Bin', 'Water bodies'], rows: values.map((row) => [row.month, row.bin, row.bodies]) },
  };
}

/** Region medians by month with Sen's trend line. */
export function medianTrendChart(model: BulletinModel, parameter: QualityParameterSummary): ChartDefinition {
  const trend = parameter.medianTrend;
  const values = parameter.monthly.map((row) => ({ month: monthLabel(row.month), median: round(row.median), weighted: round(row.weightedMedian), trend: trend ? round(trend.intercept + (trend.slopePerYear * row.month) / 12) : null }));
  const x = { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%Y', tickCount: 'year' } } as const;
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 640,
    height: 200,
    padding: 12,
    data: { values },
    layer: [
      { mark: { type: 'line', color: OKABE_ITO.bluishGreen, strokeWidth: 1.5 }, encoding: { x, y: { field: 'median', type: 'quantitative', title: `${nameOf(parameter)}, ${parameter.unit}` } } },
      { mark: { type: 'line', color: OKABE_ITO.vermillion, strokeWidth: 2, strokeDash: [6, 3] }, encoding: { x, y: { field: 'trend', type: 'quantitative' } } },
    ],
  };
  const locale = model.meta.locale;
  return {
    id: `${slug(parameter)}-medians`,
    title: `${nameOf(parameter)}: region median by month with its trend`,
    description: `Line chart of the median of the water bodies' ${nameOf(parameter).toLowerCase()} each month (each body counted once), with Sen's trend line dashed.${trend ? ` The line changes by ${formatNumber(locale, trend.slopePerYear, 2)} ${parameter.unit} a year.` : ''}`,
    spec,
    table: { caption: `${nameOf(parameter)}: region medians`, columns: ['Month', `Median, ${parameter.unit}`, `Area-weighted median, ${parameter.unit}`, `Trend line, ${parameter.unit}`], rows: values.map((row) => [row.month, row.median ?? '–', row.weighted ?? '–', row.trend ?? '–']) },
  };
}

/** Quantiles by size class: the 10th–90th percentile as a line, 25th–75th as a bar, the median as a tick. */
export function sizeClassQuantileChart(model: BulletinModel, parameter: QualityParameterSummary): ChartDefinition {
  const values = parameter.bySizeClass.filter((row) => row.bodies > 0).map((row) => ({ sizeClass: row.label, bodies: row.bodies, p10: round(row.p10), p25: round(row.p25), p50: round(row.p50), p75: round(row.p75), p90: round(row.p90) }));
  const y = { field: 'sizeClass', type: 'nominal', title: null, sort: null } as const;
  const highest = [...values].sort((a, b) => (b.p50 ?? 0) - (a.p50 ?? 0))[0];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 460,
    height: { step: 34 },
    padding: 12,
    data: { values },
    layer: [
      { mark: { type: 'rule', color: OUTLINE }, encoding: { y, x: { field: 'p10', type: 'quantitative', title: `${nameOf(parameter)}, ${parameter.unit}` }, x2: { field: 'p90' } } },
      { mark: { type: 'bar', color: OKABE_ITO.skyBlue, stroke: OUTLINE, strokeWidth: 1, size: 16 }, encoding: { y, x: { field: 'p25', type: 'quantitative' }, x2: { field: 'p75' } } },
      { mark: { type: 'tick', color: OUTLINE, thickness: 3, size: 22 }, encoding: { y, x: { field: 'p50', type: 'quantitative' } } },
    ],
  };
  return {
    id: `${slug(parameter)}-size-classes`,
    title: `${nameOf(parameter)} by size class, ${model.meta.monthName}`,
    description: `For each size class, the line spans the 10th to 90th percentile of the water bodies' medians, the bar the 25th to 75th, and the tick marks the median.${highest ? ` The highest median is in bodies of ${highest.sizeClass}: ${highest.p50} ${parameter.unit}.` : ''}`,
    spec,
    table: { caption: `${nameOf(parameter)} percentiles by size class`, columns: ['Size class', 'Water bodies', '10th', '25th', '50th', '75th', '90th'], rows: values.map((row) => [row.sizeClass, row.bodies, row.p10 ?? '–', row.p25 ?? '–', row.p50 ?? '–', row.p75 ?? '–', row.p90 ?? '–']) },
  };
}

export function trophicChart(model: BulletinModel): ChartDefinition | null {
  const trophic = model.quality?.trophic;
  if (!trophic) return null;
  const values = trophic.counts.map((row) => ({ trophicClass: row.trophicClass, bodies: row.bodies }));
  const most = [...values].sort((a, b) => b.bodies - a.bodies)[0];
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 460,
    height: { step: 30 },
    padding: 12,
    data: { values },
    layer: [
      { mark: { type: 'bar', color: OKABE_ITO.bluishGreen }, encoding: { y: { field: 'trophicClass', type: 'nominal', title: null, sort: null }, x: { field: 'bodies', type: 'quantitative', title: 'Water bodies' } } },
      { mark: { type: 'text', align: 'left', dx: 4, color: OUTLINE }, encoding: { y: { field: 'trophicClass', type: 'nominal', sort: null }, x: { field: 'bodies', type: 'quantitative' }, text: { field: 'bodies' } } },
    ],
  };
  return {
    id: 'trophic-classes',
    title: `Trophic classes from chlorophyll-a, ${model.meta.monthName}`,
    description: `Bar chart of water bodies per OECD (1982) trophic class of their chlorophyll-a estimate this month.${most ? ` Most bodies (${most.bodies}) are ${most.trophicClass}.` : ''}`,
    spec,
    table: { caption: 'Water bodies per trophic class', columns: ['Class', 'Water bodies'], rows: values.map((row) => [row.trophicClass, row.bodies]) },
  };
}

export function validationChart(model: BulletinModel, index: number): ChartDefinition | null {
  const entry = model.validation[index];
  if (!entry || entry.pairs.length === 0) return null;
  const name = entry.parameter === 'chlorophyll_a' ? 'Chlorophyll-a' : 'Turbidity';
  const unit = entry.parameter === 'chlorophyll_a' ? 'µg/L' : 'FNU';
  const values = entry.pairs.map((pair) => ({ field: round(pair.field), satellite: round(pair.satellite), body: pair.bodyId, date: pair.date }));
  const top = Math.max(...values.map((row) => Math.max(row.field ?? 0, row.satellite ?? 0)));
  const a = entry.agreement;
  const locale = model.meta.locale;
  const stats = `n = ${a.n}, bias ${formatNumber(locale, a.bias, 2)} ${unit}, RMSE ${formatNumber(locale, a.rootMeanSquareError, 2)} ${unit}, R² ${formatNumber(locale, a.rSquared, 2)}`;
  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    width: 320,
    height: 320,
    padding: 12,
    layer: [
      { data: { values: [{ v: 0 }, { v: round(top * 1.05) }] }, mark: { type: 'line', color: GREY, strokeDash: [4, 3] }, encoding: { x: { field: 'v', type: 'quantitative' }, y: { field: 'v', type: 'quantitative' } } },
      { data: { values }, mark: { type: 'point', filled: false, color: OKABE_ITO.blue, size: 30, strokeWidth: 1.2 }, encoding: { x: { field: 'field', type: 'quantitative', title: `Field, ${unit}` }, y: { field: 'satellite', type: 'quantitative', title: `Satellite, ${unit}` } } },
    ],
  };
  return {
    id: `validation-${entry.parameter === 'chlorophyll_a' ? 'chlorophyll' : 'turbidity'}`,
    title: `${name}: satellite against field measurements`,
    description: `Scatter of satellite estimates against field samples, with the 1:1 line dashed. ${stats}.`,
    spec,
    table: { caption: `${name}: matched pairs`, columns: ['Water body', 'Date', `Field, ${unit}`, `Satellite, ${unit}`], rows: values.map((row) => [row.body, row.date, row.field ?? '–', row.satellite ?? '–']) },
  };
}
