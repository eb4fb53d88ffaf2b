/**
 * Reading one cell of a table into a typed value. One CellReader serves a whole file (no object
 * per row): each method reports a bad cell as a problem with file, line and column and returns a
 * marker (NaN, null) that the table reader uses to drop the row; the row's other cells are still
 * checked, so one pass reports everything.
 */
import { say, type ProblemText } from '../common/problemMessages.ts';
import type { ProblemCode } from '../common/problemCodes.ts';
import { parseMonth } from '../common/months.ts';
import type { ProblemList } from './problems.ts';

export type DecimalMark = '.' | ',';

export class CellReader {
  /** True until a cell of the current row failed; reset by startRow. */
  rowOk = true;
  private decimalCommaSeen = false;

  constructor(
    /** The file named in problems; a partitioned table sets each partition in turn. */
    public file: string,
    private readonly problems: ProblemList,
    private readonly decimal: DecimalMark | 'auto' = 'auto',
  ) {}

  startRow(): void {
    this.rowOk = true;
  }

  fail(line: number, column: string, value: string, code: ProblemCode, expected: string, message: ProblemText): void {
    this.rowOk = false;
    this.problems.error({ code, file: this.file, line, column, value, expected, message });
  }

  text(values: string[], position: number, column: string, line: number): string {
    const cell = values[position] ?? '';
    const value = cell.length > 0 && cell.charCodeAt(0) > 32 && cell.charCodeAt(cell.length - 1) > 32 ? cell : cell.trim();
    if (value === '') this.fail(line, column, value, 'value-empty', 'a value', say('value-empty'));
    return value;
  }

  /** A finite number; `NaN`, `Infinity`, empty and other text are refused. */
  /** `min`, `max` bound the value; an `optional` empty cell gives NaN without a problem. */
  number(values: string[], position: number, column: string, line: number, min = -Infinity, max = Infinity, optional = false): number {
    const cell = values[position] ?? '';
    // Fast path for plain decimal notation (digits, sign, point, exponent), the bulk of any table.
    let value = isPlainDecimal(cell) ? +cell : Number.NaN;
    if (value !== value) {
      let raw = cell.trim();
      if (raw === '') {
        if (!optional) this.fail(line, column, raw, 'value-empty', 'a number', say('value-empty'));
        return Number.NaN;
      }
      if (this.decimal === ',' || (this.decimal === 'auto' && raw.includes(','))) raw = this.decimalComma(raw, line, column);
      value = isPlainDecimal(raw) ? +raw : Number.NaN;
      if (value !== value) {
        this.fail(line, column, cell, 'value-not-number', 'a finite decimal number', say('value-not-number'));
        return Number.NaN;
      }
    }
    if (!Number.isFinite(value)) {
      // Plain decimal notation can still overflow (1e999).
      this.fail(line, column, cell, 'value-not-number', 'a finite decimal number', say('value-not-finite'));
      return Number.NaN;
    }
    if (value < min || value > max) {
      this.fail(
        line,
        column,
        cell,
        'value-out-of-range',
        max === Infinity ? `at least ${min}` : `from ${min} to ${max}`,
        say('value-out-of-range'),
      );
      return Number.NaN;
    }
    return value;
  }

  private decimalComma(raw: string, line: number, column: string): string {
    if (!/^-?\d+,\d+$/.test(raw)) return raw;
    if (this.decimal === 'auto' && !this.decimalCommaSeen) {
      this.problems.warning({
        code: 'decimal-comma-detected',
        file: this.file,
        line,
        column,
        value: raw,
        expected: 'a decimal point, or csv.decimal set to "," in bulletin.json',
        message: say('decimal-comma'),
        params: {},
      });
    }
    this.decimalCommaSeen = true;
    return raw.replace(',', '.');
  }

  /**
   * A month as YYYY-MM, or as YYYY-MM-01 (the first day standing for its month, as many exports
   * write one); another day is refused, since a monthly table with days in it may be a daily one.
   */
  month(values: string[], position: number, column: string, line: number): number {
    const cell = values[position] ?? '';
    const raw = cell.length === 7 ? cell : cell.trim();
    const value = parseMonth(raw.length === 10 && raw.endsWith('-01') ? raw.slice(0, 7) : raw);
    if (value === null) {
      const day = /^\d{4}-\d{2}-\d{2}$/.test(raw);
      this.fail(
        line,
        column,
        raw,
        'month-invalid',
        'a month as YYYY-MM (or YYYY-MM-01)',
        day ? say('month-not-first-day') : say('month-invalid'),
      );
      return Number.NaN;
    }
    return value;
  }

  /** A calendar date YYYY-MM-DD as days since 1970-01-01 (UTC). */
  date(values: string[], position: number, column: string, line: number): number {
    const raw = (values[position] ?? '').trim();
    const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(raw);
    const days = match ? Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])) / 86_400_000 : Number.NaN;
    if (!match || !Number.isFinite(days) || new Date(days * 86_400_000).toISOString().slice(0, 10) !== raw) {
      this.fail(line, column, raw, 'date-invalid', 'a date as YYYY-MM-DD', say('date-invalid'));
      return Number.NaN;
    }
    return days;
  }

  /**
   * yes/no, in the spellings exports use: yes, no, true, false, 1, 0 (any case). An unreadable
   * flag is an error but keeps its row (read as no): dropping a water body for its page flag would
   * bury the one error under a follow-on "not in the inventory" for every row of every table.
   */
  flag(values: string[], position: number, column: string, line: number): boolean {
    const raw = (values[position] ?? '').trim().toLowerCase();
    if (raw === 'yes' || raw === 'true' || raw === '1') return true;
    if (raw === 'no' || raw === 'false' || raw === '0') return false;
    const value = values[position] ?? '';
    this.problems.error({
      code: 'value-not-flag',
      file: this.file,
      line,
      column,
      value,
      expected: 'yes or no (or true/false, 1/0)',
      message: say('value-not-flag'),
    });
    return false;
  }
}

/**
 * Digits with at most one sign, point and exponent, nothing else: what `+text` may then convert
 * (it would also take blanks, hexadecimal and "Infinity", which are not data here). The shape is
 * checked by character codes, as this runs for every numeric cell.
 */
function isPlainDecimal(text: string): boolean {
  const length = text.length;
  if (length === 0) return false;
  let digits = 0;
  for (let k = 0; k < length; k++) {
    const code = text.charCodeAt(k);
    if (code >= 48 && code <= 57) digits++;
    else if (code !== 46 && code !== 45 && code !== 43 && code !== 101 && code !== 69) return false; // . - + e E
  }
  return digits > 0;
}
