/**
 * Every chart of the example bulletin: its Vega-Lite spec (the design as a snapshot, with the
 * data left out: the example's numbers are invented and never a check value; and the whole spec,
 * data included, valid against the Vega-Lite JSON schema shipped with vega-lite, checked by ajv),
 * its accessible SVG, and byte-identical output when rendered twice.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { Ajv } from 'ajv';
import { beforeAll, describe, expect, it } from 'vitest';
import { chartDefinitions } from '../../src/charts/index.ts';
import { renderChart, type ChartDefinition } from '../../src/charts/render.ts';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel, type BulletinModel } from '../../src/wording/index.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

// The schema file is not in vega-lite's exports map: find it beside the package's entry point.
const vegaLiteRoot = join(createRequire(import.meta.url).resolve('vega-lite'), '..', '..');
const schema = JSON.parse(readFileSync(join(vegaLiteRoot, 'build', 'vega-lite-schema.json'), 'utf8'));
const validate = new Ajv({ strict: false, allErrors: true, validateFormats: false }).compile(schema);

let model: BulletinModel;
let definitions: ChartDefinition[];

beforeAll(async () => {
  const { inputs, problems } = await loadBulletin(EXAMPLE);
  if (!inputs) throw new Error('the example does not load');
  model = buildModel(inputs, problems.warnings, '0.0.0-test');
  definitions = chartDefinitions(model);
});

const EXPECTED = [
  'regional-series',
  'recent-months',
  'same-month',
  'anomaly-bars',
  'sub-regions',
  'size-classes',
  'rainfall',
  'grid-map',
  'sub-region-map',
  'bodies-map',
  'chlorophyll-distribution',
  'chlorophyll-medians',
  'chlorophyll-size-classes',
  'turbidity-distribution',
  'turbidity-medians',
  'turbidity-size-classes',
  'trophic-classes',
  'validation-chlorophyll',
  'validation-turbidity',
];

/**
 * The spec's design without its data: every inline `values` array becomes a note of its length and
 * fields, so a snapshot shows marks, encodings, scales and words, and no invented figure.
 */
export function designOf(spec: unknown): unknown {
  if (Array.isArray(spec)) return spec.map(designOf);
  if (!spec || typeof spec !== 'object') return spec;
  return Object.fromEntries(
    Object.entries(spec).map(([key, value]) => {
      if (key !== 'values' || !Array.isArray(value)) return [key, designOf(value)];
      const fields = [...new Set(value.flatMap((row) => (row && typeof row === 'object' ? Object.keys(row) : [])))].sort();
      return [key, `${value.length} row(s)${fields.length ? ` of ${fields.join(', ')}` : ''}`];
    }),
  );
}

describe('charts of the example bulletin', () => {
  it('chartDefinitions(model) gives every chart type once', () => {
    expect(definitions.map((chart) => chart.id)).toEqual(EXPECTED);
  });

  for (const id of EXPECTED) {
    it(`${id}: spec matches its snapshot and the Vega-Lite schema; SVG is accessible and stable`, async () => {
      const definition = definitions.find((chart) => chart.id === id) as ChartDefinition;
      await expect(`${JSON.stringify(designOf(definition.spec), null, 2)}\n`).toMatchFileSnapshot(
        join(import.meta.dirname, 'specs', `${id}.vl.json`),
      );
      const valid = validate(definition.spec);
      expect(validate.errors ?? [], JSON.stringify(validate.errors?.slice(0, 3))).toEqual([]);
      expect(valid).toBe(true);
      const first = await renderChart(definition);
      const second = await renderChart(definition);
      expect(second.svg).toBe(first.svg);
      expect(first.svg).toMatch(/^<svg[^>]* role="img" aria-labelledby="[^"]+-title" aria-describedby="[^"]+-desc"/);
      expect(first.svg).toContain(`<title id="${id}-title">`);
      expect(first.svg).toContain(`<desc id="${id}-desc">`);
      expect(definition.description.length).toBeGreaterThan(40);
      expect(definition.table.rows.length).toBeGreaterThan(0);
    });
  }

  it('designOf keeps the design and replaces the data by its shape', () => {
    expect(designOf({ data: { values: [{ a: 1, b: 2 }, { a: 3 }] }, mark: 'bar', layer: [{ data: { values: [] } }] })).toEqual({
      data: { values: '2 row(s) of a, b' },
      mark: 'bar',
      layer: [{ data: { values: '0 row(s)' } }],
    });
  });

  it('the schema check refuses a spec with an unknown mark', () => {
    expect(validate({ data: { values: [] }, mark: 'blob', encoding: {} })).toBe(false);
  });

  it('the descriptions state the main point from the data', () => {
    const description = (id: string) => definitions.find((chart) => chart.id === id)?.description ?? '';
    // The point is the model's own: its first key message, and the sub-region furthest below usual with its figure.
    expect(description('regional-series')).toContain(model.keyMessages[0]?.text);
    const stated = model.surfaceWater.subRegions.flatMap((group) =>
      group.status.kind === 'stated' ? [{ name: group.name, percent: group.status.percentOfBaseline }] : [],
    );
    const lowest = stated.sort((a, b) => a.percent - b.percent)[0] as { name: string; percent: number };
    expect(description('sub-regions')).toContain(`${lowest.name} is lowest at ${Math.round(lowest.percent)}%`);
    expect(description('validation-chlorophyll')).toMatch(/n = \d+, bias/);
  });
});
