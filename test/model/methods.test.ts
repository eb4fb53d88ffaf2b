import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel } from '../../src/wording/index.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

describe('methods', () => {
  it('every method a model section names is written out in METHODS', async () => {
    const { inputs, problems } = await loadBulletin(EXAMPLE);
    if (!inputs) throw new Error('example does not load');
    const model = buildModel(inputs, problems.warnings, 'test');
    const named = [
      ...model.surfaceWater.methods,
      model.grid.method,
      ...(model.quality?.methods ?? []),
      ...model.trends.methods,
      ...model.keyMessages.map((message) => message.figure.method),
      'validation',
    ];
    for (const id of named) expect(Object.keys(model.methods), id).toContain(id);
  });
});

describe('methodTexts', () => {
  it('every method has a name and a written method in every language', async () => {
    const { METHOD_IDS, methodTexts } = await import('../../src/model/methods.ts');
    const { loadMessages } = await import('../../src/text/index.ts');
    for (const locale of ['en', 'fr']) {
      const texts = methodTexts(locale);
      for (const id of METHOD_IDS) {
        expect(texts[id].length, `${locale} ${id}`).toBeGreaterThan(40);
        expect(loadMessages(locale)[`methodName.${id}`], `${locale} ${id}`).toBeTruthy();
      }
    }
    expect(methodTexts('fr').trophic).toContain('TSI = 10 (6 − (2,04 − 0,68 ln Chl) / ln 2)');
  });
});
