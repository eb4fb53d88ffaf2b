/**
 * The fast path for the large tables must give exactly what the general reader gives, and give up
 * (so the general reader reports) on anything it cannot vouch for.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readAreaFast, readQualityFast } from '../../src/ingest/largeTables.ts';
import { ProblemList } from '../../src/ingest/problems.ts';
import { readInventory, readQuality, readSurfaceArea } from '../../src/ingest/tables.ts';
import type { ReadContext } from '../../src/ingest/tableTypes.ts';
import { scanRange } from '../../src/ingest/plainScan.ts';
import { miniFiles, writeMini } from '../support/miniBulletin.ts';

const JUNE_2020 = 2020 * 12 + 5;
const base = miniFiles();

async function bothPaths(changes: Parameters<typeof writeMini>[0]) {
  const folder = writeMini(changes);
  const context = (): ReadContext => ({ problems: new ProblemList(), bulletinMonth: JUNE_2020, decimal: 'auto' });
  const inventoryContext = context();
  const bodies = await readInventory(join(folder, 'bodies.csv'), 'bodies.csv', inventoryContext);
  const fast = context();
  const general = { ...context(), fastPath: false };
  return {
    folder,
    bodies,
    fastContext: fast,
    area: {
      fast: await readSurfaceArea(join(folder, 'area.csv'), 'area.csv', bodies, fast),
      general: await readSurfaceArea(join(folder, 'area.csv'), 'area.csv', bodies, general),
    },
    quality: {
      fast: await readQuality(join(folder, 'quality.csv'), 'quality.csv', bodies, fast),
      general: await readQuality(join(folder, 'quality.csv'), 'quality.csv', bodies, general),
    },
    problems: { fast: fast.problems.sorted(), general: general.problems.sorted() },
  };
}

const lines = (text: string) => text.trimEnd().split('\n');
const variants: Record<string, Parameters<typeof writeMini>[0]> = {
  'clean files': {},
  'CRLF line ends': { 'area.csv': base['area.csv'].replaceAll('\n', '\r\n'), 'quality.csv': base['quality.csv'].replaceAll('\n', '\r\n') },
  'a byte-order mark': { 'area.csv': `\uFEFF${base['area.csv']}` },
  'no newline at the end': { 'area.csv': base['area.csv'].trimEnd() },
  'columns in another order, an optional one left out': {
    'area.csv': lines(base['area.csv'])
      .map((row) => row.split(',').slice(0, 4).reverse().join(','))
      .join('\n'),
  },
  'exponents and long decimals': {
    'area.csv': base['area.csv'].replace('A,2018-01,8.0', 'A,2018-01,8e0').replace('B,2018-02,181.0', 'B,2018-02,181.00000000000000012'),
  },
  'empty optional cells': {
    'area.csv': base['area.csv'].replace('A,2018-01,8.0,0.95,3', 'A,2018-01,8.0,0.95,'),
    'quality.csv': base['quality.csv'].replace('A,2018-01,chlorophyll_a,ug/L,2,3,4,5,6,150', 'A,2018-01,chlorophyll_a,ug/L,,3,4,5,,'),
  },
  'months written as the first day (YYYY-MM-01)': {
    'area.csv': base['area.csv'].replace(/,(\d{4}-\d{2}),/g, ',$1-01,'),
    'quality.csv': base['quality.csv'].replace(/,(\d{4}-\d{2}),/g, ',$1-01,'),
  },
  'a month written as another day': { 'area.csv': base['area.csv'].replace('A,2018-02,', 'A,2018-02-15,') },
  // Each of these makes the fast path give up; the general reader then reports or accepts it.
  'a quoted cell': { 'area.csv': base['area.csv'].replace('A,2018-01,', '"A",2018-01,') },
  'a blank line': { 'area.csv': base['area.csv'].replace('\nA,2018-03', '\n\nA,2018-03') },
  'a later month': { 'area.csv': `${base['area.csv']}A,2020-07,8.0,0.95,3\n` },
  'an unknown body': { 'area.csv': base['area.csv'].replace('B,2018-04', 'C,2018-04') },
  'a repeated row': { 'area.csv': `${base['area.csv']}A,2018-01,8.0,0.95,3\n` },
  'a negative number': { 'area.csv': base['area.csv'].replace('A,2018-02,9.0', 'A,2018-02,-9.0') },
  'quantiles out of order': { 'quality.csv': base['quality.csv'].replace('ug/L,2,3,4,5,6', 'ug/L,2,3,4,7,6') },
  'a non-ASCII unit': { 'quality.csv': base['quality.csv'].replace('A,2018-01,chlorophyll_a,ug/L', 'A,2018-01,chlorophyll_a,µg/L') },
  'a cell with blanks around it': { 'area.csv': base['area.csv'].replace('A,2018-02,9.0', 'A,2018-02, 9.0') },
  'a water area far above the reference': { 'area.csv': base['area.csv'].replace('A,2018-02,9.0', 'A,2018-02,90.0') },
};

describe('large tables: fast path against the general reader', () => {
  it('the variants change the files they name (none is a no-op)', () => {
    for (const [name, changes] of Object.entries(variants)) {
      for (const [file, text] of Object.entries(changes ?? {})) expect(text, `${name}: ${file}`).not.toBe(base[file as keyof typeof base]);
    }
  });

  for (const [name, changes] of Object.entries(variants)) {
    it(`gives the same tables and problems (${name})`, async () => {
      const result = await bothPaths(changes);
      expect(result.area.fast).toEqual(result.area.general);
      expect(result.quality.fast).toEqual(result.quality.general);
      expect(result.problems.fast).toEqual(result.problems.general);
    });
  }

  it('takes the fast path on clean files and gives up on the rest', async () => {
    const verdict = async (changes: Parameters<typeof writeMini>[0]) => {
      const { folder, bodies } = await bothPaths(changes);
      const context: ReadContext = { problems: new ProblemList(), bulletinMonth: JUNE_2020, decimal: 'auto' };
      const area = await readAreaFast(join(folder, 'area.csv'), bodies, context);
      const quality = await readQualityFast(join(folder, 'quality.csv'), bodies, context);
      expect(context.problems.items).toEqual([]); // the fast path never reports
      return [area !== null, quality !== null];
    };
    for (const name of [
      'clean files',
      'CRLF line ends',
      'a byte-order mark',
      'no newline at the end',
      'exponents and long decimals',
      'empty optional cells',
    ]) {
      expect(await verdict(variants[name]), name).toEqual([true, true]);
    }
    for (const name of [
      'a quoted cell',
      'a blank line',
      'a later month',
      'an unknown body',
      'a repeated row',
      'a negative number',
      'a cell with blanks around it',
      'a water area far above the reference',
    ]) {
      expect((await verdict(variants[name]))[0], name).toBe(false);
    }
    for (const name of ['quantiles out of order', 'a non-ASCII unit']) expect((await verdict(variants[name]))[1], name).toBe(false);
  });

  it('scans a file cut into ranges at line ends as one', async () => {
    const { folder, bodies, area } = await bothPaths({});
    const path = join(folder, 'area.csv');
    const text = base['area.csv'];
    const header = lines(text)[0]?.split(',') as string[];
    const dataStart = text.indexOf('\n') + 1;
    const middle = text.indexOf('\n', Math.floor(text.length / 2)) + 1;
    const inventory = {
      key: 'mini',
      ids: bodies.map((body) => body.id),
      referenceHa: Float64Array.from(bodies, (body) => body.referenceHa),
    };
    // A read buffer of 64 bytes makes every few lines cross a buffer boundary.
    const parts = [
      [dataStart, middle],
      [middle, text.length],
    ].map(([start, end]) =>
      scanRange({ kind: 'area', path, start: start as number, end: end as number, header, bulletinMonth: JUNE_2020 }, inventory, 64),
    );
    const rows = parts.map((part) => (part.ok ? part.rows : -1));
    expect(rows[0]! + rows[1]!).toBe(area.general.length);
    const first = parts[0];
    expect(first?.ok && Array.from(first.columns.values[0] as Float64Array)).toEqual(Array.from(area.general.waterHa.subarray(0, rows[0])));
  });
});
