import { describe, expect, it } from 'vitest';
import type { TopLevelSpec } from 'vega-lite';
import { withChartLocale } from '../../src/charts/locales.ts';
import { renderChart, VEGA_LITE_SCHEMA } from '../../src/charts/render.ts';

const spec = {
  $schema: VEGA_LITE_SCHEMA,
  width: 200,
  height: 100,
  data: {
    values: [
      { month: '2026-01', value: 1234.5 },
      { month: '2026-06', value: 0.25 },
    ],
  },
  mark: 'line',
  encoding: {
    x: { field: 'month', type: 'temporal', timeUnit: 'yearmonth', title: null, axis: { format: '%b %Y' } },
    y: { field: 'value', type: 'quantitative', title: null },
  },
} as TopLevelSpec;
const labels = async (locale: string) => {
  const chart = await renderChart({
    id: 'probe',
    title: 'probe',
    description: 'probe',
    spec: withChartLocale(spec, locale),
    table: { caption: 'probe', columns: [], rows: [] },
  });
  return [...chart.svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((match) => match[1]);
};

describe('withChartLocale', () => {
  it('withChartLocale(spec, "en") leaves the spec as it is', () => {
    expect(withChartLocale(spec, 'en')).toBe(spec);
  });

  it('withChartLocale(spec, "fr") gives French month names and a space between thousands on the axes', async () => {
    const french = await labels('fr');
    expect(french).toEqual(expect.arrayContaining(['janv. 2026', 'juin 2026', '1\u00a0000']));
    const english = await labels('en');
    expect(english).toEqual(expect.arrayContaining(['Jan 2026', 'Jun 2026', '1,000']));
  });
});
