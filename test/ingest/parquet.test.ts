import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parquetWriteBuffer } from 'hyparquet-writer';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { MINI_CONFIG, miniFiles, writeMini } from '../support/miniBulletin.ts';

/** The mini bulletin's surface-area CSV written as Parquet (hyparquet-writer), column for column. */
function areaParquet(change?: (rows: string[][]) => void): Buffer {
  const rows = miniFiles()['area.csv'].trim().split('\n').slice(1).map((line) => line.split(','));
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
    const folder = writeMini({ 'bulletin.json': JSON.stringify({ ...MINI_CONFIG, inputs: { ...MINI_CONFIG.inputs, surfaceArea: 'area.parquet' } }) });
    writeFileSync(join(folder, 'area.parquet'), areaParquet());
    const parquet = await loadBulletin(folder);
    expect(parquet.problems.items).toEqual([]);
    expect(Array.from(parquet.inputs?.area.waterHa ?? [])).toEqual(Array.from(csv.inputs?.area.waterHa ?? []));
    expect(Array.from(parquet.inputs?.area.month ?? [])).toEqual(Array.from(csv.inputs?.area.month ?? []));
  });

  it('loadBulletin reports a bad Parquet cell with its row as the line (row 1 is line 2)', async () => {
    const folder = writeMini({ 'bulletin.json': JSON.stringify({ ...MINI_CONFIG, inputs: { ...MINI_CONFIG.inputs, surfaceArea: 'area.parquet' } }) });
    writeFileSync(join(folder, 'area.parquet'), areaParquet((rows) => ((rows[2] as string[])[1] = '2018-13')));
    const { problems } = await loadBulletin(folder);
    expect(problems.sorted()).toEqual([expect.objectContaining({ code: 'month-invalid', file: 'area.parquet', line: 4, column: 'month' })]);
  });
});
