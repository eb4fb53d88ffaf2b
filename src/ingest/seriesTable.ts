/**
 * Reads a long table of time series (one row per series and time) for the `trend` command: a time
 * column, a value column and optionally a column naming the series. Every bad cell is a problem
 * with file, line and column; an empty value cell is a missing value.
 */
import { say } from '../common/problemMessages.ts';
import { readTable } from './csv.ts';
import type { ProblemList } from './problems.ts';

export interface SeriesInput {
  key: string;
  /** Decimal years, ascending. */
  times: Float64Array;
  /** Month index (year × 12 + month − 1) of each time, for seasonal tests; NaN when not monthly. */
  months: Float64Array;
  /** NaN marks a missing value. */
  values: Float64Array;
  /** The time as written in the file, for reporting. */
  labels: string[];
}

export interface ParsedTime {
  years: number;
  month: number;
}

const daysInYear = (year: number) => ((year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 366 : 365);

/**
 * `YYYY-MM` (the month's start: year + (month − 1)/12), `YYYY-MM-DD` (year + (day of year − 1)/days
 * in the year) or a plain number of years. Null when the text is none of these.
 */
export function parseTime(text: string): ParsedTime | null {
  let match = /^(\d{4})-(0[1-9]|1[0-2])$/.exec(text);
  if (match) {
    const year = Number(match[1]);
    const month = Number(match[2]);
    return { years: year + (month - 1) / 12, month: year * 12 + month - 1 };
  }
  match = /^(\d{4})-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/.exec(text);
  if (match) {
    const year = Number(match[1]);
    const month = Number(match[2]);
    const day = Number(match[3]);
    const date = Date.UTC(year, month - 1, day);
    if (new Date(date).getUTCDate() !== day) return null;
    const dayOfYear = (date - Date.UTC(year, 0, 1)) / 86_400_000;
    return { years: year + dayOfYear / daysInYear(year), month: year * 12 + month - 1 };
  }
  if (/^-?\d+(\.\d+)?$/.test(text)) return { years: Number(text), month: Number.NaN };
  return null;
}

export interface SeriesColumns {
  time: string;
  value: string;
  by?: string;
}

/**
 * Limits of the trend arithmetic: values and times of at most this magnitude (their differences
 * stay finite in doubles: the slopes of Sen's method are differences divided by differences), and
 * at most this many values per series (the pairwise methods need n(n−1)/2 slopes: 12.5 million at
 * the limit, about 100 MB of work space).
 */
export const MAX_MAGNITUDE = 1e100;
export const MAX_VALUES_PER_SERIES = 5_000;

export async function readSeriesTable(path: string, label: string, columns: SeriesColumns, problems: ProblemList): Promise<SeriesInput[]> {
  const rows = new Map<string, Array<{ time: ParsedTime; label: string; value: number; line: number }>>();
  const specs = [columns.time, columns.value, ...(columns.by ? [columns.by] : [])].map((name) => ({ name, required: true }));
  await readTable(path, label, specs, problems, (values, line, at) => {
    const timeText = (values[at[columns.time]!] ?? '').trim();
    const valueText = (values[at[columns.value]!] ?? '').trim();
    const time = parseTime(timeText);
    if (time && !(Math.abs(time.years) <= MAX_MAGNITUDE)) {
      problems.error({
        code: 'value-out-of-range',
        file: label,
        line,
        column: columns.time,
        value: timeText,
        expected: `a time of at most ${MAX_MAGNITUDE} in size`,
        message: say('time-too-large'),
      });
      return;
    }
    if (!time) {
      problems.error({
        code: 'time-invalid',
        file: label,
        line,
        column: columns.time,
        value: timeText,
        expected: 'YYYY-MM, YYYY-MM-DD or a number of years',
        message: say('time-invalid'),
      });
      return;
    }
    let value = Number.NaN;
    if (valueText !== '') {
      value = /^-?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(valueText) ? Number(valueText) : Number.NaN;
      if (Number.isNaN(value)) {
        problems.error({
          code: 'value-not-number',
          file: label,
          line,
          column: columns.value,
          value: valueText,
          expected: 'a finite number, or nothing for a missing value',
          message: say('value-not-number'),
        });
        return;
      }
      if (!(Math.abs(value) <= MAX_MAGNITUDE)) {
        problems.error({
          code: 'value-out-of-range',
          file: label,
          line,
          column: columns.value,
          value: valueText,
          expected: `a number of at most ${MAX_MAGNITUDE} in size (rescale the unit)`,
          message: say('value-too-large'),
        });
        return;
      }
    }
    const key = columns.by ? (values[at[columns.by]!] ?? '').trim() : 'all';
    const list = rows.get(key) ?? [];
    list.push({ time, label: timeText, value, line });
    rows.set(key, list);
  });
  const series: SeriesInput[] = [];
  for (const [key, list] of [...rows.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
    if (list.length > MAX_VALUES_PER_SERIES) {
      problems.error({
        code: 'series-too-long',
        file: label,
        line: list[MAX_VALUES_PER_SERIES]!.line,
        column: columns.time,
        value: key,
        expected: `at most ${MAX_VALUES_PER_SERIES} values per series`,
        message: say('series-too-long', { key, count: list.length }),
      });
      continue;
    }
    list.sort((a, b) => a.time.years - b.time.years);
    for (let k = 1; k < list.length; k++) {
      const here = list[k]!;
      const before = list[k - 1]!;
      if (here.time.years === before.time.years) {
        problems.error({
          code: 'duplicate-time',
          file: label,
          line: here.line,
          column: columns.time,
          value: here.label,
          expected: 'each time once per series',
          message: say('duplicate-time', { key, line: before.line }),
        });
      }
    }
    series.push({
      key,
      times: Float64Array.from(list, (row) => row.time.years),
      months: Float64Array.from(list, (row) => row.time.month),
      values: Float64Array.from(list, (row) => row.value),
      labels: list.map((row) => row.label),
    });
  }
  return series;
}
