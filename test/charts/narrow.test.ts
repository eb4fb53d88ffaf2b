/** narrowSpec (src/charts/narrow.ts): the phone drawing changes layout only, never the data. */
import { describe, expect, it } from 'vitest';
import type { TopLevelSpec } from 'vega-lite';
import { NARROW_BAR_WIDTH, NARROW_FONT, NARROW_MAP_WIDTH, NARROW_MIN_HEIGHT, NARROW_WIDTH, narrowSpec } from '../../src/charts/narrow.ts';

const values = [
  { name: 'a', value: 1 },
  { name: 'b', value: 2 },
];

describe('narrowSpec', () => {
  it('narrows the plot, puts every legend below it, enlarges the type and keeps the data as it is', () => {
    const spec = {
      width: 640,
      height: 300,
      data: { values },
      layer: [
        { mark: 'line', encoding: { color: { field: 'name', type: 'nominal', legend: { orient: 'right' } } } },
        { mark: { type: 'text', fontSize: 10 }, encoding: { text: { field: 'value' } } },
      ],
      config: { axis: { labelColor: '#333333' } },
    } as unknown as TopLevelSpec;
    const narrow = narrowSpec(spec) as unknown as {
      width: number;
      height: number;
      data: unknown;
      layer: Array<{ encoding: { color: { legend: { orient: string } } } }>;
      config: { axis: object; legend: { orient: string } };
    };
    expect(narrow.width).toBe(NARROW_WIDTH);
    // Tall enough for a vertical axis title at the narrow type size.
    expect(narrow.height).toBe(NARROW_MIN_HEIGHT);
    expect(narrow.data).toEqual({ values });
    // The value labels drawn on the plot are left out (they are in the data table); the line stays.
    expect(narrow.layer).toHaveLength(1);
    expect(narrow.layer[0]?.encoding.color.legend.orient).toBe('bottom');
    expect(narrow.config.axis).toMatchObject({ labelColor: '#333333', labelFontSize: NARROW_FONT, titleFontSize: NARROW_FONT });
    expect(narrow.config.legend.orient).toBe('bottom');
    // The wide spec is not changed.
    expect((spec as unknown as { width: number }).width).toBe(640);
  });

  it('keeps a map in shape and gives bars along a nominal axis a narrower plot', () => {
    const map = narrowSpec({
      width: 520,
      height: 420,
      projection: { type: 'equirectangular' },
      layer: [],
    } as unknown as TopLevelSpec) as unknown as {
      width: number;
      height: number;
    };
    expect(map.width).toBe(NARROW_MAP_WIDTH);
    expect(map.height).toBe(Math.round((NARROW_MAP_WIDTH * 420) / 520));
    const bars = narrowSpec({ width: 460, height: { step: 30 }, data: { values }, mark: 'bar' } as unknown as TopLevelSpec) as unknown as {
      width: number;
    };
    expect(bars.width).toBe(NARROW_BAR_WIDTH);
    // A chart already narrow keeps its width.
    expect((narrowSpec({ width: 120, mark: 'line' } as unknown as TopLevelSpec) as unknown as { width: number }).width).toBe(120);
  });
});
