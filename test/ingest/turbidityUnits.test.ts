/**
 * Turbidity in NTU or FNU (src/ingest/tableTypes.ts QUALITY_UNITS): the unit is kept and labelled,
 * one table holds one unit, and field samples are compared only with satellite values in the same
 * unit. NTU (white light, US EPA Method 180.1) and FNU (infrared light, ISO 7027) are measured
 * differently and are not interchangeable (ISO 7027-1:2016, introduction; from memory).
 */
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel } from '../../src/wording/index.ts';
import { views } from '../../src/render/views.ts';
import { miniFiles, writeMini } from '../support/miniBulletin.ts';

const base = miniFiles();
const inNtu = base['quality.csv'].replace(/,turbidity,FNU,/g, ',turbidity,NTU,');

describe('turbidity units', () => {
  it('a quality table in NTU is read (by the general reader), and the model, tables and page label turbidity in NTU', async () => {
    const { inputs, problems } = await loadBulletin(
      writeMini({ 'quality.csv': inNtu, 'field.csv': base['field.csv'].replace(',turbidity,3.1,FNU', ',turbidity,3.1,NTU') }),
    );
    expect(problems.items).toEqual([]);
    expect(inputs?.quality?.turbidityUnit).toBe('NTU');
    const model = buildModel(inputs!, [], 'test');
    expect(model.quality?.parameters.find((parameter) => parameter.parameter === 'turbidity')?.unit).toBe('NTU');
    expect(model.validation.find((entry) => entry.parameter === 'turbidity')?.unit).toBe('NTU');
    const view = views(model);
    expect(view.quality?.turbidityUnitNote).toContain('Turbidity is given in NTU');
    expect(view.quality?.turbidityUnitNote).toContain('not interchangeable');
  });

  it('the fast reader and the general one agree that a table in FNU is in FNU', async () => {
    const { inputs } = await loadBulletin(writeMini());
    expect(inputs?.quality?.turbidityUnit).toBe('FNU');
    const model = buildModel(inputs!, [], 'test');
    expect(model.quality?.parameters.find((parameter) => parameter.parameter === 'turbidity')?.unit).toBe('FNU');
  });

  it('a table that mixes NTU and FNU is refused at the first row in the other unit, naming the unit it started with', async () => {
    const lines = base['quality.csv'].split('\n');
    // Line 1 is the header; the first turbidity row is line 3 (FNU), and line 5 is turbidity too.
    lines[4] = (lines[4] as string).replace(',turbidity,FNU,', ',turbidity,NTU,');
    const { inputs, problems } = await loadBulletin(writeMini({ 'quality.csv': lines.join('\n') }));
    expect(inputs).toBeNull();
    const mixed = problems.errors.filter((problem) => problem.code === 'unit-mixed');
    expect(mixed.map((problem) => [problem.file, problem.line, problem.column, problem.value])).toEqual([
      ['quality.csv', 5, 'unit', 'NTU'],
    ]);
    expect(mixed[0]?.expected).toBe('FNU, the turbidity unit of this table since line 3');
  });

  it("field turbidity in another unit than the satellite's is left out of the comparison, with one warning", async () => {
    const { inputs, problems } = await loadBulletin(writeMini({ 'quality.csv': inNtu }));
    expect(problems.warnings.map((problem) => [problem.code, problem.file, problem.line, problem.value])).toEqual([
      ['turbidity-units-differ', 'field.csv', 3, 'FNU'],
    ]);
    const model = buildModel(inputs!, problems.warnings, 'test');
    expect(model.validation.find((entry) => entry.parameter === 'turbidity')).toBeUndefined();
    // Chlorophyll-a is compared as before.
    expect(model.validation.find((entry) => entry.parameter === 'chlorophyll_a')?.pairs).toHaveLength(1);
  });
});
