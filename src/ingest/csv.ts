/**
 * Table reading. CSV goes through papaparse in streaming chunk mode (a file is never held as one
 * string), after strict UTF-8 decoding; the delimiter (comma or semicolon) is detected from the
 * header line. Parquet goes through hyparquet. Either way each data row reaches the caller as an
 * array of texts with its line number (CSV: the header is line 1; Parquet: row k is line k + 1, so
 * numbers mean the same in both) and a map from column name to position.
 */
import { say } from '../common/problemMessages.ts';
import { createReadStream, existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { listRegularFiles } from './confine.ts';
import Papa from 'papaparse';
import { asyncBufferFromFile, parquetReadObjects } from 'hyparquet';
import { EncodingError, lineAtOffset, StrictUtf8 } from './encoding.ts';
import type { ProblemList } from './problems.ts';

export interface ColumnSpec {
  name: string;
  required: boolean;
}

/** Position of each known column in the row, or -1 when the file lacks it. */
export type ColumnIndex = Record<string, number>;

export type RowHandler = (values: string[], line: number, columns: ColumnIndex) => void;

/**
 * A table from a CSV file, a Parquet file, or a folder of Parquet partitions (every *.parquet file
 * below it, read in sorted path order, as a distributed engine writes them). `onFile` is told the
 * label of each partition before its rows, so problems name the partition and its row.
 */
export async function readTable(
  path: string,
  label: string,
  columns: ColumnSpec[],
  problems: ProblemList,
  onRow: RowHandler,
  onFile?: (label: string) => void,
): Promise<number> {
  if (existsSync(path) && statSync(path).isDirectory()) {
    const { files, links } = listRegularFiles(path);
    for (const link of links) {
      problems.error({
        code: 'partition-link',
        file: `${label.replace(/\/$/, '')}/${link}`,
        line: 0,
        column: '',
        value: '',
        expected: 'partitions as regular files inside the folder',
        message: say('partition-link'),
      });
    }
    if (links.length > 0) return 0;
    const parts = files.filter((file) => file.toLowerCase().endsWith('.parquet'));
    if (parts.length === 0) {
      problems.error({
        code: 'file-missing',
        file: label,
        line: 0,
        column: '',
        value: '',
        expected: 'a file, or a folder with .parquet partitions',
        message: say('partition-none'),
      });
      return 0;
    }
    let rows = 0;
    for (const part of parts) {
      const partLabel = `${label.replace(/\/$/, '')}/${part}`;
      onFile?.(partLabel);
      rows += await readParquet(join(path, part), partLabel, columns, problems, onRow);
    }
    onFile?.(label);
    return rows;
  }
  if (!existsSync(path) || !statSync(path).isFile()) {
    problems.error({
      code: 'file-missing',
      file: label,
      line: 0,
      column: '',
      value: '',
      expected: 'an existing file',
      message: say('file-missing'),
    });
    return 0;
  }
  return path.toLowerCase().endsWith('.parquet')
    ? readParquet(path, label, columns, problems, onRow)
    : readCsv(path, label, columns, problems, onRow);
}

/** The .parquet files below a folder, as sorted relative paths with forward slashes. */
export function parquetParts(folder: string): string[] {
  return listRegularFiles(folder).files.filter((path) => path.toLowerCase().endsWith('.parquet'));
}

export async function readCsv(
  path: string,
  label: string,
  columns: ColumnSpec[],
  problems: ProblemList,
  onRow: RowHandler,
): Promise<number> {
  let header: string[] | null = null;
  let index: ColumnIndex = {};
  let usable = true;
  let line = 0;
  let rows = 0;
  const decoded = createReadStream(path).pipe(new StrictUtf8());
  try {
    await new Promise<void>((resolve, reject) => {
      decoded.on('error', reject);
      Papa.parse<string[]>(decoded as unknown as File, {
        header: false,
        // Empty lines come through (and are skipped below) so that line numbers stay those of the file.
        skipEmptyLines: false,
        delimitersToGuess: [',', ';'],
        chunk: (result) => {
          for (const values of result.data) {
            line++;
            if (values.length === 1 && values[0] === '') continue;
            if (header === null) {
              header = values.map((name) => name.trim());
              index = columnIndex(header, columns);
              usable = checkHeader(header, label, columns, problems);
              continue;
            }
            if (!usable) continue;
            if (values.length !== header.length) {
              problems.error({
                code: 'field-count',
                file: label,
                line,
                column: '',
                value: String(values.length),
                expected: `${header.length} fields, as in the header`,
                message: say('field-count'),
              });
              continue;
            }
            rows++;
            onRow(values, line, index);
          }
        },
        complete: () => resolve(),
        error: (error: Error) => reject(error),
      });
    });
  } catch (error) {
    if (!(error instanceof EncodingError)) throw error;
    const guess = error.guess ? `; it looks like ${error.guess}: convert it to UTF-8` : '; convert it to UTF-8';
    problems.error({
      code: 'not-utf8',
      file: label,
      line: lineAtOffset(path, error.offset),
      column: '',
      value: '',
      expected: 'UTF-8 text',
      message: say('file-not-utf8', { guess }),
    });
    return rows;
  }
  finish(header !== null, usable, rows, label, problems);
  return rows;
}

async function readParquet(path: string, label: string, columns: ColumnSpec[], problems: ProblemList, onRow: RowHandler): Promise<number> {
  let records: Array<Record<string, unknown>>;
  try {
    records = (await parquetReadObjects({ file: await asyncBufferFromFile(path) })) as Array<Record<string, unknown>>;
  } catch (error) {
    problems.error({
      code: 'parquet-unreadable',
      file: label,
      line: 0,
      column: '',
      value: '',
      expected: 'a Parquet file',
      message: say('parquet-unreadable', { detail: error instanceof Error ? error.message : String(error) }),
    });
    return 0;
  }
  const header = records[0] ? Object.keys(records[0]) : [];
  if (records.length === 0) {
    problems.error({
      code: 'no-rows',
      file: label,
      line: 1,
      column: '',
      value: '',
      expected: 'at least one data row',
      message: say('file-no-rows'),
    });
    return 0;
  }
  const index = columnIndex(header, columns);
  if (!checkHeader(header, label, columns, problems)) return 0;
  records.forEach((record, k) => {
    const values = header.map((name) => text(record[name]));
    onRow(values, k + 2, index);
  });
  return records.length;
}

/** Parquet cells as the text a CSV would hold: numbers in full precision, dates as ISO days. */
function text(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  if (typeof value === 'bigint') return value.toString();
  return String(value);
}

function columnIndex(header: string[], columns: ColumnSpec[]): ColumnIndex {
  const index: ColumnIndex = {};
  for (const column of columns) index[column.name] = header.indexOf(column.name);
  return index;
}

function finish(hadHeader: boolean, usable: boolean, rows: number, label: string, problems: ProblemList): void {
  if (!hadHeader) {
    problems.error({
      code: 'file-empty',
      file: label,
      line: 0,
      column: '',
      value: '',
      expected: 'a header line and data rows',
      message: say('file-empty'),
    });
  } else if (usable && rows === 0) {
    problems.error({
      code: 'no-rows',
      file: label,
      line: 1,
      column: '',
      value: '',
      expected: 'at least one data row',
      message: say('file-header-only'),
    });
  }
}

function checkHeader(header: string[], label: string, columns: ColumnSpec[], problems: ProblemList): boolean {
  let usable = true;
  for (const column of columns) {
    if (column.required && !header.includes(column.name)) {
      problems.error({
        code: 'column-missing',
        file: label,
        line: 1,
        column: column.name,
        value: '',
        expected: `a column named ${column.name}`,
        message: say('column-missing'),
      });
      usable = false;
    }
  }
  const seen = new Set<string>();
  for (const name of header) {
    if (seen.has(name)) {
      problems.error({
        code: 'column-duplicate',
        file: label,
        line: 1,
        column: name,
        value: name,
        expected: 'each column once',
        message: say('column-duplicate'),
      });
      usable = false;
    }
    seen.add(name);
    if (!columns.some((column) => column.name === name)) {
      problems.warning({
        code: 'column-unknown',
        file: label,
        line: 1,
        column: name,
        value: name,
        expected: columns.map((c) => c.name).join(', '),
        message: say('column-unknown'),
        params: { columns: columns.map((c) => c.name).join(', ') },
      });
    }
  }
  return usable;
}
