/**
 * Streaming CSV reading with papaparse: the file is never held as one string. Each data row
 * reaches the caller with its 1-based line number (the header is line 1) and its fields by column.
 */
import { createReadStream, existsSync } from 'node:fs';
import Papa from 'papaparse';
import type { ProblemList } from './problems.ts';

export interface ColumnSpec {
  name: string;
  required: boolean;
}

export type RowHandler = (fields: Record<string, string>, line: number) => void;

export async function readCsv(path: string, label: string, columns: ColumnSpec[], problems: ProblemList, onRow: RowHandler): Promise<number> {
  if (!existsSync(path)) {
    problems.error({ code: 'file-missing', file: label, line: 0, column: '', value: '', expected: 'an existing file', message: 'the file does not exist' });
    return 0;
  }
  let header: string[] | null = null;
  let usable = true;
  let line = 0;
  let rows = 0;
  await new Promise<void>((resolve, reject) => {
    Papa.parse<string[]>(createReadStream(path, { encoding: 'utf8' }), {
      header: false,
      skipEmptyLines: true,
      step: (result) => {
        line++;
        const values = result.data;
        if (header === null) {
          header = values.map((name, k) => (k === 0 ? name.replace(/^\uFEFF/, '') : name).trim());
          usable = checkHeader(header, label, columns, problems);
          return;
        }
        if (!usable) return;
        if (values.length !== header.length) {
          problems.error({ code: 'field-count', file: label, line, column: '', value: String(values.length), expected: `${header.length} fields`, message: 'the row has the wrong number of fields' });
          return;
        }
        const fields: Record<string, string> = {};
        header.forEach((name, k) => (fields[name] = (values[k] ?? '').trim()));
        rows++;
        onRow(fields, line);
      },
      complete: () => resolve(),
      error: (error: Error) => reject(error),
    });
  });
  if (header === null) {
    problems.error({ code: 'file-empty', file: label, line: 0, column: '', value: '', expected: 'a header line and data rows', message: 'the file is empty' });
  } else if (usable && rows === 0) {
    problems.error({ code: 'no-rows', file: label, line: 1, column: '', value: '', expected: 'at least one data row', message: 'the file has a header but no data rows' });
  }
  return rows;
}

function checkHeader(header: string[], label: string, columns: ColumnSpec[], problems: ProblemList): boolean {
  let usable = true;
  for (const column of columns) {
    if (column.required && !header.includes(column.name)) {
      problems.error({ code: 'column-missing', file: label, line: 1, column: column.name, value: '', expected: `a column named ${column.name}`, message: 'a required column is missing' });
      usable = false;
    }
  }
  for (const name of header) {
    if (!columns.some((column) => column.name === name)) {
      problems.warning({ code: 'column-unknown', file: label, line: 1, column: name, value: name, expected: columns.map((c) => c.name).join(', '), message: 'an unknown column is ignored' });
    }
  }
  return usable;
}
