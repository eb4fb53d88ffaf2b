import { describe, expect, it } from 'vitest';
import { renderChart, toCsv, type ChartDefinition } from '../../src/charts/render.ts';

const chart = (id: string): ChartDefinition => ({
  id,
  title: 'Bars <of> "water"',
  description: 'Two bars & a point',
  spec: {
    data: {
      values: [
        { a: 'x', b: 1 },
        { a: 'y', b: 2 },
      ],
    },
    mark: { type: 'bar', clip: true },
    encoding: { x: { field: 'a', type: 'nominal' }, y: { field: 'b', type: 'quantitative' } },
  },
  table: {
    caption: 'c',
    columns: ['a', 'b'],
    rows: [
      ['x', 1],
      ['y, "z"', 2],
    ],
  },
});

describe('renderChart', () => {
  it('renderChart(chart) gives the root svg a role, an escaped title and desc, and no inner roles', async () => {
    const { svg } = await renderChart(chart('one'));
    expect(svg).toMatch(/^<svg[^>]* role="img" aria-labelledby="one-title" aria-describedby="one-desc"/);
    expect(svg).toContain(
      '<title id="one-title">Bars &lt;of&gt; &quot;water&quot;</title><desc id="one-desc">Two bars &amp; a point</desc>',
    );
    expect(svg.match(/role="/g)).toHaveLength(1);
  });

  it('renderChart(chart) prefixes every id with the chart id and is byte-identical when repeated', async () => {
    const first = await renderChart(chart('one'));
    await renderChart(chart('other'));
    const again = await renderChart(chart('one'));
    expect(again.svg).toBe(first.svg);
    const ids = [...first.svg.matchAll(/\bid="([^"]+)"/g)].map((match) => match[1]);
    expect(ids.length).toBeGreaterThan(2);
    expect(ids.every((id) => id?.startsWith('one-'))).toBe(true);
  });

  it('toCsv(table) quotes fields with commas and quotes (RFC 4180)', () => {
    expect(toCsv(chart('x').table)).toBe('a,b\r\nx,1\r\n"y, ""z""",2\r\n');
  });
});
