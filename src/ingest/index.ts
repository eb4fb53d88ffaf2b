/**
 * Stage 1, ingest: reads a bulletin folder (configuration, tables, boundaries) into typed inputs
 * and one list of problems. Nothing here computes a statistic.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readConfig, type BulletinConfig } from './config.ts';
import { readBoundaries, type SubRegion } from './geojson.ts';
import { monthLabel, parseMonth, yearOf } from './months.ts';
import { ProblemList } from './problems.ts';
import { readInventory, readRainfall, readSurfaceArea, type AreaRecord, type RainfallRecord, type WaterBody } from './tables.ts';

export type { BulletinConfig } from './config.ts';
export type { SubRegion } from './geojson.ts';
export type { AreaRecord, RainfallRecord, WaterBody } from './tables.ts';
export { InputError, formatProblem, ProblemList, type Problem } from './problems.ts';
export { monthLabel, parseMonth, calendarMonthOf, yearOf } from './months.ts';

export const CONFIG_FILE = 'bulletin.json';

export interface InputFile {
  /** Path relative to the bulletin folder, with forward slashes. */
  path: string;
  sha256: string;
  bytes: number;
}

export interface BulletinInputs {
  config: BulletinConfig;
  bulletinMonth: number;
  bodies: WaterBody[];
  area: AreaRecord[];
  rainfall: RainfallRecord[];
  subRegions: SubRegion[];
  files: InputFile[];
}

export interface IngestResult {
  inputs: BulletinInputs | null;
  problems: ProblemList;
}

function hashFile(folder: string, path: string): InputFile {
  const bytes = readFileSync(join(folder, path));
  return { path, sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.length };
}

export async function loadBulletin(folder: string): Promise<IngestResult> {
  const problems = new ProblemList();
  const config = readConfig(join(folder, CONFIG_FILE), CONFIG_FILE, problems);
  if (!config) return { inputs: null, problems };

  const paths = config.inputs;
  const subRegions = readBoundaries(join(folder, paths.boundaries), paths.boundaries, problems);
  const bodies = await readInventory(join(folder, paths.inventory), paths.inventory, problems);
  const ids = new Set(bodies.map((body) => body.id));
  const area = await readSurfaceArea(join(folder, paths.surfaceArea), paths.surfaceArea, ids, problems);
  const rainfall = paths.rainfall ? await readRainfall(join(folder, paths.rainfall), paths.rainfall, problems) : [];
  const bulletinMonth = parseMonth(config.issue.month) as number;

  crossCheck(config, bulletinMonth, bodies, area, subRegions, problems);
  if (problems.errors.length > 0) return { inputs: null, problems };

  // Months after the bulletin month belong to a later issue: left out, with a warning.
  const kept = area.filter((record) => record.month <= bulletinMonth);
  if (kept.length < area.length) {
    problems.warning({ code: 'month-after-bulletin', file: paths.surfaceArea, line: 0, column: 'month', value: String(area.length - kept.length), expected: `months up to ${config.issue.month}`, message: 'rows after the bulletin month are ignored' });
  }
  const used = [paths.inventory, paths.surfaceArea, paths.boundaries, paths.rainfall].filter((path): path is string => Boolean(path));
  const files = [CONFIG_FILE, ...used].sort().map((path) => hashFile(folder, path));
  return {
    inputs: { config, bulletinMonth, bodies, area: kept, rainfall: rainfall.filter((r) => r.month <= bulletinMonth), subRegions, files },
    problems,
  };
}

function crossCheck(config: BulletinConfig, bulletinMonth: number, bodies: WaterBody[], area: AreaRecord[], subRegions: SubRegion[], problems: ProblemList): void {
  const paths = config.inputs;
  const regionIds = new Set(subRegions.map((region) => region.id));
  if (subRegions.length > 0) {
    for (const id of new Set(bodies.map((body) => body.subRegionId))) {
      if (!regionIds.has(id)) {
        problems.error({ code: 'subregion-without-boundary', file: paths.boundaries, line: 0, column: 'subregion_id', value: id, expected: 'a feature for every sub-region of the inventory', message: 'a sub-region of the inventory has no boundary' });
      }
    }
  }
  if (area.length === 0) return;
  if (!area.some((record) => record.month === bulletinMonth)) {
    problems.error({ code: 'bulletin-month-without-data', file: CONFIG_FILE, line: 0, column: 'issue.month', value: config.issue.month, expected: 'a month present in the surface-area table', message: 'the surface-area table has no row for the bulletin month' });
  }
  const years = new Set(area.map((record) => yearOf(record.month)));
  const { firstYear, lastYear } = config.baseline;
  const first = Math.min(...years);
  const last = Math.max(...years);
  if (firstYear < first || lastYear > last) {
    problems.error({ code: 'baseline-outside-data', file: CONFIG_FILE, line: 0, column: 'baseline', value: `${firstYear}-${lastYear}`, expected: `years within ${monthLabel(first * 12).slice(0, 4)}-${last}`, message: 'the baseline period reaches beyond the surface-area data' });
  }
}
