/**
 * The large tables read by the fast path (plainScan.ts) when the file allows it: the file is cut
 * into byte ranges at line ends, the ranges are scanned on the worker pool (in this thread for a
 * small file), and the columns are joined in file order with their line numbers made absolute.
 * Repeated (body, month[, parameter]) rows are looked for over the joined columns. Returns null
 * whenever the fast path gave up or anything needs reporting: the caller then runs the general
 * reader, which reports it.
 */
import { createHash } from 'node:crypto';
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { sharedPool } from '../parallel/pool.ts';
import { SeenBits } from './columns.ts';
import {
  plainHeader,
  SCAN,
  scanRange,
  type ScanColumns,
  type ScanInventory,
  type ScanKind,
  type ScanResult,
  type ScanTask,
} from './plainScan.ts';
import { QUALITY_PARAMETERS, type AreaTable, type QualityTable, type ReadContext, type WaterBody } from './tableTypes.ts';
import { FIRST_MONTH } from '../common/months.ts';

/** Files above this size are scanned in parallel; smaller ones in this thread. */
const PARALLEL_BYTES = 24 << 20;
/** Bytes per range: small enough to balance the threads, large enough to keep the joins few. */
const RANGE_BYTES = 48 << 20;

export async function readAreaFast(path: string, bodies: WaterBody[], context: ReadContext): Promise<AreaTable | null> {
  const joined = await scanFile('area', path, bodies, context);
  if (!joined) return null;
  const [waterHa, observedShare, scenes] = joined.values as [Float64Array, Float64Array, Float64Array];
  const table: AreaTable = { length: joined.body.length, body: joined.body, month: joined.month, waterHa, observedShare, scenes };
  return hasRepeats(table, bodies.length, context.bulletinMonth) ? null : table;
}

export async function readQualityFast(path: string, bodies: WaterBody[], context: ReadContext): Promise<QualityTable | null> {
  const joined = await scanFile('quality', path, bodies, context);
  if (!joined) return null;
  const [median, validPixels] = joined.values as [Float64Array, Float64Array];
  const table: QualityTable = {
    length: joined.body.length,
    body: joined.body,
    month: joined.month,
    parameter: joined.parameter as Int32Array,
    median,
    validPixels: Float32Array.from(validPixels),
    // The fast path takes turbidity in FNU only (plainScan.ts); a table in NTU takes the general reader.
    turbidityUnit: joined.parameter?.includes(QUALITY_PARAMETERS.indexOf('turbidity')) ? 'FNU' : null,
  };
  return hasRepeats(table, bodies.length, context.bulletinMonth, table.parameter) ? null : table;
}

function hasRepeats(
  table: { length: number; body: Int32Array; month: Int32Array },
  bodies: number,
  bulletinMonth: number,
  parameter?: Int32Array,
): boolean {
  const months = Math.max(1, bulletinMonth - FIRST_MONTH + 1);
  const seen = (parameter ? QUALITY_PARAMETERS : [null]).map(() => new SeenBits(bodies, FIRST_MONTH, months));
  for (let k = 0; k < table.length; k++) {
    if ((seen[parameter ? (parameter[k] as number) : 0] as SeenBits).testAndSet(table.body[k] as number, table.month[k] as number))
      return true;
  }
  return false;
}

async function scanFile(kind: ScanKind, path: string, bodies: WaterBody[], context: ReadContext): Promise<ScanColumns | null> {
  if (context.decimal === ',' || path.toLowerCase().endsWith('.parquet')) return null;
  const layout = rangesOf(path);
  if (!layout || !plainHeader(kind, layout.header)) return null;
  const ids = bodies.map((body) => body.id);
  const referenceHa = Float64Array.from(bodies, (body) => body.referenceHa);
  const key = createHash('sha256').update(ids.join('\n')).update(new Uint8Array(referenceHa.buffer)).digest('hex');
  const inventory: ScanInventory = { key, ids, referenceHa };
  const tasks: ScanTask[] = layout.ranges.map(([start, end]) => ({
    kind,
    path,
    start,
    end,
    header: layout.header,
    bulletinMonth: context.bulletinMonth,
  }));
  const parallel = layout.size > PARALLEL_BYTES && sharedPool().size > 1;
  let scanned = 0;
  const name = path.split(/[\\/]/).pop() ?? path;
  const report = (result: ScanResult) => {
    scanned++;
    context.onStep?.(`${name}: part ${scanned} of ${tasks.length}`);
    return result;
  };
  const results: ScanResult[] = parallel
    ? await Promise.all(tasks.map((task) => sharedPool().run(SCAN, { task, inventory }).then(report)))
    : tasks.map((task) => report(scanRange(task, inventory)));
  if (results.some((result) => !result.ok)) return null;
  const parts = results as Array<Extract<ScanResult, { ok: true }>>;
  const rows = parts.reduce((sum, part) => sum + part.rows, 0);
  if (rows === 0) return null;
  // Join in file order.
  const first = (parts[0] as (typeof parts)[number]).columns;
  const joined: ScanColumns = {
    body: new Int32Array(rows),
    month: new Int32Array(rows),
    values: first.values.map(() => new Float64Array(rows)),
    ...(first.parameter ? { parameter: new Int32Array(rows) } : {}),
  };
  let at = 0;
  for (let p = 0; p < parts.length; p++) {
    const part = parts[p] as (typeof parts)[number];
    const { columns } = part;
    delete parts[p]; // its columns can go as soon as they are copied: the peak stays near one table
    joined.body.set(columns.body, at);
    joined.month.set(columns.month, at);
    columns.values.forEach((column, c) => (joined.values[c] as Float64Array).set(column, at));
    if (columns.parameter) joined.parameter?.set(columns.parameter, at);
    at += part.rows;
  }
  return joined;
}

/** The header (column names) and byte ranges of whole lines after it; null when the file does not suit. */
function rangesOf(path: string): { header: string[]; size: number; ranges: Array<[number, number]> } | null {
  let handle: number;
  try {
    handle = openSync(path, 'r');
  } catch {
    return null; // missing or unreadable: the general reader says which
  }
  if (!fstatSync(handle).isFile()) {
    closeSync(handle);
    return null; // a folder of partitions: the general reader's
  }
  try {
    const size = fstatSync(handle).size;
    const head = Buffer.alloc(Math.min(size, 1 << 16));
    readSync(handle, head, 0, head.length, 0);
    const bom = head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf ? 3 : 0;
    const newline = head.indexOf(10);
    if (newline < 0) return null;
    const headerText = head.toString('latin1', bom, newline).replace(/\r$/, '');
    if (/["";\r]/.test(headerText) || /[^\x20-\x7e]/.test(headerText)) return null;
    const header = headerText.split(',');
    if (header.some((name: string) => name !== name.trim() || name === '')) return null;
    const dataStart = newline + 1;
    const count = Math.max(1, Math.ceil((size - dataStart) / RANGE_BYTES));
    const ranges: Array<[number, number]> = [];
    const probe = Buffer.alloc(1 << 16);
    let start = dataStart;
    for (let k = 1; k <= count && start < size; k++) {
      let end = k === count ? size : dataStart + Math.floor(((size - dataStart) * k) / count);
      if (end < size) {
        // Move the cut to just after the next newline.
        let found = -1;
        for (let at = end; found < 0 && at < size; at += probe.length) {
          const read = readSync(handle, probe, 0, probe.length, at);
          const index = probe.subarray(0, read).indexOf(10);
          if (index >= 0) found = at + index + 1;
          if (read <= 0) break;
        }
        end = found < 0 ? size : found;
      }
      if (end > start) ranges.push([start, end]);
      start = end;
    }
    return { header, size, ranges };
  } finally {
    closeSync(handle);
  }
}
