/**
 * Server-side chart rendering: Vega-Lite spec → Vega → headless SVG string, made accessible and
 * safe to inline many times on one page.
 */
import { csvField } from '../text/csv.ts';
import sharp from 'sharp';
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';

import { escapeXml } from '../text/escape.ts';
import { withChartLocale } from './locales.ts';
import { narrowSpec } from './narrow.ts';
import { CHART_FONT } from './palettes.ts';

export const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/** A figure rounded for a chart's data and table, or null when there is none. */
export const roundOrNull = (value: number | null | undefined, digits: number) =>
  value === null || value === undefined || !Number.isFinite(value) ? null : Math.round(value * 10 ** digits) / 10 ** digits;

export interface DataTable {
  caption: string;
  columns: string[];
  rows: Array<Array<string | number>>;
}

export interface ChartDefinition {
  /** Unique on the site; used for element ids and download file names. */
  id: string;
  title: string;
  /** One or two sentences: what the chart shows and its main point. */
  description: string;
  spec: TopLevelSpec;
  table: DataTable;
}

export interface RenderedChart {
  id: string;
  title: string;
  description: string;
  svg: string;
  specJson: string;
  csv: string;
  /** PNG copy for print and slides, at twice the SVG's size; null when not asked for. */
  png: Buffer | null;
  /** The narrow variant for phone screens (narrow.ts), its ids suffixed `-narrow`; null when not asked for. */
  narrowSvg: string | null;
  table: DataTable;
}

/**
 * PNG from SVG with sharp (libvips and the system fonts); `density` 144 doubles the 72-dpi size.
 * zlib level 6: on the example's 19 charts at 144 dpi (2-core machine, 2 December 2026) level 9
 * took 1.09–1.12 s for 1.16 MB, level 6 0.43–0.47 s for 1.28 MB, level 3 0.38 s for 1.39 MB; 6 keeps
 * most of the saving for 10 % more bytes. The output is the same bytes on every run.
 */
export async function svgToPng(svg: string, density = 72): Promise<Buffer> {
  return sharp(Buffer.from(svg), { density }).png({ compressionLevel: 6, adaptiveFiltering: false }).toBuffer();
}

/** RFC 4180 CSV through csvField (formula-like texts neutralized), CRLF line ends. */
export function toCsv(table: DataTable): string {
  return [table.columns, ...table.rows].map((row) => row.map((value) => csvField(value)).join(',')).join('\r\n') + '\r\n';
}

/** `locale` sets the axes' number and date formats (see locales.ts); English is Vega's own. */
export async function renderChart(chart: ChartDefinition, { png = false, narrow = false, locale = 'en' } = {}): Promise<RenderedChart> {
  const { svg, spec } = await drawChart(chart, chart.spec, chart.id, locale);
  return {
    id: chart.id,
    title: chart.title,
    description: chart.description,
    svg,
    png: png ? await svgToPng(svg, 144) : null,
    narrowSvg: narrow ? (await drawChart(chart, narrowSpec(chart.spec), `${chart.id}-narrow`, locale)).svg : null,
    specJson: JSON.stringify(spec, null, 2) + '\n',
    csv: toCsv(chart.table),
    table: chart.table,
  };
}

/** One drawing of a chart's spec: the SVG, its ids prefixed with `id`, and the full spec drawn. */
async function drawChart(chart: ChartDefinition, chartSpec: TopLevelSpec, id: string, locale: string) {
  const localized = withChartLocale(chartSpec, locale);
  const spec: TopLevelSpec = {
    ...localized,
    config: {
      font: CHART_FONT,
      view: { stroke: null },
      ...(localized.config ?? {}),
      // A chart's own axis and legend settings add to these rather than replace them.
      axis: {
        labelColor: '#333333',
        titleColor: '#333333',
        domainColor: '#595959',
        tickColor: '#595959',
        ...(localized.config?.axis ?? {}),
      },
      legend: { labelColor: '#333333', titleColor: '#333333', labelLimit: 400, titleLimit: 400, ...(localized.config?.legend ?? {}) },
    },
  } as TopLevelSpec;
  const compiled = compile(spec).spec;
  // Vega numbers clip paths and gradients with process-wide counters: reset them so each chart's
  // ids depend only on the chart, then prefix them so charts on one page never collide.
  vega.resetSVGDefIds();
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  const raw = await view.toSVG();
  view.finalize();
  return { svg: accessibleSvg(prefixIds(raw, id), chart, id), spec };
}

function prefixIds(svg: string, prefix: string): string {
  return svg
    .replace(/\bid="([^"]+)"/g, (_, id: string) => `id="${prefix}-${id}"`)
    .replace(/url\(#([^)]+)\)/g, (_, id: string) => `url(#${prefix}-${id})`)
    .replace(/href="#([^"]+)"/g, (_, id: string) => `href="#${prefix}-${id}"`);
}

/**
 * The chart is one image with a name and a description; its figures are in the data table below
 * it. Vega's per-mark roles and labels are removed so assistive technology meets one image, not
 * hundreds of unlabelled marks.
 */
function accessibleSvg(svg: string, chart: ChartDefinition, id = chart.id): string {
  const titleId = `${id}-title`;
  const descId = `${id}-desc`;
  const ariaAttributes = /\s(?:role|aria-roledescription|aria-label|aria-hidden)="[^"]*"/g;
  const quiet = svg.replace(/<([a-z]+)\b([^>]*)>/g, (tag, name: string, attributes: string) =>
    name === 'svg' ? tag : `<${name}${attributes.replace(ariaAttributes, '')}>`,
  );
  return quiet.replace(/^<svg\b([^>]*)>/, (_, attributes: string) => {
    // The headless renderer marks the root as a graphics document; one image with a name and a
    // description is what a screen-reader user needs here.
    const kept = attributes.replace(ariaAttributes, '');
    return `<svg${kept} role="img" aria-labelledby="${titleId}" aria-describedby="${descId}"><title id="${titleId}">${escapeXml(chart.title)}</title><desc id="${descId}">${escapeXml(chart.description)}</desc>`;
  });
}
