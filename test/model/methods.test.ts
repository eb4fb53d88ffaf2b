import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel } from '../../src/model/index.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

describe('methods', () => {
  it('every method a model section names is written out in METHODS', async () => {
    const { inputs, problems } = await loadBulletin(EXAMPLE);
    if (!inputs) throw new Error('example does not load');
    const model = buildModel(inputs, problems.warnings, 'test');
    const named = [...model.surfaceWater.methods, model.grid.method, ...(model.quality?.methods ?? []), ...model.trends.methods, ...model.keyMessages.map((message) => message.figure.method), 'validation'];
    for (const id of named) expect(Object.keys(model.methods), id).toContain(id);
  }, 60_000);
});
