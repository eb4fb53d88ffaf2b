/**
 * Stage 1, ingest: reads a bulletin folder (configuration, tables, boundaries) into typed inputs
 * and one list of problems. Nothing here computes a statistic.
 */
import { createHash } from 'node:crypto';
import { existsSync, statSync } from 'node:fs';
import { sha256File } from '../site/files.ts';
import { parquetParts } from './csv.ts';
import { join } from 'node:path';
import { readConfig, type BulletinConfig } from './config.ts';
import { readBoundaries, type SubRegion } from './geojson.ts';
import { monthLabel, parseMonth, yearOf } from './months.ts';
import { ProblemList } from './problems.ts';
import {
  readDistributionBins, readField, readInventory, readQuality, readRainfall, readSurfaceArea,
  type AreaTable, type DistributionBin, type FieldRecord, type QualityTable, type RainfallRecord, type ReadContext, type WaterBody,
} from './tables.ts';

export type { BulletinConfig } from './config.ts';
export type { SubRegion } from './geojson.ts';
export type { AreaTable, DistributionBin, FieldRecord, QualityParameter, QualityTable, RainfallRecord, WaterBody } from './tables.ts';
export { QUALITY_PARAMETERS } from './tables.ts';
export { describeFound, InputError, formatProblem, problemPlace, ProblemList, type Problem } from './problems.ts';
export { monthLabel, parseMonth, calendarMonthOf, yearOf } from './months.ts';

export const CONFIG_FILE = 'bulletin.json';

export interface InputFile {
  /** Path relative to the bulletin folder, with forward slashes. */
  path: string;
  sha256: string;
  bytes: number;
  /** For a folder of Parquet partitions: each partition, relative to the folder. */
  parts?: Array<{ path: string; sha256: string; bytes: number }>;
}

export interface BulletinInputs {
  config: BulletinConfig;
  bulletinMonth: number;
  bodies: WaterBody[];
  area: AreaTable;
  quality: QualityTable | null;
  distribution: DistributionBin[];
  rainfall: RainfallRecord[];
  field: FieldRecord[];
  subRegions: SubRegion[];
  files: InputFile[];
}

export interface IngestResult {
  inputs: BulletinInputs | null;
  problems: ProblemList;
}

/**
 * SHA-256 of an input. For a folder of Parquet partitions: the SHA-256 of its listing in the form
 * `sha256sum` prints (one line per partition, "<hash>  <path>", sorted by path), so the listing can
 * be checked with standard tools; bytes are the partitions' total.
 */
function hashFile(folder: string, path: string): InputFile {
  const full = join(folder, path);
  if (!statSync(full).isDirectory()) return { path, ...sha256File(full) };
  const parts = parquetParts(full).map((part) => ({ part, ...sha256File(join(full, part)) }));
  const listing = parts.map(({ part, sha256 }) => `${sha256}  ${part}\n`).join('');
  return { path, sha256: createHash('sha256').update(listing).digest('hex'), bytes: parts.reduce((sum, part) => sum + part.bytes, 0), parts: parts.map(({ part, sha256, bytes }) => ({ path: part, sha256, bytes })) };
}

/**
 * Reads and checks everything; `inputs` is null when any error was found. `labelPrefix` goes in
 * front of every file name in problems (for archived issues: "archive/2026-10/").
 */
export async function loadBulletin(folder: string, labelPrefix = '', onStep?: (detail: string) => void): Promise<IngestResult> {
  const problems = new ProblemList();
  const config = readConfig(join(folder, CONFIG_FILE), `${labelPrefix}${CONFIG_FILE}`, problems);
  if (!config) return { inputs: null, problems };

  const paths = config.inputs;
  const at = (path: string) => join(folder, path);
  const label = (path: string) => `${labelPrefix}${path}`;
  const bulletinMonth = parseMonth(config.issue.month) as number;
  const context: ReadContext = { problems, bulletinMonth, decimal: config.csv.decimal, ...(onStep ? { onStep } : {}) };
  const subRegions = readBoundaries(at(paths.boundaries), label(paths.boundaries), problems);
  const regionIds = new Set(subRegions.map((region) => region.id));
  const bodies = await readInventory(at(paths.inventory), label(paths.inventory), context);
  onStep?.(label(paths.surfaceArea));
  const area = await readSurfaceArea(at(paths.surfaceArea), label(paths.surfaceArea), bodies, context);
  if (paths.quality) onStep?.(label(paths.quality));
  const quality = paths.quality ? await readQuality(at(paths.quality), label(paths.quality), bodies, context) : null;
  const distribution = paths.distribution ? await readDistributionBins(at(paths.distribution), label(paths.distribution), regionIds, context) : [];
  const rainfall = paths.rainfall ? await readRainfall(at(paths.rainfall), label(paths.rainfall), regionIds, context) : [];
  const field = paths.field ? await readField(at(paths.field), label(paths.field), bodies, context) : [];

  crossCheck(config, bulletinMonth, bodies, area, subRegions, problems, label);
  checkTranslations(folder, config, problems, label);
  if (problems.errors.length > 0) return { inputs: null, problems };

  const used = [paths.inventory, paths.surfaceArea, paths.quality, paths.distribution, paths.rainfall, paths.field, paths.boundaries].filter((path): path is string => Boolean(path));
  onStep?.('input hashes');
  const files = [CONFIG_FILE, ...used].sort().map((path) => hashFile(folder, path));
  return { inputs: { config, bulletinMonth, bodies, area, quality, distribution, rainfall, field, subRegions, files }, problems };
}

/**
 * Editorial text written for the first language but not translated for another: that language's
 * pages will show the original (marked with its language). A warning, so editors notice.
 */
function checkTranslations(folder: string, config: BulletinConfig, problems: ProblemList, label: (path: string) => string): void {
  for (const name of ['foreword', 'notes']) {
    const original = `content/${name}.md`;
    if (!existsSync(join(folder, original))) continue;
    for (const locale of config.locales.slice(1)) {
      const translation = `content/${name}.${locale}.md`;
      if (existsSync(join(folder, translation))) continue;
      problems.warning({ code: 'content-untranslated', file: label(original), line: 0, column: '', value: locale, expected: label(translation), message: `no ${locale} translation: the ${locale} pages show this text in the first language`, params: { locale, translation: label(translation) } });
    }
  }
}

function crossCheck(config: BulletinConfig, bulletinMonth: number, bodies: WaterBody[], area: AreaTable, subRegions: SubRegion[], problems: ProblemList, label: (path: string) => string): void {
  const paths = Object.fromEntries(Object.entries(config.inputs).map(([key, value]) => [key, value === undefined ? undefined : label(value)])) as BulletinConfig['inputs'];
  const configLabel = label(CONFIG_FILE);
  const regionIds = new Set(subRegions.map((region) => region.id));
  if (subRegions.length > 0) {
    const firstLine = new Map<string, number>();
    for (const body of bodies) if (!firstLine.has(body.subRegionId)) firstLine.set(body.subRegionId, body.line);
    for (const [id, line] of firstLine) {
      if (!regionIds.has(id)) {
        problems.error({ code: 'subregion-without-boundary', file: paths.inventory, line, column: 'subregion_id', value: id, expected: `a feature with this subregion_id in ${paths.boundaries}`, message: 'the sub-region has no boundary' });
      }
    }
  }
  if (bodies.length === 0 || area.length === 0) return;
  const hasData = new Uint8Array(bodies.length);
  let inBulletinMonth = false;
  let firstYear = Infinity;
  let lastYear = -Infinity;
  for (let k = 0; k < area.length; k++) {
    hasData[area.body[k] as number] = 1;
    const month = area.month[k] as number;
    if (month === bulletinMonth) inBulletinMonth = true;
    firstYear = Math.min(firstYear, yearOf(month));
    lastYear = Math.max(lastYear, yearOf(month));
  }
  bodies.forEach((body, k) => {
    if (!hasData[k]) problems.warning({ code: 'body-without-data', file: paths.inventory, line: body.line, column: 'body_id', value: body.id, expected: `rows in ${paths.surfaceArea}`, message: 'the water body has no surface-area data', params: { table: paths.surfaceArea } });
  });
  if (!inBulletinMonth) {
    problems.error({ code: 'bulletin-month-without-data', file: configLabel, line: 0, column: 'issue.month', value: config.issue.month, expected: `a month present in ${paths.surfaceArea}`, message: 'the surface-area table has no row for the bulletin month' });
  }
  const { firstYear: baselineFirst, lastYear: baselineLast } = config.baseline;
  if (baselineFirst < firstYear || baselineLast > lastYear) {
    problems.error({ code: 'baseline-outside-data', file: configLabel, line: 0, column: 'baseline', value: `${baselineFirst}-${baselineLast}`, expected: `years within ${firstYear}-${lastYear}, the years of ${paths.surfaceArea}`, message: 'the baseline period reaches beyond the surface-area data' });
  }
  if (baselineLast >= yearOf(bulletinMonth)) {
    problems.warning({ code: 'baseline-includes-bulletin-year', file: configLabel, line: 0, column: 'baseline.lastYear', value: String(baselineLast), expected: `a baseline ending before ${yearOf(bulletinMonth)}`, message: `the baseline includes the bulletin year, so ${monthLabel(bulletinMonth)} is partly compared with itself`, params: { year: String(yearOf(bulletinMonth)), month: monthLabel(bulletinMonth) } });
  }
}
