/** Stage 3, charts: chart definitions from the model, rendered to accessible SVG and PNG. */
import type { BulletinModel } from '../wording/index.ts';
import { cardSvg } from './card.ts';
import { briefingPdf } from './briefing.ts';
import { siteUrl } from '../common/paths.ts';
import { bodiesMapChart, gridMapChart, subRegionMapChart } from './maps.ts';
import { distributionChart, medianTrendChart, sizeClassQuantileChart, trophicChart, validationChart } from './qualityCharts.ts';
import { renderChart, svgToPng, type ChartDefinition, type RenderedChart } from './render.ts';
import {
  anomalyBarsChart,
  rainfallChart,
  recentMonthsChart,
  regionalSeriesChart,
  sameMonthChart,
  sizeClassChart,
  sparklineChart,
  subRegionChart,
} from './surfaceWaterCharts.ts';

export type { RenderedChart, DataTable } from './render.ts';

export interface ChartSet {
  /** Charts by id, each with SVG, PNG, data CSV and spec. */
  charts: Record<string, RenderedChart>;
  /** Sparkline SVG per monitored body id (no PNG or downloads: the table row carries the figures). */
  sparklines: Record<string, string>;
  card: { svg: string; png: Buffer };
  /** The issue's one-page briefing (briefing.ts). */
  briefing: Buffer;
}

export function chartDefinitions(model: BulletinModel): ChartDefinition[] {
  const quality = model.quality?.parameters ?? [];
  return [
    regionalSeriesChart(model),
    recentMonthsChart(model),
    sameMonthChart(model),
    anomalyBarsChart(model),
    subRegionChart(model),
    sizeClassChart(model),
    rainfallChart(model),
    gridMapChart(model),
    subRegionMapChart(model),
    bodiesMapChart(model),
    ...quality.flatMap((parameter) => [
      distributionChart(model, parameter),
      medianTrendChart(model, parameter),
      sizeClassQuantileChart(model, parameter),
    ]),
    trophicChart(model),
    ...model.validation.map((_, k) => validationChart(model, k)),
  ].filter((chart): chart is ChartDefinition => chart !== null);
}

/** Charts of an issue: its chart definitions and a sparkline per monitored body. */
export function chartCount(model: BulletinModel): number {
  return chartDefinitions(model).length + model.monitored.length;
}

/** `onChart` is told of each chart done, for progress on the terminal. */
export async function buildCharts(model: BulletinModel, onChart?: (id: string) => void): Promise<ChartSet> {
  const charts: Record<string, RenderedChart> = {};
  for (const definition of chartDefinitions(model)) {
    charts[definition.id] = await renderChart(definition, { png: true, narrow: true, locale: model.meta.locale });
    onChart?.(definition.id);
  }
  const sparklines: Record<string, string> = {};
  for (const body of model.monitored) {
    sparklines[body.id] = (
      await renderChart(sparklineChart(model, body.body, body.filling, body.firstMonth), { png: false, locale: model.meta.locale })
    ).svg;
    onChart?.(`sparkline of ${body.id}`);
  }
  const svg = cardSvg(model);
  const pageUrl = siteUrl(model.meta.baseUrl, model.meta.issuePath);
  return { charts, sparklines, card: { svg, png: await svgToPng(svg) }, briefing: await briefingPdf(model, charts, pageUrl) };
}
