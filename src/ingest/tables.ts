/**
 * Readers for the bulletin's tables (formats in docs/input-format.md). Large tables (surface area,
 * water quality) are kept as typed columns, the small ones as records. A bad cell drops its row
 * and is reported with file, line and column; nothing is guessed.
 */
import { say } from '../common/problemMessages.ts';
import { slugOf } from '../text/slug.ts';
import { isolateBidi } from '../text/bidi.ts';
import { MAX_ID_LENGTH, MAX_NAME_LENGTH } from './geojson.ts';
import { CellReader } from './cells.ts';
import { GrowableFloat64, GrowableInt32, SeenBits } from './columns.ts';
import { readTable } from './csv.ts';
import { readAreaFast, readQualityFast } from './largeTables.ts';

import { FIRST_MONTH, monthLabel } from '../common/months.ts';
import type { ProblemList } from './problems.ts';
import {
  QUALITY_PARAMETERS,
  QUALITY_UNITS,
  type AreaTable,
  type DistributionBin,
  type FieldRecord,
  type TurbidityUnit,
  type QualityParameter,
  type QualityTable,
  type RainfallRecord,
  type ReadContext,
  type StorageCurve,
  type StorageFit,
  type WaterBody,
} from './tableTypes.ts';

/** Column specs: the required, the optional, and the ones the configuration says to skip (tables.ignoreColumns), read by nobody and warned about never. */
const spec = (context: ReadContext, required: string[], optional: string[] = []) => [
  ...required.map((name) => ({ name, required: true })),
  ...optional.map((name) => ({ name, required: false })),
  ...(context.ignoreColumns ?? [])
    .filter((name) => !required.includes(name) && !optional.includes(name))
    .map((name) => ({ name, required: false })),
];

/** Months after the bulletin month belong to a later issue: skipped with one warning per file. */
class LaterMonths {
  private count = 0;
  private firstLine = 0;
  constructor(
    private readonly file: string,
    private readonly context: ReadContext,
  ) {}
  skip(month: number, line: number): boolean {
    if (month <= this.context.bulletinMonth) return false;
    if (this.count++ === 0) this.firstLine = line;
    return true;
  }
  report(): void {
    if (this.count === 0) return;
    this.context.problems.warning({
      code: 'month-after-bulletin',
      file: this.file,
      line: this.firstLine,
      column: 'month',
      value: String(this.count),
      expected: `months up to ${monthLabel(this.context.bulletinMonth)}`,
      message: say('month-after-bulletin', { count: this.count }),
      params: { count: this.count, month: monthLabel(this.context.bulletinMonth) },
    });
  }
}

/** The inventory position of a row's water body, or undefined after reporting an id the inventory does not list. */
function inventoryPosition(cells: CellReader, index: Map<string, number>, id: string, line: number): number | undefined {
  const position = index.get(id);
  if (position === undefined) cells.fail(line, 'body_id', id, 'unknown-body', 'an id from the water-body inventory', say('unknown-body'));
  return position;
}

function monthInRange(cells: CellReader, month: number, raw: string, line: number): boolean {
  if (Number.isNaN(month)) return false;
  if (month < FIRST_MONTH) {
    cells.fail(line, 'month', raw, 'month-out-of-range', `a month from ${monthLabel(FIRST_MONTH)} on`, say('month-too-early'));
    return false;
  }
  return true;
}

export async function readInventory(path: string, label: string, context: ReadContext): Promise<WaterBody[]> {
  const bodies: WaterBody[] = [];
  const seen = new Map<string, number>();
  const slugs = new Map<string, { id: string; line: number }>();
  const cells = new CellReader(label, context.problems, context.decimal);
  const columns = spec(context, ['body_id', 'name', 'subregion_id', 'lon', 'lat', 'reference_area_ha', 'kind', 'own_page']);
  await readTable(path, label, columns, context.problems, (values, line, at) => {
    cells.startRow();
    const body: WaterBody = {
      id: cells.text(values, at.body_id!, 'body_id', line),
      name: isolateBidi(cells.text(values, at.name!, 'name', line)),
      subRegionId: cells.text(values, at.subregion_id!, 'subregion_id', line),
      lon: cells.number(values, at.lon!, 'lon', line, -180, 180),
      lat: cells.number(values, at.lat!, 'lat', line, -90, 90),
      referenceHa: cells.number(values, at.reference_area_ha!, 'reference_area_ha', line, 0),
      kind: cells.text(values, at.kind!, 'kind', line),
      ownPage: cells.flag(values, at.own_page!, 'own_page', line),
      line,
    };
    if (body.referenceHa === 0)
      cells.fail(
        line,
        'reference_area_ha',
        values[at.reference_area_ha!] ?? '',
        'value-out-of-range',
        'more than 0',
        say('reference-area-zero'),
      );
    const earlier = seen.get(body.id);
    if (earlier !== undefined) {
      cells.fail(line, 'body_id', body.id, 'duplicate-id', 'each id once', say('duplicate-id', { line: earlier }));
      return;
    }
    seen.set(body.id, line);
    if (body.id.length > MAX_ID_LENGTH)
      cells.fail(line, 'body_id', body.id, 'value-too-long', `an id of at most ${MAX_ID_LENGTH} characters`, say('id-too-long'));
    if (body.name.length > MAX_NAME_LENGTH)
      cells.fail(line, 'name', body.name, 'value-too-long', `a name of at most ${MAX_NAME_LENGTH} characters`, say('name-too-long'));
    // A body's page path comes from its id: two ids may not make the same path (S1 and s1).
    const slug = slugOf(body.id);
    const sameSlug = slugs.get(slug);
    if (sameSlug !== undefined)
      cells.fail(
        line,
        'body_id',
        body.id,
        'id-path-collision',
        `an id that differs from "${sameSlug.id}" (line ${sameSlug.line}) in more than case or punctuation`,
        say('id-path-collision'),
      );
    else slugs.set(slug, { id: body.id, line });
    if (cells.rowOk) bodies.push(body);
  });
  return bodies;
}

export async function readSurfaceArea(path: string, label: string, bodies: WaterBody[], context: ReadContext): Promise<AreaTable> {
  // A clean plain CSV takes the fast path; anything it cannot vouch for is read below and reported.
  const fast = context.fastPath === false ? null : await readAreaFast(path, bodies, context);
  if (fast) return fast;
  const index = new Map(bodies.map((body, k) => [body.id, k]));
  const cells = new CellReader(label, context.problems, context.decimal);
  const later = new LaterMonths(label, context);
  const seen = new SeenBits(bodies.length, FIRST_MONTH, Math.max(1, context.bulletinMonth - FIRST_MONTH + 1));
  const body = new GrowableInt32();
  const month = new GrowableInt32();
  const water = new GrowableFloat64();
  const share = new GrowableFloat64();
  const scenes = new GrowableFloat64();
  const lines = new GrowableInt32();
  const duplicates: Array<{ body: number; month: number; line: number }> = [];
  await readTable(
    path,
    label,
    spec(context, ['body_id', 'month', 'water_area_ha', 'observed_share'], ['scenes']),
    context.problems,
    (values, line, at) => {
      cells.startRow();
      const id = cells.text(values, at.body_id!, 'body_id', line);
      const monthText = values[at.month!] ?? '';
      const when = cells.month(values, at.month!, 'month', line);
      const observed = cells.number(values, at.observed_share!, 'observed_share', line, 0, 1);
      // A month fully under cloud may leave the area empty: with an observed share of 0 it means "not seen".
      const waterHa = cells.number(values, at.water_area_ha!, 'water_area_ha', line, 0, Infinity, observed === 0);
      const sceneCount = at.scenes! >= 0 ? cells.number(values, at.scenes!, 'scenes', line, 0, Infinity, true) : Number.NaN;
      if (!cells.rowOk || !monthInRange(cells, when, monthText, line) || later.skip(when, line)) return;
      const position = inventoryPosition(cells, index, id, line);
      if (position === undefined) return;
      if (seen.testAndSet(position, when)) {
        duplicates.push({ body: position, month: when, line });
        return;
      }
      const reference = (bodies[position] as WaterBody).referenceHa;
      if (waterHa > 1.5 * reference) {
        context.problems.warning({
          code: 'area-above-reference',
          file: label,
          line,
          column: 'water_area_ha',
          value: values[at.water_area_ha!] ?? '',
          expected: `at most 1.5 × the reference area (${reference} ha)`,
          message: say('area-above-reference'),
          params: { reference },
        });
      }
      body.push(position);
      month.push(when);
      water.push(waterHa);
      share.push(observed);
      scenes.push(sceneCount);
      lines.push(line);
    },
    (file) => (cells.file = file),
  );
  later.report();
  const table: AreaTable = {
    length: body.length,
    body: body.done(),
    month: month.done(),
    waterHa: water.done(),
    observedShare: share.done(),
    scenes: scenes.done(),
  };
  reportDuplicates(duplicates, table, lines.done(), label, context.problems, 'duplicate-row');
  return table;
}

/** Names the first line of each repeated (body, month) by one scan over the kept rows. */
function reportDuplicates(
  duplicates: Array<{ body: number; month: number; line: number }>,
  table: { body: Int32Array; month: Int32Array; length: number },
  lines: Int32Array,
  label: string,
  problems: ProblemList,
  id: 'duplicate-row' | 'duplicate-row-parameter',
  parameter?: Int32Array,
  parameters?: number[],
): void {
  if (duplicates.length === 0) return;
  const key = (b: number, m: number, p: number) => `${b} ${m} ${p}`;
  const firstLine = new Map<string, number>();
  for (let k = 0; k < table.length; k++)
    firstLine.set(key(table.body[k] as number, table.month[k] as number, parameter ? (parameter[k] as number) : 0), lines[k] as number);
  duplicates.forEach((duplicate, k) => {
    const earlier = firstLine.get(key(duplicate.body, duplicate.month, parameters?.[k] ?? 0));
    problems.error({
      code: 'duplicate-row',
      file: label,
      line: duplicate.line,
      column: 'month',
      value: monthLabel(duplicate.month),
      expected: 'one row per water body and month',
      message: say(id, { line: earlier ?? '?' }),
    });
  });
}

const QUANTILE_COLUMNS = ['p10', 'p25', 'median', 'p75', 'p90'] as const;

export async function readQuality(path: string, label: string, bodies: WaterBody[], context: ReadContext): Promise<QualityTable> {
  const fast = context.fastPath === false ? null : await readQualityFast(path, bodies, context);
  if (fast) return fast;
  const index = new Map(bodies.map((body, k) => [body.id, k]));
  const cells = new CellReader(label, context.problems, context.decimal);
  const later = new LaterMonths(label, context);
  const seen = QUALITY_PARAMETERS.map(() => new SeenBits(bodies.length, FIRST_MONTH, Math.max(1, context.bulletinMonth - FIRST_MONTH + 1)));
  const body = new GrowableInt32();
  const month = new GrowableInt32();
  const parameter = new GrowableInt32();
  const medians = new GrowableFloat64();
  const pixels = new GrowableFloat64();
  const lines = new GrowableInt32();
  const duplicates: Array<{ body: number; month: number; line: number }> = [];
  const duplicateParameters: number[] = [];
  let turbidityUnit: { unit: TurbidityUnit; line: number } | null = null;
  await readTable(
    path,
    label,
    spec(context, ['body_id', 'month', 'parameter', 'unit', 'median'], ['p10', 'p25', 'p75', 'p90', 'valid_pixels']),
    context.problems,
    (values, line, at) => {
      cells.startRow();
      const id = cells.text(values, at.body_id!, 'body_id', line);
      const monthText = values[at.month!] ?? '';
      const when = cells.month(values, at.month!, 'month', line);
      const name = cells.text(values, at.parameter!, 'parameter', line);
      const unit = cells.text(values, at.unit!, 'unit', line);
      const found = QUANTILE_COLUMNS.map((column) =>
        at[column]! >= 0 ? cells.number(values, at[column]!, column, line, 0, Infinity, column !== 'median') : Number.NaN,
      );
      const validPixels =
        at.valid_pixels! >= 0 ? cells.number(values, at.valid_pixels!, 'valid_pixels', line, 0, Infinity, true) : Number.NaN;
      const code = QUALITY_PARAMETERS.indexOf(name as QualityParameter);
      if (name !== '' && code < 0)
        cells.fail(line, 'parameter', name, 'parameter-unknown', QUALITY_PARAMETERS.join(' or '), say('parameter-unknown'));
      if (code >= 0 && unit !== '' && !QUALITY_UNITS[QUALITY_PARAMETERS[code] as QualityParameter].includes(unit)) {
        cells.fail(
          line,
          'unit',
          unit,
          'unit-mismatch',
          QUALITY_UNITS[QUALITY_PARAMETERS[code] as QualityParameter].join(' or '),
          say('unit-mismatch', { name }),
        );
      } else if (name === 'turbidity' && unit !== '') {
        // One turbidity unit a table: NTU and FNU are measured with different light and are not interchangeable.
        if (turbidityUnit === null) turbidityUnit = { unit: unit as TurbidityUnit, line };
        else if (unit !== turbidityUnit.unit)
          cells.fail(
            line,
            'unit',
            unit,
            'unit-mixed',
            `${turbidityUnit.unit}, the turbidity unit of this table since line ${turbidityUnit.line}`,
            say('unit-mixed'),
          );
      }
      const present = found.filter((value) => !Number.isNaN(value));
      if (present.some((value, k) => k > 0 && value < (present[k - 1] as number))) {
        cells.fail(
          line,
          'median',
          found.map((v) => (Number.isNaN(v) ? '' : String(v))).join(' '),
          'quantiles-out-of-order',
          'p10 ≤ p25 ≤ median ≤ p75 ≤ p90',
          say('quantiles-out-of-order'),
        );
      }
      if (!cells.rowOk || !monthInRange(cells, when, monthText, line) || later.skip(when, line)) return;
      const position = inventoryPosition(cells, index, id, line);
      if (position === undefined) return;
      if ((seen[code] as SeenBits).testAndSet(position, when)) {
        duplicates.push({ body: position, month: when, line });
        duplicateParameters.push(code);
        return;
      }
      body.push(position);
      month.push(when);
      parameter.push(code);
      medians.push(found[2] as number);
      pixels.push(validPixels);
      lines.push(line);
    },
    (file) => (cells.file = file),
  );
  later.report();
  const table: QualityTable = {
    length: body.length,
    body: body.done(),
    month: month.done(),
    parameter: parameter.done(),
    median: medians.done(),
    validPixels: Float32Array.from(pixels.done()),
    turbidityUnit: (turbidityUnit as { unit: TurbidityUnit } | null)?.unit ?? null,
  };
  reportDuplicates(
    duplicates,
    table,
    lines.done(),
    label,
    context.problems,
    'duplicate-row-parameter',
    table.parameter,
    duplicateParameters,
  );
  return table;
}

export async function readRainfall(
  path: string,
  label: string,
  subRegionIds: Set<string>,
  context: ReadContext,
): Promise<RainfallRecord[]> {
  const records: RainfallRecord[] = [];
  const seen = new Map<string, number>();
  const cells = new CellReader(label, context.problems, context.decimal);
  const later = new LaterMonths(label, context);
  await readTable(path, label, spec(context, ['subregion_id', 'month', 'rainfall_mm']), context.problems, (values, line, at) => {
    cells.startRow();
    const subRegionId = cells.text(values, at.subregion_id!, 'subregion_id', line);
    const monthText = values[at.month!] ?? '';
    const month = cells.month(values, at.month!, 'month', line);
    const rainfallMm = cells.number(values, at.rainfall_mm!, 'rainfall_mm', line, 0);
    if (!cells.rowOk || !monthInRange(cells, month, monthText, line) || later.skip(month, line)) return;
    if (subRegionIds.size > 0 && !subRegionIds.has(subRegionId)) {
      cells.fail(
        line,
        'subregion_id',
        subRegionId,
        'unknown-subregion',
        'a sub-region of the boundaries file',
        say('subregion-without-boundary'),
      );
      return;
    }
    const key = `${subRegionId} ${month}`;
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      cells.fail(
        line,
        'month',
        monthText,
        'duplicate-row',
        'one row per sub-region and month',
        say('duplicate-subregion-month', { line: earlier }),
      );
      return;
    }
    seen.set(key, line);
    records.push({ subRegionId, month, rainfallMm, line });
  });
  later.report();
  return records;
}

export async function readField(path: string, label: string, bodies: WaterBody[], context: ReadContext): Promise<FieldRecord[]> {
  const index = new Map(bodies.map((body, k) => [body.id, k]));
  const records: FieldRecord[] = [];
  const cells = new CellReader(label, context.problems, context.decimal);
  const later = new LaterMonths(label, context);
  await readTable(path, label, spec(context, ['body_id', 'date', 'parameter', 'value', 'unit']), context.problems, (values, line, at) => {
    cells.startRow();
    const bodyId = cells.text(values, at.body_id!, 'body_id', line);
    const day = cells.date(values, at.date!, 'date', line);
    const name = cells.text(values, at.parameter!, 'parameter', line);
    const value = cells.number(values, at.value!, 'value', line, 0);
    const unit = cells.text(values, at.unit!, 'unit', line);
    const parameter = QUALITY_PARAMETERS.find((known) => known === name);
    if (name !== '' && !parameter)
      cells.fail(line, 'parameter', name, 'parameter-unknown', QUALITY_PARAMETERS.join(' or '), say('parameter-unknown'));
    if (parameter && unit !== '' && !QUALITY_UNITS[parameter].includes(unit))
      cells.fail(line, 'unit', unit, 'unit-mismatch', QUALITY_UNITS[parameter].join(' or '), say('unit-mismatch', { name }));
    if (!cells.rowOk || !parameter) return;
    const date = new Date(day * 86_400_000);
    const month = date.getUTCFullYear() * 12 + date.getUTCMonth();
    if (later.skip(month, line)) return;
    const body = inventoryPosition(cells, index, bodyId, line);
    if (body === undefined) return;
    records.push({
      bodyId,
      body,
      day,
      month,
      parameter,
      value,
      line,
      ...(parameter === 'turbidity' ? { turbidityUnit: unit as TurbidityUnit } : {}),
    });
  });
  later.report();
  return records;
}

export async function readDistributionBins(
  path: string,
  label: string,
  subRegionIds: Set<string>,
  context: ReadContext,
): Promise<DistributionBin[]> {
  const bins: DistributionBin[] = [];
  const cells = new CellReader(label, context.problems, context.decimal);
  const later = new LaterMonths(label, context);
  await readTable(
    path,
    label,
    spec(context, ['subregion_id', 'month', 'parameter', 'bin_lower', 'bin_upper', 'pixel_count']),
    context.problems,
    (values, line, at) => {
      cells.startRow();
      const subRegionId = cells.text(values, at.subregion_id!, 'subregion_id', line);
      const month = cells.month(values, at.month!, 'month', line);
      const name = cells.text(values, at.parameter!, 'parameter', line);
      const lower = cells.number(values, at.bin_lower!, 'bin_lower', line, 0);
      const upper = cells.number(values, at.bin_upper!, 'bin_upper', line, 0);
      const count = cells.number(values, at.pixel_count!, 'pixel_count', line, 0);
      const parameter = QUALITY_PARAMETERS.find((known) => known === name);
      if (name !== '' && !parameter)
        cells.fail(line, 'parameter', name, 'parameter-unknown', QUALITY_PARAMETERS.join(' or '), say('parameter-unknown'));
      if (!Number.isNaN(lower) && !Number.isNaN(upper) && upper <= lower)
        cells.fail(line, 'bin_upper', values[at.bin_upper!] ?? '', 'bin-empty', 'bin_upper above bin_lower', say('bin-empty'));
      if (subRegionIds.size > 0 && subRegionId !== '' && !subRegionIds.has(subRegionId))
        cells.fail(
          line,
          'subregion_id',
          subRegionId,
          'unknown-subregion',
          'a sub-region of the boundaries file',
          say('subregion-without-boundary'),
        );
      if (!cells.rowOk || !parameter || later.skip(month, line)) return;
      bins.push({ subRegionId, month, parameter, lower, upper, count, line });
    },
  );
  later.report();
  return bins;
}

/** The quantities of a curve that must not fall as elevation rises, with their column and unit. */
const CURVE_QUANTITIES = [
  { key: 'area', column: 'area_ha', text: 1, unit: 'ha', article: 'an' },
  { key: 'volume', column: 'volume_hm3', text: 2, unit: 'hm³', article: 'a' },
] as const;

/**
 * The storage curves (inputs.storageCurves): several rows per body of elevation (m), area (ha) and
 * volume (hm³). Per body, sorted by elevation: elevation must rise strictly, area and volume never
 * fall, at least two rows. A bad curve is an error on the line and column that breaks it.
 * `bodies` null (the storage command, which has no inventory): every id of the file is a body, in
 * the order of its first row.
 */
export async function readStorageCurves(
  path: string,
  label: string,
  bodies: Array<{ id: string }> | null,
  context: ReadContext,
): Promise<StorageCurve[]> {
  const index = new Map((bodies ?? []).map((body, k) => [body.id, k]));
  const ids = (bodies ?? []).map((body) => body.id);
  const rows = new Map<number, Array<{ elevation: number; area: number; volume: number; line: number; text: string[] }>>();
  const cells = new CellReader(label, context.problems, context.decimal);
  await readTable(path, label, spec(context, ['body_id', 'elevation_m', 'area_ha', 'volume_hm3']), context.problems, (values, line, at) => {
    cells.startRow();
    const bodyId = cells.text(values, at.body_id!, 'body_id', line);
    const elevation = cells.number(values, at.elevation_m!, 'elevation_m', line, -1000, 10000);
    const area = cells.number(values, at.area_ha!, 'area_ha', line, 0);
    const volume = cells.number(values, at.volume_hm3!, 'volume_hm3', line, 0);
    if (!cells.rowOk) return;
    if (bodies === null && !index.has(bodyId)) {
      index.set(bodyId, ids.length);
      ids.push(bodyId);
    }
    const body = index.get(bodyId);
    if (body === undefined) {
      cells.fail(line, 'body_id', bodyId, 'unknown-body', 'a water body of the inventory', say('curve-unknown-body'));
      return;
    }
    const list = rows.get(body) ?? [];
    list.push({
      elevation,
      area,
      volume,
      line,
      text: [values[at.elevation_m!] ?? '', values[at.area_ha!] ?? '', values[at.volume_hm3!] ?? ''],
    });
    rows.set(body, list);
  });
  const curves: StorageCurve[] = [];
  for (const [body, list] of [...rows.entries()].sort((a, b) => a[0] - b[0])) {
    const id = ids[body] as string;
    const first = Math.min(...list.map((row) => row.line));
    if (list.length < 2) {
      cells.fail(first, 'body_id', id, 'curve-too-short', 'at least two rows per water body', say('curve-too-short'));
      continue;
    }
    const sorted = [...list].sort((a, b) => a.elevation - b.elevation || a.line - b.line);
    let ok = true;
    for (let k = 1; k < sorted.length; k++) {
      const before = sorted[k - 1]!;
      const row = sorted[k]!;
      const later = row.line > before.line ? row : before;
      if (row.elevation === before.elevation) {
        cells.fail(
          later.line,
          'elevation_m',
          later.text[0]!,
          'curve-duplicate-elevation',
          'one row per elevation',
          say('curve-duplicate-elevation', { line: Math.min(row.line, before.line), id }),
        );
        ok = false;
      } else {
        // Area, then volume: the first that falls is reported.
        const falling = CURVE_QUANTITIES.find((quantity) => row[quantity.key] < before[quantity.key]);
        if (falling) {
          cells.fail(
            row.line,
            falling.column,
            row.text[falling.text]!,
            'curve-falls',
            `${falling.article} ${falling.key} of at least ${before[falling.key]} ${falling.unit} (line ${before.line}, a lower elevation)`,
            say('curve-falls', { quantity: falling.key, id }),
          );
          ok = false;
        }
      }
    }
    if (!ok) continue;
    curves.push({
      body,
      id,
      elevationM: Float64Array.from(sorted, (row) => row.elevation),
      areaHa: Float64Array.from(sorted, (row) => row.area),
      volumeHm3: Float64Array.from(sorted, (row) => row.volume),
      line: first,
    });
  }
  return curves;
}

/**
 * Fitted area–volume power laws (inputs.storageFits): one row per body, V = coefficient × A^exponent
 * (hm³ from ha) between min_area_ha and max_area_ha. A body may have a curve or a fit, not both.
 */
export async function readStorageFits(
  path: string,
  label: string,
  bodies: Array<{ id: string }>,
  curves: StorageCurve[],
  context: ReadContext,
): Promise<StorageFit[]> {
  const index = new Map(bodies.map((body, k) => [body.id, k]));
  const withCurve = new Set(curves.map((curve) => curve.body));
  const seen = new Map<number, number>();
  const fits: StorageFit[] = [];
  const cells = new CellReader(label, context.problems, context.decimal);
  await readTable(
    path,
    label,
    spec(context, ['body_id', 'coefficient', 'exponent', 'min_area_ha', 'max_area_ha']),
    context.problems,
    (values, line, at) => {
      cells.startRow();
      const id = cells.text(values, at.body_id!, 'body_id', line);
      const coefficient = cells.number(values, at.coefficient!, 'coefficient', line, Number.MIN_VALUE);
      const exponent = cells.number(values, at.exponent!, 'exponent', line, Number.MIN_VALUE, 10);
      const minAreaHa = cells.number(values, at.min_area_ha!, 'min_area_ha', line, 0);
      const maxAreaHa = cells.number(values, at.max_area_ha!, 'max_area_ha', line, 0);
      if (!cells.rowOk) return;
      const body = index.get(id);
      if (body === undefined) {
        cells.fail(line, 'body_id', id, 'unknown-body', 'a water body of the inventory', say('fit-unknown-body'));
        return;
      }
      if (!(maxAreaHa > minAreaHa)) {
        cells.fail(
          line,
          'max_area_ha',
          values[at.max_area_ha!] ?? '',
          'value-out-of-range',
          `more than min_area_ha (${minAreaHa})`,
          say('fit-range-empty'),
        );
        return;
      }
      if (withCurve.has(body)) {
        cells.fail(line, 'body_id', id, 'duplicate-row', 'a curve or a fit per body, not both', say('fit-and-curve'));
        return;
      }
      const earlier = seen.get(body);
      if (earlier !== undefined) {
        cells.fail(line, 'body_id', id, 'duplicate-row', 'one fit per body', say('fit-twice', { line: earlier }));
        return;
      }
      seen.set(body, line);
      fits.push({ body, id, coefficient, exponent, minAreaHa, maxAreaHa, line });
    },
  );
  return fits.sort((a, b) => a.body - b.body);
}
