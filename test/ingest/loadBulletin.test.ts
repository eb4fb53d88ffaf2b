/**
 * Every kind of bad input the bulletin refuses or warns about, each on an otherwise valid folder,
 * with the file, line and column it must name.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { placeholderForeword } from '../../src/text/index.ts';
import { MINI_CONFIG, miniFiles, writeMini, type MiniFiles } from '../support/miniBulletin.ts';

/** `severity code file:line column` for each problem, sorted. */
async function problemsOf(changes: Partial<Record<keyof MiniFiles, string | Buffer>>): Promise<string[]> {
  const { problems } = await loadBulletin(writeMini(changes));
  return problems.sorted().map((p) => `${p.severity} ${p.code} ${p.file}:${p.line} ${p.column}`.trimEnd());
}

const base = miniFiles();
const replaceLine = (text: string, line: number, content: string) =>
  text
    .split('\n')
    .map((row, k) => (k === line - 1 ? content : row))
    .join('\n');
const config = (change: (c: typeof MINI_CONFIG & Record<string, unknown>) => void) => {
  const copy = structuredClone(MINI_CONFIG) as typeof MINI_CONFIG & Record<string, unknown>;
  change(copy);
  return JSON.stringify(copy, null, 2);
};

describe('loadBulletin', () => {
  it('loadBulletin(valid folder) finds no problem and reads every table', async () => {
    const { inputs, problems } = await loadBulletin(writeMini());
    expect(problems.items).toEqual([]);
    expect(inputs?.bodies).toHaveLength(2);
    expect(inputs?.area.length).toBe(60);
    expect(inputs?.quality?.length).toBe(60);
    expect(inputs?.rainfall).toHaveLength(30);
    expect(inputs?.field).toHaveLength(2);
    expect(inputs?.distribution).toHaveLength(2);
    expect(inputs?.files.map((file) => file.path)).toEqual([
      'area.csv',
      'bins.csv',
      'bodies.csv',
      'bulletin.json',
      'field.csv',
      'quality.csv',
      'rain.csv',
      'regions.geojson',
    ]);
  });

  it('reports a missing required column, and an unknown one as a warning', async () => {
    expect(await problemsOf({ 'area.csv': base['area.csv'].replace('observed_share', 'seen_share') })).toEqual([
      'error column-missing area.csv:1 observed_share',
      'warning column-unknown area.csv:1 seen_share',
    ]);
  });

  it('reports an empty file and a header without rows', async () => {
    expect(await problemsOf({ 'rain.csv': '' })).toEqual(['error file-empty rain.csv:0']);
    expect(await problemsOf({ 'rain.csv': 'subregion_id,month,rainfall_mm\n' })).toEqual(['error no-rows rain.csv:1']);
  });

  it('reports a row with the wrong number of fields', async () => {
    expect(await problemsOf({ 'area.csv': replaceLine(base['area.csv'], 4, 'A,2018-02,9.0,0.95') })).toEqual([
      'error field-count area.csv:4',
    ]);
  });

  it('reports a duplicate (id, month) naming the first line, and an id not in the inventory', async () => {
    const area = `${base['area.csv']}B,2018-01,181,0.9,2\nZ,2018-01,5,0.9,1\n`;
    const { problems } = await loadBulletin(writeMini({ 'area.csv': area }));
    const [duplicate, unknown] = problems.sorted();
    expect(duplicate).toMatchObject({
      code: 'duplicate-row',
      line: 62,
      column: 'month',
      message: 'the same water body and month already appear on line 3',
    });
    expect(unknown).toMatchObject({ code: 'unknown-body', line: 63, column: 'body_id', value: 'Z' });
  });

  it('warns about a water body in the inventory with no data', async () => {
    const bodies = `${base['bodies.csv']}C,Pond Three,R1,10.3,50.3,2,pond,no\n`;
    expect(await problemsOf({ 'bodies.csv': bodies })).toEqual(['warning body-without-data bodies.csv:4 body_id']);
  });

  it('reports negative, non-numeric, empty, NaN and Infinity values and a share outside 0–1', async () => {
    let area = base['area.csv'];
    area = replaceLine(area, 2, 'A,2018-01,-1,0.95,3');
    area = replaceLine(area, 3, 'B,2018-01,lots,0.9,2');
    area = replaceLine(area, 4, 'A,2018-02,,0.95,3');
    area = replaceLine(area, 5, 'B,2018-02,NaN,0.9,2');
    area = replaceLine(area, 6, 'A,2018-03,Infinity,1.5,3');
    expect(await problemsOf({ 'area.csv': area })).toEqual([
      'error value-out-of-range area.csv:2 water_area_ha',
      'error value-not-number area.csv:3 water_area_ha',
      'error value-empty area.csv:4 water_area_ha',
      'error value-not-number area.csv:5 water_area_ha',
      'error value-out-of-range area.csv:6 observed_share',
      'error value-not-number area.csv:6 water_area_ha',
    ]);
  });

  it('warns about an area above 1.5 × the reference area', async () => {
    expect(await problemsOf({ 'area.csv': replaceLine(base['area.csv'], 2, 'A,2018-01,16,0.95,3') })).toEqual([
      'warning area-above-reference area.csv:2 water_area_ha',
    ]);
  });

  it('names the line of the file after blank lines (they are skipped but counted)', async () => {
    // Blank lines after lines 3 and 5 of the file: the bad month written on line 6 of the table is line 8 of the file.
    const rows = base['area.csv'].split('\n');
    rows[5] = 'A,2018-13,8,0.95,3';
    const area = [...rows.slice(0, 3), '', ...rows.slice(3, 5), '', ...rows.slice(5)].join('\n');
    expect(await problemsOf({ 'area.csv': area })).toEqual(['error month-invalid area.csv:8 month']);
  });

  it('reports an unparseable month and date, and warns about (and skips) months after the bulletin month', async () => {
    const area = `${replaceLine(base['area.csv'], 2, 'A,2018/01,8,0.95,3')}A,2020-07,8,0.9,2\nB,2020-08,8,0.9,2\n`;
    const field = replaceLine(base['field.csv'], 2, 'A,2019-02-30,chlorophyll_a,4.2,ug/L');
    expect(await problemsOf({ 'area.csv': area, 'field.csv': field })).toEqual([
      'error month-invalid area.csv:2 month',
      'warning month-after-bulletin area.csv:62 month',
      'error date-invalid field.csv:2 date',
    ]);
  });

  it('reports a quality unit that does not match its parameter, an unknown parameter, and quantiles out of order', async () => {
    let quality = base['quality.csv'];
    quality = replaceLine(quality, 2, 'A,2018-01,chlorophyll_a,FNU,2,3,4,5,6,80');
    quality = replaceLine(quality, 3, 'A,2018-01,secchi_depth,m,1,2,3,4,5,80');
    quality = replaceLine(quality, 4, 'A,2018-02,chlorophyll_a,ug/L,2,3,9,5,6,80');
    expect(await problemsOf({ 'quality.csv': quality })).toEqual([
      'error unit-mismatch quality.csv:2 unit',
      'error parameter-unknown quality.csv:3 parameter',
      'error quantiles-out-of-order quality.csv:4 median',
    ]);
  });

  it('reports invalid GeoJSON: bad JSON, an unclosed ring, missing properties, and a sub-region without boundary', async () => {
    expect(await problemsOf({ 'regions.geojson': '{"type": "FeatureCollection",' })).toContain(
      'error geojson-unreadable regions.geojson:0',
    );
    const open = JSON.stringify({
      type: 'FeatureCollection',
      features: [
        {
          type: 'Feature',
          properties: { subregion_id: 'R1', name: 'One' },
          geometry: {
            type: 'Polygon',
            coordinates: [
              [
                [10, 50],
                [11, 50],
                [11, 51],
                [10, 51],
              ],
            ],
          },
        },
      ],
    });
    expect(await problemsOf({ 'regions.geojson': open })).toContain('error geojson-ring regions.geojson:0 features[0].geometry');
    const unnamed = JSON.stringify({
      type: 'FeatureCollection',
      features: [{ type: 'Feature', properties: { subregion_id: 'R1' }, geometry: { type: 'Polygon', coordinates: [] } }],
    });
    expect(await problemsOf({ 'regions.geojson': unnamed })).toContain('error geojson-properties regions.geojson:0 features[0].properties');
    const other = base['regions.geojson'].replace('"R1"', '"R2"');
    expect(
      await problemsOf({
        'regions.geojson': other,
        'rain.csv': 'subregion_id,month,rainfall_mm\nR2,2020-06,3\n',
        'bins.csv': 'subregion_id,month,parameter,bin_lower,bin_upper,pixel_count\nR2,2020-06,turbidity,1,2,3\n',
      }),
    ).toEqual(['error subregion-without-boundary bodies.csv:2 subregion_id']);
  });

  it('reports bytes that are not UTF-8, with the line and a guess at the encoding', async () => {
    const latin1 = Buffer.from('body_id,date,parameter,value,unit\nA,2019-05-14,chlorophyll_a,4.2,\xb5g/L\n', 'latin1');
    const { problems } = await loadBulletin(writeMini({ 'field.csv': latin1 }));
    expect(problems.sorted()).toEqual([expect.objectContaining({ code: 'not-utf8', file: 'field.csv', line: 2 })]);
    expect(problems.sorted()[0]?.message).toContain('Windows-1252 or ISO-8859-1');
  });

  it('accepts a BOM, CRLF line ends, and semicolons with decimal commas (with a warning when not declared)', async () => {
    const area = `\uFEFF${base['area.csv']
      .replace(/,/g, ';')
      .replace(/(\d)\.(\d)/g, '$1,$2')
      .replace(/\n/g, '\r\n')}`;
    const { inputs, problems } = await loadBulletin(writeMini({ 'area.csv': area }));
    expect(problems.sorted().map((p) => p.code)).toEqual(['decimal-comma-detected']);
    expect(inputs?.area.waterHa[0]).toBe(8);
    expect(inputs?.area.observedShare[0]).toBe(0.95);
    const declared = await loadBulletin(writeMini({ 'area.csv': area, 'bulletin.json': config((c) => (c.csv = { decimal: ',' })) }));
    expect(declared.problems.items).toEqual([]);
  });

  it('reports a baseline outside the data, a bulletin month without data, and unknown keys with a suggestion', async () => {
    expect(await problemsOf({ 'bulletin.json': config((c) => (c.baseline = { firstYear: 2010, lastYear: 2019, minYears: 2 })) })).toEqual([
      'error baseline-outside-data bulletin.json:0 baseline',
    ]);
    expect(await problemsOf({ 'bulletin.json': config((c) => (c.issue = { month: '2020-05', published: '2020-06-02' })) })).toEqual([
      'warning month-after-bulletin area.csv:60 month',
      'warning month-after-bulletin bins.csv:2 month',
      'warning month-after-bulletin quality.csv:60 month',
      'warning month-after-bulletin rain.csv:31 month',
    ]);
    const noData = base['area.csv']
      .split('\n')
      .filter((row) => !row.includes('2020-06'))
      .join('\n');
    expect(await problemsOf({ 'area.csv': noData })).toEqual(['error bulletin-month-without-data bulletin.json:0 issue.month']);
    // The misspelt key is written on line 15 of the two-space-indented configuration.
    const { problems } = await loadBulletin(
      writeMini({ 'bulletin.json': config((c) => ((c.baseline as Record<string, unknown>).lastYaer = 2019)) }),
    );
    expect(problems.sorted()).toEqual([
      expect.objectContaining({ code: 'config-unknown-key', column: 'baseline.lastYaer', expected: 'did you mean "lastYear"?', line: 15 }),
    ]);
  });

  it('keeps the first 50 problems of a kind in a file and counts the rest', async () => {
    const rows = Array.from({ length: 120 }, (_, k) => `Z${k},2018-01,1,0.9,1`).join('\n');
    const { problems } = await loadBulletin(writeMini({ 'area.csv': `${base['area.csv']}${rows}\n` }));
    const sorted = problems.sorted();
    expect(sorted).toHaveLength(51);
    expect(sorted[50]?.message).toBe('70 more problem(s) of this kind (unknown-body) not listed');
    expect(problems.total).toEqual({ errors: 120, warnings: 0 });
  });
});

describe('loadBulletin and translations', () => {
  it('loadBulletin warns when editorial text has no translation for a configured language', async () => {
    const folder = writeMini({ 'bulletin.json': config((c) => Object.assign(c, { locales: ['en', 'fr'] })) });
    mkdirSync(join(folder, 'content'));
    writeFileSync(join(folder, 'content', 'foreword.md'), 'The foreword.\n');
    writeFileSync(join(folder, 'content', 'notes.md'), 'The notes.\n');
    writeFileSync(join(folder, 'content', 'notes.fr.md'), 'Les notes.\n');
    const { inputs, problems } = await loadBulletin(folder);
    expect(inputs).not.toBeNull();
    expect(problems.sorted().map((p) => `${p.severity} ${p.code} ${p.file} ${p.value} ${p.expected}`)).toEqual([
      'warning content-untranslated content/foreword.md fr content/foreword.fr.md',
    ]);
  });
});

describe('loadBulletin and the placeholder foreword', () => {
  const placeholderFolder = (draft: boolean) => {
    const folder = writeMini({
      'bulletin.json': config((c) => Object.assign(c, { locales: ['en', 'fr'], issue: { ...c.issue, draft } })),
    });
    mkdirSync(join(folder, 'content'));
    // The bytes init writes (src/cli/init.ts), with the line ending an editor on another system might add.
    writeFileSync(join(folder, 'content', 'foreword.md'), placeholderForeword('en'));
    writeFileSync(join(folder, 'content', 'foreword.fr.md'), placeholderForeword('fr').replace('\n', '\r\n'));
    return folder;
  };

  it('refuses a published issue whose foreword is still the placeholder, in each language, naming the file and the fix', async () => {
    const { inputs, problems } = await loadBulletin(placeholderFolder(false));
    expect(inputs).toBeNull();
    expect(problems.sorted().map((p) => `${p.severity} ${p.code} ${p.file}:${p.line} ${p.expected}`)).toEqual([
      'error content-placeholder content/foreword.fr.md:1 the foreword of this issue, or "draft": true in issue of bulletin.json',
      'error content-placeholder content/foreword.md:1 the foreword of this issue, or "draft": true in issue of bulletin.json',
    ]);
  });

  it('lets a draft keep the placeholder', async () => {
    const { inputs, problems } = await loadBulletin(placeholderFolder(true));
    expect(inputs).not.toBeNull();
    expect(problems.errors).toEqual([]);
  });
});

describe('loadBulletin and the spellings of exports', () => {
  it('reads yes/no as yes, no, true, false, 1 or 0 in any case, and refuses anything else by name', async () => {
    const bodies = miniFiles()['bodies.csv'];
    const spelled = (a: string, b: string) => bodies.replace(/,(yes|no)\n/, `,${a}\n`).replace(/,(yes|no)(\n|$)/, `,${b}$2`);
    for (const [a, b] of [
      ['TRUE', 'false'],
      ['1', '0'],
      ['Yes', 'NO'],
    ]) {
      const { inputs, problems } = await loadBulletin(writeMini({ 'bodies.csv': spelled(a as string, b as string) }));
      expect(problems.errors, `${a}/${b}`).toEqual([]);
      expect(
        inputs?.bodies.map((body) => body.ownPage),
        `${a}/${b}`,
      ).toEqual([['true', '1', 'yes'].includes((a as string).toLowerCase()), ['true', '1', 'yes'].includes((b as string).toLowerCase())]);
    }
    const { problems } = await loadBulletin(writeMini({ 'bodies.csv': spelled('maybe', 'no') }));
    expect(problems.errors.map((problem) => `${problem.code} ${problem.expected}`)).toEqual([
      'value-not-flag yes or no (or true/false, 1/0)',
    ]);
  });

  it('reads a month written YYYY-MM-01 as its month, and names the fix for another day', async () => {
    const area = miniFiles()['area.csv'];
    const firstDay = await loadBulletin(writeMini({ 'area.csv': area.replace(/,(\d{4}-\d{2}),/g, ',$1-01,') }));
    expect(firstDay.problems.errors).toEqual([]);
    expect(firstDay.inputs?.area.length).toBe(60);
    const day = await loadBulletin(writeMini({ 'area.csv': area.replace('A,2018-03,', 'A,2018-03-15,') }));
    expect(day.problems.errors.map((problem) => [problem.code, problem.line, problem.message])).toEqual([
      ['month-invalid', 6, 'a day other than the first: a monthly table takes one row per month, dated YYYY-MM or YYYY-MM-01'],
    ]);
  });
});

describe('loadBulletin and a month fully under cloud', () => {
  it('reads an empty area with an observed share of 0 as "not seen", and still refuses an empty area that was seen', async () => {
    const area = miniFiles()['area.csv'];
    const cloudy = area.replace(/^A,2019-03,[^,]*,[^,]*,(\d*)$/m, 'A,2019-03,,0,$1');
    expect(cloudy).not.toBe(area);
    const { inputs, problems } = await loadBulletin(writeMini({ 'area.csv': cloudy }));
    expect(problems.errors).toEqual([]);
    expect(inputs?.area.length).toBe(60);
    const seen = area.replace(/^A,2019-03,[^,]*,/m, 'A,2019-03,,');
    const refused = await loadBulletin(writeMini({ 'area.csv': seen }));
    expect(refused.problems.errors.map((problem) => `${problem.code} ${problem.column}`)).toEqual(['value-empty water_area_ha']);
  });
});

describe('loadBulletin and tables.ignoreColumns', () => {
  it('skips the listed columns without a warning, and still warns about the others', async () => {
    const area = miniFiles()
      ['area.csv'].split('\n')
      .map((row, k) => (row === '' ? row : `${row},${k === 0 ? 'cloud_model' : 'v2'},${k === 0 ? 'operator' : 'x'}`))
      .join('\n');
    const warned = await loadBulletin(writeMini({ 'area.csv': area }));
    expect(warned.problems.warnings.map((problem) => `${problem.code} ${problem.column}`)).toEqual([
      'column-unknown cloud_model',
      'column-unknown operator',
    ]);
    const config = JSON.parse(miniFiles()['bulletin.json']);
    config.tables = { ignoreColumns: ['cloud_model'] };
    const quiet = await loadBulletin(writeMini({ 'area.csv': area, 'bulletin.json': JSON.stringify(config) }));
    expect(quiet.problems.warnings.map((problem) => `${problem.code} ${problem.column}`)).toEqual(['column-unknown operator']);
    expect(quiet.inputs?.area.length).toBe(60);
  });
});

describe('loadBulletin and the line of a configuration problem', () => {
  it('names the line of an unknown key itself, even when the same name is a key or a value higher up', async () => {
    const text = config(() => {}).replace(/\n}\s*$/, ',\n  "name": "a top-level key that does not exist"\n}\n');
    const line = text.split('\n').findIndex((row) => row.includes('"a top-level key')) + 1;
    expect(text.indexOf('"name"')).toBeLessThan(text.lastIndexOf('"name"')); // region.name comes first
    const { problems } = await loadBulletin(writeMini({ 'bulletin.json': text }));
    expect(problems.errors.map((problem) => `${problem.code} ${problem.line}`)).toEqual([`config-unknown-key ${line}`]);
  });

  it('lineOfPath finds keys and array items by their place in the structure', async () => {
    const { lineOfPath } = await import('../../src/ingest/config.ts');
    const text = '{\n  "a": { "name": "x" },\n  "list": [\n    { "name": 1 },\n    { "key": "name" }\n  ],\n  "name": 2\n}\n';
    expect(lineOfPath(text, ['name'])).toBe(7);
    expect(lineOfPath(text, ['a', 'name'])).toBe(2);
    expect(lineOfPath(text, ['list', 1, 'key'])).toBe(5);
    expect(lineOfPath(text, ['list', 1, 'missing'])).toBe(5); // the deepest part that exists
    expect(lineOfPath(text, ['nowhere'])).toBe(0);
  });
});
