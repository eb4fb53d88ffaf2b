/**
 * The fast path for the two large tables (surface area, water quality): their CSV read straight
 * from bytes into typed columns, with no text or array per row, over a byte range of the file so
 * that several threads can share one file.
 *
 * It accepts only what the general reader (tables.ts through csv.ts) would accept without a single
 * problem, and gives the same values: plain comma-separated ASCII, no quotes, no blank lines, cells
 * without surrounding blanks, numbers in plain decimal notation. On anything else (a quote, a
 * wrong field count, a bad or out-of-range cell, an unknown body, a later month, a water area far
 * above the reference) it gives up and says so: the caller then reads the whole file with the
 * general reader, which reports every problem with file, line and column. Nothing is guessed here
 * and nothing is reported from here, so the problems a user sees never depend on the path taken.
 *
 * Numbers: up to 15 significant digits with at most 15 after the point are converted as
 * mantissa / 10^k, both exact in binary64, so the one correctly rounded division gives the same
 * double as JavaScript's own (correctly rounded) conversion of the text; longer numbers and
 * exponents go through that conversion itself.
 */
import { closeSync, openSync, readSync } from 'node:fs';
import { GrowableFloat64, GrowableInt32 } from './columns.ts';
import { FIRST_MONTH } from '../common/months.ts';
import { defineTask } from '../parallel/pool.ts';

const COMMA = 44;
const NEWLINE = 10;
const RETURN = 13;
const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

export type ScanKind = 'area' | 'quality';

export interface ScanTask {
  kind: ScanKind;
  path: string;
  /** Byte range of whole lines: start at a line's first byte, end after a newline or at the end of the file. */
  start: number;
  end: number;
  /** Column names of the header, in file order. */
  header: string[];
  bulletinMonth: number;
}

export interface ScanInventory {
  /** Names this inventory among those a thread has seen (a digest of the ids), so its lookup table is made once per thread. */
  key: string;
  ids: string[];
  referenceHa: Float64Array;
}

const lookups = new Map<string, Map<string, number>>();

/** Position of each body id, made once per inventory and thread. */
function lookupOf(inventory: ScanInventory): Map<string, number> {
  let index = lookups.get(inventory.key);
  if (!index) {
    index = new Map(inventory.ids.map((id, k) => [id, k]));
    if (lookups.size > 8) lookups.clear();
    lookups.set(inventory.key, index);
  }
  return index;
}

/** Columns of one range (line numbers are not kept: the fast path gives up on anything it would have to report). */
export interface ScanColumns {
  body: Int32Array;
  month: Int32Array;
  /** area: waterHa, observedShare, scenes; quality: median, validPixels. */
  values: Float64Array[];
  /** quality: the parameter of each row (index into QUALITY_PARAMETERS). */
  parameter?: Int32Array;
}

export type ScanResult = { ok: true; rows: number; lines: number; columns: ScanColumns } | { ok: false; reason: string; line: number };

const AREA_COLUMNS = ['body_id', 'month', 'water_area_ha', 'observed_share', 'scenes'];
const QUALITY_COLUMNS = ['body_id', 'month', 'parameter', 'unit', 'p10', 'p25', 'median', 'p75', 'p90', 'valid_pixels'];
const REQUIRED: Record<ScanKind, string[]> = {
  area: ['body_id', 'month', 'water_area_ha', 'observed_share'],
  quality: ['body_id', 'month', 'parameter', 'unit', 'median'],
};
const KNOWN: Record<ScanKind, string[]> = { area: AREA_COLUMNS, quality: QUALITY_COLUMNS };

/** Whether a header suits the fast path: every column known, once, and the required ones there. */
export function plainHeader(kind: ScanKind, header: string[]): boolean {
  return (
    new Set(header).size === header.length &&
    header.every((name) => KNOWN[kind].includes(name)) &&
    REQUIRED[kind].every((name) => header.includes(name))
  );
}

const ascii = (text: string) => Uint8Array.from(text, (char) => char.charCodeAt(0));
/** Parameter codes as in QUALITY_PARAMETERS, with the ASCII spellings of their units (others take the general reader). */
const PARAMETERS = [
  { name: ascii('chlorophyll_a'), units: ['ug/L', 'mg/m3'].map(ascii) },
  { name: ascii('turbidity'), units: ['FNU'].map(ascii) },
];
const PARAMETER_NAMES = PARAMETERS.map((parameter) => parameter.name);

/** What each field of a row is, by its position in the header. */
const ID = 0;
const MONTH = 1;
const PARAMETER = 2;
const UNIT = 3;
/** Numbers: ROLE_NUMBER + k is the k-th number column of the table (see numberColumns). */
const ROLE_NUMBER = 4;

/** One byte range of a large table on a worker thread (see largeTables.ts). */
export function scanTask(input: { task: ScanTask; inventory: ScanInventory }): ScanResult {
  return scanRange(input.task, input.inventory);
}

export const SCAN = defineTask<Parameters<typeof scanTask>[0], ScanResult>(import.meta.url, 'scanTask');

/**
 * Scans one byte range of a large table. Each row is read once, field by field: the parsers
 * consume bytes up to the next comma, so no byte is looked at twice. Synchronous; run it on a
 * worker thread for parallelism.
 */
export function scanRange(task: ScanTask, inventory: ScanInventory, chunkBytes = 16 << 20): ScanResult {
  const fields = task.header.length;
  const area = task.kind === 'area';
  const numberNames = area ? ['water_area_ha', 'observed_share', 'scenes'] : ['p10', 'p25', 'median', 'p75', 'p90', 'valid_pixels'];
  const roles = Int32Array.from(task.header, (name) =>
    name === 'body_id'
      ? ID
      : name === 'month'
        ? MONTH
        : name === 'parameter'
          ? PARAMETER
          : name === 'unit'
            ? UNIT
            : ROLE_NUMBER + numberNames.indexOf(name),
  );
  const body = new GrowableInt32(1 << 16);
  const month = new GrowableInt32(1 << 16);
  // Kept per row: area, the three numbers; quality, the median and the valid pixels (the others are checked, see QualityTable).
  const kept = area ? [0, 1, 2] : [2, 5];
  const columns = kept.map(() => new GrowableFloat64(1 << 16));
  const parameters = new GrowableInt32(1 << 16);
  const row = new Float64Array(numberNames.length);
  const buffer = Buffer.allocUnsafe(chunkBytes);
  const ids = new BodyIds(lookupOf(inventory));
  let lineNumber = 0;
  let reason = '';

  /** Parses the line buffer[from, to) (no newline); false with `reason` set when the fast path must give up. */
  function parseLine(from: number, to: number): boolean {
    if (to > from && buffer[to - 1] === RETURN) to--;
    if (to === from) return ((reason = 'blank line'), false);
    for (let c = 0; c < row.length; c++) row[c] = Number.NaN; // TypedArray fill costs more than the whole row here
    let when = Number.NaN;
    let code = -1;
    let unitFrom = 0;
    let unitTo = 0;
    let k = from;
    for (let f = 0; f < fields; f++) {
      const start = k;
      const role = roles[f] as number;
      if (role >= ROLE_NUMBER) {
        k = numberField(buffer, start, to, row, role - ROLE_NUMBER);
        if (k < 0) return ((reason = 'number'), false);
      } else if (role === ID) {
        k = ids.field(buffer, start, to);
        if (k < 0) return ((reason = k === UNKNOWN_BODY ? 'unknown body' : 'body id'), false);
      } else {
        while (k < to && buffer[k] !== COMMA) k++;
        if (role === MONTH) when = monthAt8(buffer, start, k);
        else if (role === PARAMETER) code = matchOne(buffer, start, k, PARAMETER_NAMES);
        else {
          unitFrom = start;
          unitTo = k;
        }
      }
      // buffer[start, k) was the field: k must be at a comma, or at the end of the line after the last field.
      if (f < fields - 1 ? k >= to : k < to) return ((reason = 'field count'), false);
      k++; // past the comma
    }
    if (!(when >= FIRST_MONTH && when <= task.bulletinMonth)) return ((reason = 'month'), false);
    if (area) {
      const waterHa = row[0] as number;
      const observed = row[1] as number;
      if (!(waterHa >= 0) || !(observed <= 1)) return ((reason = 'number'), false);
      if (waterHa > 1.5 * (inventory.referenceHa[ids.body] as number)) return ((reason = 'area above reference'), false);
    } else {
      if (code < 0 || matchOne(buffer, unitFrom, unitTo, (PARAMETERS[code] as (typeof PARAMETERS)[number]).units) < 0)
        return ((reason = 'parameter or unit'), false);
      if (!((row[2] as number) >= 0)) return ((reason = 'median'), false);
      let previous = -Infinity;
      for (let q = 0; q < 5; q++) {
        const value = row[q] as number;
        if (value !== value) continue;
        if (value < previous) return ((reason = 'quantile order'), false);
        previous = value;
      }
      parameters.push(code);
    }
    for (let c = 0; c < kept.length; c++) (columns[c] as GrowableFloat64).push(row[kept[c] as number] as number);
    body.push(ids.body);
    month.push(when);
    return true;
  }

  const read = forEachLine(task, buffer, (from, to) => {
    lineNumber++;
    return parseLine(from, to);
  });
  if (read === 'line too long') return { ok: false, reason: 'line longer than the read buffer', line: lineNumber };
  if (read === 'stopped') return { ok: false, reason, line: lineNumber };
  const values = columns.map((column) => column.done());
  return {
    ok: true,
    rows: body.length,
    lines: lineNumber,
    columns: { body: body.done(), month: month.done(), values, ...(area ? {} : { parameter: parameters.done() }) },
  };
}

/**
 * Calls `line(from, to)` for every line of the task's byte range as it lies in `buffer` (no
 * newline), reading the file in pieces of the buffer's size; an unfinished line is carried to the
 * front. Stops when `line` returns false.
 */
function forEachLine(task: ScanTask, buffer: Buffer, line: (from: number, to: number) => boolean): 'done' | 'stopped' | 'line too long' {
  const handle = openSync(task.path, 'r');
  try {
    let position = task.start;
    let kept = 0; // bytes of an unfinished line carried to the front of the buffer
    while (position < task.end || kept > 0) {
      const want = Math.min(buffer.length - kept, task.end - position);
      const read = want > 0 ? readSync(handle, buffer, kept, want, position) : 0;
      position += read;
      const filled = kept + read;
      let from = 0;
      for (let newline = buffer.indexOf(NEWLINE, 0); newline !== -1 && newline < filled; newline = buffer.indexOf(NEWLINE, from)) {
        if (!line(from, newline)) return 'stopped';
        from = newline + 1;
      }
      if (position >= task.end) return from < filled && !line(from, filled) ? 'stopped' : 'done';
      kept = filled - from;
      if (kept === buffer.length) return 'line too long';
      buffer.copyWithin(0, from, filled);
    }
    return 'done';
  } finally {
    closeSync(handle);
  }
}

/**
 * A non-negative number field starting at `start` (up to a comma or `to`) into row[slot]: plain
 * decimal digits are read as they are passed over, anything else goes the long way
 * (generalNumber). An empty field leaves NaN. Returns the end of the field, or −1 when it is not
 * a number the general reader would accept without remark.
 */
function numberField(buffer: Buffer, start: number, to: number, row: Float64Array, slot: number): number {
  let mantissa = 0;
  let digits = 0;
  let fraction = 0;
  let point = 0;
  let byte = 0;
  let k = start;
  for (; k < to; k++) {
    byte = buffer[k] as number;
    const digit = byte - 48;
    if (digit >= 0 && digit <= 9) {
      mantissa = mantissa * 10 + digit;
      digits++;
      fraction += point;
    } else if (byte === 46 && point === 0) {
      point = 1;
    } else {
      break;
    }
  }
  if ((k < to && byte !== COMMA) || digits > 15) {
    while (k < to && buffer[k] !== COMMA) k++;
    const value = generalNumber(buffer, start, k);
    if (!(value >= 0)) return -1;
    row[slot] = value;
  } else if (digits > 0) {
    row[slot] = fraction === 0 ? mantissa : mantissa / (POW10[fraction] as number);
  } else if (k > start) {
    return -1; // a lone point
  }
  return k;
}

/** Returned by BodyIds.field for an id that is plain but not in the inventory. */
const UNKNOWN_BODY = -2;

/**
 * The body-id field of each row, looked up in the inventory; usually the same bytes as the row
 * before (files are mostly sorted by body), which are then compared, not looked up.
 */
class BodyIds {
  private readonly previous = new Uint8Array(256);
  private previousLength = -1;
  /** Inventory position of the last id read. */
  body = -1;

  constructor(private readonly index: Map<string, number>) {}

  /** Reads the id at `start`; returns the end of the field, −1 for an id the fast path will not take, UNKNOWN_BODY for one not in the inventory. */
  field(buffer: Buffer, start: number, to: number): number {
    const length = this.previousLength;
    let same = length > 0 && start + length <= to;
    for (let b = 0; same && b < length; b++) same = buffer[start + b] === this.previous[b];
    if (same && (start + length === to || buffer[start + length] === COMMA)) return start + length;
    let k = start;
    let high = 0;
    while (k < to && buffer[k] !== COMMA) high |= buffer[k++] as number;
    const size = k - start;
    if (size === 0 || size > this.previous.length || high >= 128 || (buffer[start] as number) <= 32 || (buffer[k - 1] as number) <= 32)
      return -1;
    const position = this.index.get(buffer.toString('latin1', start, k));
    if (position === undefined) return UNKNOWN_BODY;
    this.previous.set(buffer.subarray(start, k));
    this.previousLength = size;
    this.body = position;
    return k;
  }
}

/** A month YYYY-MM from 7 bytes, as year × 12 + month − 1; NaN when it is not one. */
function monthAt8(buffer: Uint8Array, from: number, to: number): number {
  // YYYY-MM-01 stands for its month, as in the general reader (cells.ts).
  if (to - from === 10 && buffer[from + 7] === 45 && buffer[from + 8] === 48 && buffer[from + 9] === 49) to -= 3;
  if (to - from !== 7 || buffer[from + 4] !== 45) return Number.NaN;
  let year = 0;
  for (let k = 0; k < 4; k++) {
    const digit = (buffer[from + k] as number) - 48;
    if (digit < 0 || digit > 9) return Number.NaN;
    year = year * 10 + digit;
  }
  const tens = (buffer[from + 5] as number) - 48;
  const units = (buffer[from + 6] as number) - 48;
  const month = tens * 10 + units;
  if (tens < 0 || tens > 1 || units < 0 || units > 9 || month < 1 || month > 12) return Number.NaN;
  return year * 12 + month - 1;
}

/** Exponents and long numbers: JavaScript's conversion, on the shapes the general reader allows. */
function generalNumber(buffer: Buffer, from: number, to: number): number {
  for (let k = from; k < to; k++) {
    const byte = buffer[k] as number;
    if (!((byte >= 48 && byte <= 57) || byte === 46 || byte === 45 || byte === 43 || byte === 101 || byte === 69)) return Number.NaN;
  }
  const value = to > from ? +buffer.toString('latin1', from, to) : Number.NaN;
  return Number.isFinite(value) ? value : Number.NaN;
}

/** Index of the candidate equal to buffer[from, to), or −1. */
function matchOne(buffer: Uint8Array, from: number, to: number, candidates: Uint8Array[]): number {
  for (let c = 0; c < candidates.length; c++) {
    const candidate = candidates[c] as Uint8Array;
    if (candidate.length !== to - from) continue;
    let k = 0;
    while (k < candidate.length && candidate[k] === buffer[from + k]) k++;
    if (k === candidate.length) return c;
  }
  return -1;
}
