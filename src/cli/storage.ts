/** `limnopress storage`: water level and stored volume from surface areas, through each reservoir's survey curve. */
import { parseArgs } from 'node:util';
import { say } from '../common/problemMessages.ts';
import { InputError, ProblemList } from '../ingest/index.ts';
import { CellReader } from '../ingest/cells.ts';
import { readTable } from '../ingest/csv.ts';
import { readStorageCurves } from '../ingest/tables.ts';
import { StorageReader } from '../model/storage.ts';
import { csvField } from '../text/csv.ts';
import { HELP, UsageError } from './usage.ts';

const COLUMNS = ['body_id', 'month', 'water_area_ha', 'level_m', 'volume_hm3', 'percent_of_capacity', 'clamped'] as const;

export async function runStorage(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      area: { type: 'string' },
      interpolation: { type: 'string', default: 'pchip' },
      format: { type: 'string', default: 'csv' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    process.stdout.write(HELP.storage);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('storage needs exactly one table of curves');
  if (!values.area) throw new UsageError('storage needs --area <table.csv>');
  if (values.interpolation !== 'pchip' && values.interpolation !== 'linear')
    throw new UsageError(`--interpolation must be pchip or linear, not "${values.interpolation}"`);
  if (values.format !== 'csv' && values.format !== 'json') throw new UsageError(`--format must be csv or json, not "${values.format}"`);
  const interpolation = values.interpolation;

  const curvesPath = positionals[0] as string;
  const areaPath = values.area;
  const problems = new ProblemList();
  const context = { problems, bulletinMonth: Number.POSITIVE_INFINITY, decimal: '.' as const };
  const curves = await readStorageCurves(curvesPath, curvesPath, null, context);
  const readers = new Map(curves.map((curve) => [curve.id, new StorageReader(curve, interpolation)]));
  const rows: Array<{ id: string; month: string; areaHa: number | null; line: number }> = [];
  const cells = new CellReader(areaPath, problems, '.');
  await readTable(
    areaPath,
    areaPath,
    [
      { name: 'body_id', required: true },
      { name: 'month', required: true },
      { name: 'water_area_ha', required: true },
    ],
    problems,
    (cellsOfRow, line, at) => {
      cells.startRow();
      const id = cells.text(cellsOfRow, at.body_id!, 'body_id', line);
      const month = cells.text(cellsOfRow, at.month!, 'month', line);
      const empty = (cellsOfRow[at.water_area_ha!] ?? '').trim() === '';
      const areaHa = empty ? null : cells.number(cellsOfRow, at.water_area_ha!, 'water_area_ha', line, 0);
      if (!cells.rowOk) return;
      if (!readers.has(id)) {
        cells.fail(line, 'body_id', id, 'unknown-body', `a body of ${curvesPath}`, say('curve-missing-for-body'));
        return;
      }
      rows.push({ id, month, areaHa, line });
    },
  );
  if (problems.errors.length > 0) throw new InputError(problems.sorted());

  const out = rows.map((row) => {
    const reader = readers.get(row.id) as StorageReader;
    if (row.areaHa === null) return { row, read: null, percent: null };
    const read = reader.read(row.areaHa);
    return { row, read, percent: reader.capacityHm3 > 0 ? (100 * read.volumeHm3) / reader.capacityHm3 : null };
  });
  const clamped = out.filter((entry) => entry.read?.clamped).length;
  if (values.format === 'json') {
    const records = out.map(({ row, read, percent }) => ({
      body_id: row.id,
      month: row.month,
      water_area_ha: row.areaHa,
      level_m: read?.levelM ?? null,
      volume_hm3: read?.volumeHm3 ?? null,
      percent_of_capacity: percent,
      clamped: read?.clamped ?? false,
    }));
    process.stdout.write(`${JSON.stringify(records, null, 2)}\n`);
  } else {
    const lines = [COLUMNS.join(',')];
    for (const { row, read, percent } of out)
      lines.push(
        [
          csvField(row.id),
          csvField(row.month),
          row.areaHa === null ? '' : String(row.areaHa),
          read ? String(read.levelM) : '',
          read ? String(read.volumeHm3) : '',
          percent === null ? '' : String(percent),
          read?.clamped ? 'yes' : 'no',
        ].join(','),
      );
    process.stdout.write(`${lines.join('\n')}\n`);
  }
  process.stderr.write(
    `storage: ${rows.length} row(s), ${curves.length} curve(s), ${interpolation}${clamped > 0 ? `; ${clamped} area(s) outside their curve, taken at its nearest end (never extrapolated)` : ''}\n`,
  );
  return 0;
}
