import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parquetWriteBuffer } from 'hyparquet-writer';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { MINI_CONFIG, miniFiles, writeMini } from '../support/miniBulletin.ts';

/** The mini bulletin's surface-area CSV written as Parquet (hyparquet-writer), column for column. */
function areaParquet(change?: (rows: string[][]) => void): Buffer {
  const rows = miniFiles()
    ['area.csv'].trim()
    .split('\n')
    .slice(1)
    .map((line) => line.split(','));
  change?.(rows);
  const buffer = parquetWriteBuffer({
    columnData: [
      { name: 'body_id', data: rows.map((row) => row[0] as string), type: 'STRING' },
      { name: 'month', data: rows.map((row) => row[1] as string), type: 'STRING' },
      { name: 'water_area_ha', data: rows.map((row) => Number(row[2])), type: 'DOUBLE' },
      { name: 'observed_share', data: rows.map((row) => Number(row[3])), type: 'DOUBLE' },
      { name: 'scenes', data: rows.map((row) => Number(row[4])), type: 'INT32' },
    ],
  });
  return Buffer.from(buffer);
}

describe('Parquet tables', () => {
  it('loadBulletin reads a Parquet surface-area table to the same values as the CSV', async () => {
    const csv = await loadBulletin(writeMini());
    const folder = writeMini({
      'bulletin.json': JSON.stringify({ ...MINI_CONFIG, inputs: { ...MINI_CONFIG.inputs, surfaceArea: 'area.parquet' } }),
    });
    writeFileSync(join(folder, 'area.parquet'), areaParquet());
    const parquet = await loadBulletin(folder);
    expect(parquet.problems.items).toEqual([]);
    expect(Array.from(parquet.inputs?.area.waterHa ?? [])).toEqual(Array.from(csv.inputs?.area.waterHa ?? []));
    expect(Array.from(parquet.inputs?.area.month ?? [])).toEqual(Array.from(csv.inputs?.area.month ?? []));
  });

  it('loadBulletin reports a bad Parquet cell with its row as the line (row 1 is line 2)', async () => {
    const folder = writeMini({
      'bulletin.json': JSON.stringify({ ...MINI_CONFIG, inputs: { ...MINI_CONFIG.inputs, surfaceArea: 'area.parquet' } }),
    });
    writeFileSync(
      join(folder, 'area.parquet'),
      areaParquet((rows) => ((rows[2] as string[])[1] = '2018-13')),
    );
    const { problems } = await loadBulletin(folder);
    expect(problems.sorted()).toEqual([expect.objectContaining({ code: 'month-invalid', file: 'area.parquet', line: 4, column: 'month' })]);
  });
});

describe('Parquet partitions', () => {
  it('loadBulletin reads a folder of Parquet partitions as one table, names a bad partition in problems and hashes the folder by its listing', async () => {
    const config = JSON.stringify({ ...MINI_CONFIG, inputs: { ...MINI_CONFIG.inputs, surfaceArea: 'area' } });
    const folder = writeMini({ 'bulletin.json': config });
    const rows = miniFiles()['area.csv'].trim().split('\n').slice(1);
    // Two partitions by year as a distributed engine writes them, plus a marker file that is not data.
    mkdirSync(join(folder, 'area', 'year=2018'), { recursive: true });
    mkdirSync(join(folder, 'area', 'year=2019-2020'), { recursive: true });
    writeFileSync(
      join(folder, 'area', 'year=2018', 'part-0.parquet'),
      areaParquet((all) => all.splice(0, all.length, ...all.filter((row) => row[1]?.startsWith('2018')))),
    );
    writeFileSync(
      join(folder, 'area', 'year=2019-2020', 'part-0.parquet'),
      areaParquet((all) => all.splice(0, all.length, ...all.filter((row) => !row[1]?.startsWith('2018')))),
    );
    writeFileSync(join(folder, 'area', '_SUCCESS'), '');
    const csv = await loadBulletin(writeMini());
    const parts = await loadBulletin(folder);
    expect(parts.problems.items).toEqual([]);
    expect(parts.inputs?.area.length).toBe(rows.length);
    // Same rows, read partition by partition in path order: 2018 first, as in the CSV.
    expect(Array.from(parts.inputs?.area.waterHa ?? [])).toEqual(Array.from(csv.inputs?.area.waterHa ?? []));
    const entry = parts.inputs?.files.find((file) => file.path === 'area');
    expect(entry?.parts?.map((part) => part.path)).toEqual(['year=2018/part-0.parquet', 'year=2019-2020/part-0.parquet']);
    // The folder's hash is that of the sha256sum listing of its partitions (computed here with node:crypto).
    const listing = (entry?.parts ?? [])
      .map(
        (part) =>
          `${createHash('sha256')
            .update(readFileSync(join(folder, 'area', part.path)))
            .digest('hex')}  ${part.path}\n`,
      )
      .join('');
    expect(entry?.sha256).toBe(createHash('sha256').update(listing).digest('hex'));

    writeFileSync(
      join(folder, 'area', 'year=2019-2020', 'part-0.parquet'),
      areaParquet((all) => {
        all.splice(0, all.length, ...all.filter((row) => !row[1]?.startsWith('2018')));
        (all[1] as string[])[1] = '2019-13';
      }),
    );
    const bad = await loadBulletin(folder);
    expect(bad.problems.sorted()).toEqual([
      expect.objectContaining({ code: 'month-invalid', file: 'area/year=2019-2020/part-0.parquet', line: 3, column: 'month' }),
    ]);
  });
});
