/**
 * Readers for the bulletin's tables. Each turns text fields into typed records and reports every
 * bad value as a Problem naming file, line and column; a bad row is left out, never guessed at.
 */
import type { ProblemList } from './problems.ts';
import { readCsv } from './csv.ts';
import { parseMonth } from './months.ts';

export interface WaterBody {
  id: string;
  name: string;
  subRegionId: string;
  lon: number;
  lat: number;
  referenceHa: number;
  kind: string;
  ownPage: boolean;
}

export interface AreaRecord {
  bodyId: string;
  month: number;
  waterHa: number;
  observedShare: number;
  scenes: number;
}

export interface RainfallRecord {
  subRegionId: string;
  month: number;
  rainfallMm: number;
}

/** Field parsing for one row: each method records a problem and returns null on a bad value. */
class RowReader {
  constructor(
    private readonly fields: Record<string, string>,
    private readonly line: number,
    private readonly file: string,
    private readonly problems: ProblemList,
  ) {}

  ok = true;

  private fail(code: string, column: string, expected: string, message: string): null {
    this.ok = false;
    this.problems.error({ code, file: this.file, line: this.line, column, value: this.fields[column] ?? '', expected, message });
    return null;
  }

  text(column: string): string {
    const value = this.fields[column] ?? '';
    if (value === '') this.fail('value-empty', column, 'a value', 'the value is empty');
    return value;
  }

  number(column: string, { min = -Infinity, max = Infinity } = {}): number {
    const raw = this.fields[column] ?? '';
    // Number('') is 0 and Number('1e') is NaN; only plain decimal notation is accepted.
    if (!/^-?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(raw)) {
      this.fail(raw === '' ? 'value-empty' : 'value-not-number', column, 'a finite number', raw === '' ? 'the value is empty' : 'the value is not a number');
      return Number.NaN;
    }
    const value = Number(raw);
    if (value < min || value > max) {
      this.fail('value-out-of-range', column, max === Infinity ? `at least ${min}` : `from ${min} to ${max}`, 'the value is out of range');
    }
    return value;
  }

  month(column: string): number {
    const value = parseMonth(this.fields[column] ?? '');
    if (value === null) {
      this.fail('month-invalid', column, 'a month as YYYY-MM', 'the month cannot be read');
      return Number.NaN;
    }
    return value;
  }

  flag(column: string): boolean {
    const value = (this.fields[column] ?? '').toLowerCase();
    if (value === 'yes' || value === 'no') return value === 'yes';
    this.fail('value-not-flag', column, 'yes or no', 'the value is not yes or no');
    return false;
  }
}

export async function readInventory(path: string, label: string, problems: ProblemList): Promise<WaterBody[]> {
  const bodies: WaterBody[] = [];
  const seen = new Map<string, number>();
  const columns = ['body_id', 'name', 'subregion_id', 'lon', 'lat', 'reference_area_ha', 'kind', 'own_page'].map((name) => ({ name, required: true }));
  await readCsv(path, label, columns, problems, (fields, line) => {
    const row = new RowReader(fields, line, label, problems);
    const body: WaterBody = {
      id: row.text('body_id'),
      name: row.text('name'),
      subRegionId: row.text('subregion_id'),
      lon: row.number('lon', { min: -180, max: 180 }),
      lat: row.number('lat', { min: -90, max: 90 }),
      referenceHa: row.number('reference_area_ha', { min: 0 }),
      kind: row.text('kind'),
      ownPage: row.flag('own_page'),
    };
    const earlier = seen.get(body.id);
    if (earlier !== undefined) {
      problems.error({ code: 'duplicate-id', file: label, line, column: 'body_id', value: body.id, expected: 'each id once', message: `the id already appears on line ${earlier}` });
      return;
    }
    seen.set(body.id, line);
    if (row.ok) bodies.push(body);
  });
  return bodies;
}

export async function readSurfaceArea(path: string, label: string, knownIds: Set<string>, problems: ProblemList): Promise<AreaRecord[]> {
  const records: AreaRecord[] = [];
  const seen = new Map<string, number>();
  const columns = ['body_id', 'month', 'water_area_ha', 'observed_share', 'scenes'].map((name) => ({ name, required: name !== 'scenes' }));
  await readCsv(path, label, columns, problems, (fields, line) => {
    const row = new RowReader(fields, line, label, problems);
    const bodyId = row.text('body_id');
    const month = row.month('month');
    const record: AreaRecord = {
      bodyId,
      month,
      waterHa: row.number('water_area_ha', { min: 0 }),
      observedShare: row.number('observed_share', { min: 0, max: 1 }),
      scenes: fields.scenes === undefined ? 0 : row.number('scenes', { min: 0 }),
    };
    if (!row.ok) return;
    if (!knownIds.has(bodyId)) {
      problems.error({ code: 'unknown-body', file: label, line, column: 'body_id', value: bodyId, expected: 'an id from the water-body inventory', message: 'the water body is not in the inventory' });
      return;
    }
    const key = `${bodyId} ${month}`;
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      problems.error({ code: 'duplicate-row', file: label, line, column: 'month', value: fields.month ?? '', expected: 'one row per water body and month', message: `the same water body and month already appear on line ${earlier}` });
      return;
    }
    seen.set(key, line);
    records.push(record);
  });
  return records;
}

export async function readRainfall(path: string, label: string, problems: ProblemList): Promise<RainfallRecord[]> {
  const records: RainfallRecord[] = [];
  const columns = ['subregion_id', 'month', 'rainfall_mm'].map((name) => ({ name, required: true }));
  await readCsv(path, label, columns, problems, (fields, line) => {
    const row = new RowReader(fields, line, label, problems);
    const record = { subRegionId: row.text('subregion_id'), month: row.month('month'), rainfallMm: row.number('rainfall_mm', { min: 0 }) };
    if (row.ok) records.push(record);
  });
  return records;
}
