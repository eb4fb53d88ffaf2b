/** Stage 3, charts: chart definitions from the model, rendered to accessible SVG. */
import type { BulletinModel } from '../model/index.ts';
import { renderChart, type RenderedChart } from './render.ts';
import { regionalSeriesChart, sameMonthChart } from './surfaceWaterCharts.ts';

export type { RenderedChart, DataTable } from './render.ts';

export async function buildCharts(model: BulletinModel): Promise<Record<string, RenderedChart>> {
  const charts: Record<string, RenderedChart> = {};
  for (const definition of [regionalSeriesChart(model), sameMonthChart(model)]) {
    charts[definition.id] = await renderChart(definition);
  }
  return charts;
}
