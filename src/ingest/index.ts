/**
 * Stage 1, ingest: reads a bulletin folder (configuration, tables, boundaries) into typed inputs
 * and one list of problems. Nothing here computes a statistic.
 */
import { say } from '../common/problemMessages.ts';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, realpathSync, statSync } from 'node:fs';
import { placeholderForeword } from '../text/index.ts';
import { LOCALE_CODES } from '../text/locales.ts';
import { ConfinementError, resolveInside } from './confine.ts';
import { isLink } from '../common/paths.ts';
import { HashCache, sha256File } from '../common/files.ts';
import { parquetParts } from './csv.ts';
import { join } from 'node:path';
import { readConfig, type BulletinConfig } from './config.ts';
import { readWording } from './wording.ts';
import { readLogo, type Logo } from './logo.ts';
import type { WordingLayer } from '../text/index.ts';
import { readBoundaries, type SubRegion } from './geojson.ts';
import { monthLabel, parseMonth, yearOf } from '../common/months.ts';
import { ProblemList } from './problems.ts';
import {
  readDistributionBins,
  readField,
  readInventory,
  readQuality,
  readRainfall,
  readStorageCurves,
  readStorageFits,
  readSurfaceArea,
} from './tables.ts';
import type {
  AreaTable,
  DistributionBin,
  FieldRecord,
  QualityTable,
  RainfallRecord,
  ReadContext,
  StorageCurve,
  StorageFit,
  WaterBody,
} from './tableTypes.ts';

export type { BulletinConfig } from './config.ts';
export type { SubRegion } from './geojson.ts';
export type {
  AreaTable,
  DistributionBin,
  FieldRecord,
  QualityParameter,
  QualityTable,
  RainfallRecord,
  StorageCurve,
  StorageFit,
  WaterBody,
} from './tableTypes.ts';
export { QUALITY_PARAMETERS } from './tableTypes.ts';
export { describeFound, InputError, formatProblem, problemPlace, ProblemList, type Problem } from './problems.ts';

export const CONFIG_FILE = 'bulletin.json';

/** Editorial text files of an issue, content/<name>.md (and content/<name>.<locale>.md). */
export const CONTENT_FILES = ['foreword', 'notes'] as const;

export interface InputFile {
  /** Path relative to the bulletin folder, with forward slashes. */
  path: string;
  sha256: string;
  bytes: number;
  /** For a folder of Parquet partitions: each partition, relative to the folder. */
  parts?: Array<{ path: string; sha256: string; bytes: number }>;
  /** Where the site publishes it, below the issue's data/inputs/ (a fixed name per input). */
  published: string;
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
  /** Storage curves of the bodies that have one (inputs.storageCurves), in inventory order; empty without the table. */
  storage: StorageCurve[];
  /** Fitted area–volume power laws of bodies without a curve (inputs.storageFits); empty without the table. */
  storageFits: StorageFit[];
  subRegions: SubRegion[];
  files: InputFile[];
  /** Editorial text by name (`foreword`, `foreword.fr`, `notes`), read and checked here. */
  content: Record<string, string>;
  /** The agency's logo (site.logo), read and checked; null without one. */
  logo: Logo | null;
  /** The folder's own wording over the tool's catalogue (content/locales/<locale>.json), by locale; empty without. */
  wording: WordingLayer;
  /** Real path of each input file, by its path in `files`, resolved inside the folder. */
  sources: Record<string, string>;
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
function hashFile(path: string, full: string, hashes: HashCache): Omit<InputFile, 'published'> {
  if (!statSync(full).isDirectory()) return { path, ...sha256File(full, hashes) };
  const parts = parquetParts(full).map((part) => ({ part, ...sha256File(join(full, part), hashes) }));
  const listing = parts.map(({ part, sha256 }) => `${sha256}  ${part}\n`).join('');
  return {
    path,
    sha256: createHash('sha256').update(listing).digest('hex'),
    bytes: parts.reduce((sum, part) => sum + part.bytes, 0),
    parts: parts.map(({ part, sha256, bytes }) => ({ path: part, sha256, bytes })),
  };
}

/**
 * Reads and checks everything; `inputs` is null when any error was found. `labelPrefix` goes in
 * front of every file name in problems (for archived issues: "archive/2026-10/").
 */
export interface LoadOptions {
  /** Put before every file name in problems (an archived issue's folder, e.g. `archive/2026-10/`). */
  labelPrefix?: string;
  /** Told each step (the input being read). */
  onStep?: (detail: string) => void;
  /** Where the inputs' hashes are remembered, so render copies them without reading them again. */
  hashes?: HashCache;
}

export async function loadBulletin(folder: string, options: LoadOptions = {}): Promise<IngestResult> {
  const { labelPrefix = '', onStep, hashes = new HashCache() } = options;
  const problems = new ProblemList();
  const configLabel = `${labelPrefix}${CONFIG_FILE}`;
  let root: string;
  let configPath: string;
  try {
    root = realpathSync(folder);
    configPath = resolveInside(root, CONFIG_FILE, 'config');
  } catch (error) {
    const expected = error instanceof ConfinementError ? error.expected : 'a bulletin folder holding bulletin.json';
    const code = error instanceof ConfinementError && error.code !== 'file-missing' ? error.code : 'config-missing';
    problems.error({
      code,
      file: configLabel,
      line: 0,
      column: '',
      value: '',
      expected,
      message: error instanceof ConfinementError && code !== 'config-missing' ? error.message : say('config-unreadable'),
    });
    return { inputs: null, problems };
  }
  const read = readConfig(configPath, configLabel, problems);
  if (!read) return { inputs: null, problems };
  const { config, text: configText } = read;

  const paths = config.inputs;
  const label = (path: string) => `${labelPrefix}${path}`;
  // Every input named by the configuration, resolved inside the folder before anything is read.
  const real = new Map<string, string>();
  for (const [key, path] of Object.entries(paths)) {
    if (path === undefined) continue;
    try {
      real.set(path, resolveInside(root, path, key === 'boundaries' ? 'boundaries' : 'table', key !== 'boundaries'));
    } catch (error) {
      if (!(error instanceof ConfinementError)) throw error;
      problems.error({
        code: error.code,
        file: configLabel,
        line: 0,
        column: `inputs.${key}`,
        value: path,
        expected: error.expected,
        message: error.message,
      });
    }
  }
  const content = readContent(root, config, problems, label);
  const wording = readWording(root, config, problems, label, configText);
  const logo = readLogo(root, config, problems, configLabel, configText);
  if (problems.errors.length > 0) return { inputs: null, problems };
  const at = (path: string) => real.get(path) as string;
  const bulletinMonth = parseMonth(config.issue.month) as number;
  const context: ReadContext = {
    problems,
    bulletinMonth,
    decimal: config.csv.decimal,
    ignoreColumns: config.tables.ignoreColumns,
    ...(onStep ? { onStep } : {}),
  };
  const subRegions = readBoundaries(at(paths.boundaries), label(paths.boundaries), problems);
  const regionIds = new Set(subRegions.map((region) => region.id));
  const bodies = await readInventory(at(paths.inventory), label(paths.inventory), context);
  onStep?.(label(paths.surfaceArea));
  const area = await readSurfaceArea(at(paths.surfaceArea), label(paths.surfaceArea), bodies, context);
  if (paths.quality) onStep?.(label(paths.quality));
  const quality = paths.quality ? await readQuality(at(paths.quality), label(paths.quality), bodies, context) : null;
  const distribution = paths.distribution
    ? await readDistributionBins(at(paths.distribution), label(paths.distribution), regionIds, context)
    : [];
  const rainfall = paths.rainfall ? await readRainfall(at(paths.rainfall), label(paths.rainfall), regionIds, context) : [];
  const field = paths.field ? await readField(at(paths.field), label(paths.field), bodies, context) : [];
  if (paths.field && quality) checkTurbidityUnits(field, quality, label(paths.field), problems);
  const storage = paths.storageCurves ? await readStorageCurves(at(paths.storageCurves), label(paths.storageCurves), bodies, context) : [];
  const storageFits = paths.storageFits
    ? await readStorageFits(at(paths.storageFits), label(paths.storageFits), bodies, storage, context)
    : [];
  if (paths.storageCurves) checkAreasOnCurves(storage, bodies, area, label(paths.storageCurves), problems);
  if (paths.storageFits)
    checkAreasOnCurves(
      storageFits.map((fit) => ({ body: fit.body, line: fit.line, areaHa: Float64Array.from([fit.minAreaHa, fit.maxAreaHa]) })),
      bodies,
      area,
      label(paths.storageFits),
      problems,
    );

  crossCheck(config, bulletinMonth, bodies, area, subRegions, problems, label);
  checkTranslations(content, config, problems, label);
  if (problems.errors.length > 0) return { inputs: null, problems };

  const used = (Object.keys(PUBLISHED_NAMES) as Array<keyof typeof PUBLISHED_NAMES>).filter((key) => Boolean(paths[key]));
  onStep?.('input hashes');
  const files: InputFile[] = [
    { ...hashFile(CONFIG_FILE, configPath, hashes), published: CONFIG_FILE },
    ...used.map((key) => {
      const path = paths[key] as string;
      const source = at(path);
      const isFolder = statSync(source).isDirectory();
      return { ...hashFile(path, source, hashes), published: publishedName(key, path, isFolder) };
    }),
  ].sort((a, b) => a.path.localeCompare(b.path));
  const sources = Object.fromEntries(files.map((file) => [file.path, file.path === CONFIG_FILE ? configPath : at(file.path)]));
  return {
    inputs: {
      config,
      bulletinMonth,
      bodies,
      area,
      quality,
      distribution,
      rainfall,
      field,
      storage,
      storageFits,
      subRegions,
      files,
      content,
      wording,
      logo,
      sources,
    },
    problems,
  };
}

/**
 * The name an input is published under, below the issue's data/inputs/: fixed per input, with a
 * data extension (never the user's own name or extension, so no input can be served as a page).
 */
const PUBLISHED_NAMES = {
  inventory: 'water-bodies',
  surfaceArea: 'surface-area',
  quality: 'water-quality',
  distribution: 'distribution',
  rainfall: 'rainfall',
  field: 'field-measurements',
  storageCurves: 'storage-curves',
  storageFits: 'storage-fits',
  boundaries: 'subregions',
} as const;

function publishedName(key: keyof typeof PUBLISHED_NAMES, path: string, isFolder: boolean): string {
  if (key === 'boundaries') return `${PUBLISHED_NAMES[key]}.geojson`;
  if (isFolder) return PUBLISHED_NAMES[key];
  return `${PUBLISHED_NAMES[key]}${path.toLowerCase().endsWith('.parquet') ? '.parquet' : '.csv'}`;
}

/**
 * The issue's editorial text (content/<name>.md and its translations), each file confined to the
 * folder, a regular file of at most SIZE_LIMITS.content bytes, and strict UTF-8.
 */
function readContent(root: string, config: BulletinConfig, problems: ProblemList, label: (path: string) => string): Record<string, string> {
  const content: Record<string, string> = {};
  for (const name of CONTENT_FILES) {
    for (const suffix of ['', ...config.locales.map((locale) => `.${locale}`)]) {
      const path = `content/${name}${suffix}.md`;
      if (!existsSync(join(root, path)) && !isLink(join(root, path))) continue;
      try {
        const bytes = readFileSync(resolveInside(root, path, 'content'));
        content[`${name}${suffix}`] = new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
      } catch (error) {
        if (error instanceof ConfinementError)
          problems.error({
            code: error.code,
            file: label(path),
            line: 0,
            column: '',
            value: '',
            expected: error.expected,
            message: error.message,
          });
        else if (error instanceof TypeError)
          problems.error({
            code: 'not-utf8',
            file: label(path),
            line: 0,
            column: '',
            value: '',
            expected: 'UTF-8 text',
            message: say('file-not-utf8-convert'),
          });
        else throw error;
      }
    }
  }
  // A published issue must not carry the placeholder that init or new-issue wrote.
  if (!config.issue.draft) {
    const placeholders = new Set(LOCALE_CODES.map((locale) => placeholderForeword(locale).trim()));
    for (const [name, text] of Object.entries(content)) {
      if (!name.startsWith('foreword') || !placeholders.has(text.trim())) continue;
      problems.error({
        code: 'content-placeholder',
        file: label(`content/${name}.md`),
        line: 1,
        column: '',
        value: text.trim(),
        expected: 'the foreword of this issue, or "draft": true in issue of bulletin.json',
        message: say('content-placeholder'),
      });
    }
  }
  return content;
}

/**
 * Editorial text written for the first language but not translated for another: that language's
 * pages will show the original (marked with its language). A warning, so editors notice.
 */
function checkTranslations(
  content: Record<string, string>,
  config: BulletinConfig,
  problems: ProblemList,
  label: (path: string) => string,
): void {
  for (const name of CONTENT_FILES) {
    const original = `content/${name}.md`;
    if (content[name] === undefined) continue;
    for (const locale of config.locales.slice(1)) {
      const translation = `content/${name}.${locale}.md`;
      if (content[`${name}.${locale}`] !== undefined) continue;
      problems.warning({
        code: 'content-untranslated',
        file: label(original),
        line: 0,
        column: '',
        value: locale,
        expected: label(translation),
        message: say('content-untranslated', { locale }),
        params: { locale, translation: label(translation) },
      });
    }
  }
}

/**
 * Observed water areas outside a body's storage curve: the storage figures clamp them to the curve
 * (never extrapolate), and one warning per body says how many months and the curve's range.
 */
function checkAreasOnCurves(
  curves: Array<Pick<StorageCurve, 'body' | 'line' | 'areaHa'>>,
  bodies: WaterBody[],
  area: AreaTable,
  file: string,
  problems: ProblemList,
): void {
  const byBody = new Map(curves.map((curve) => [curve.body, curve]));
  const outside = new Map<number, number>();
  for (let k = 0; k < area.length; k++) {
    const curve = byBody.get(area.body[k] as number);
    const ha = area.waterHa[k] as number;
    if (!curve || !Number.isFinite(ha)) continue;
    if (ha < (curve.areaHa[0] as number) || ha > (curve.areaHa[curve.areaHa.length - 1] as number))
      outside.set(curve.body, (outside.get(curve.body) ?? 0) + 1);
  }
  for (const [body, count] of [...outside.entries()].sort((a, b) => a[0] - b[0])) {
    const curve = byBody.get(body) as Pick<StorageCurve, 'areaHa' | 'line'>;
    const low = curve.areaHa[0] as number;
    const high = curve.areaHa[curve.areaHa.length - 1] as number;
    problems.warning({
      code: 'area-outside-curve',
      file,
      line: curve.line,
      column: 'area_ha',
      value: (bodies[body] as WaterBody).id,
      expected: `water areas from ${low} to ${high} ha`,
      message: say('area-outside-curve', { count }),
      params: { count, low, high },
    });
  }
}

/**
 * Field turbidity in another unit than the satellite table's (NTU against FNU, or the other way)
 * cannot be compared with it: those samples are left out of the comparison, with one warning.
 */
function checkTurbidityUnits(field: FieldRecord[], quality: QualityTable, label: string, problems: ProblemList): void {
  if (!quality.turbidityUnit) return;
  const other = field.filter((record) => record.parameter === 'turbidity' && record.turbidityUnit !== quality.turbidityUnit);
  const first = other[0];
  if (!first) return;
  problems.warning({
    code: 'turbidity-units-differ',
    file: label,
    line: first.line,
    column: 'unit',
    value: first.turbidityUnit ?? '',
    expected: `turbidity in ${quality.turbidityUnit}, the unit of the satellite table`,
    message: say('turbidity-units-differ', { count: other.length }),
    params: { count: other.length },
  });
}

function crossCheck(
  config: BulletinConfig,
  bulletinMonth: number,
  bodies: WaterBody[],
  area: AreaTable,
  subRegions: SubRegion[],
  problems: ProblemList,
  label: (path: string) => string,
): void {
  const paths = Object.fromEntries(
    Object.entries(config.inputs).map(([key, value]) => [key, value === undefined ? undefined : label(value)]),
  ) as BulletinConfig['inputs'];
  const configLabel = label(CONFIG_FILE);
  const regionIds = new Set(subRegions.map((region) => region.id));
  if (subRegions.length > 0) {
    const firstLine = new Map<string, number>();
    for (const body of bodies) if (!firstLine.has(body.subRegionId)) firstLine.set(body.subRegionId, body.line);
    for (const [id, line] of firstLine) {
      if (!regionIds.has(id)) {
        problems.error({
          code: 'subregion-without-boundary',
          file: paths.inventory,
          line,
          column: 'subregion_id',
          value: id,
          expected: `a feature with this subregion_id in ${paths.boundaries}`,
          message: say('subregion-without-boundary'),
        });
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
    if (!hasData[k])
      problems.warning({
        code: 'body-without-data',
        file: paths.inventory,
        line: body.line,
        column: 'body_id',
        value: body.id,
        expected: `rows in ${paths.surfaceArea}`,
        message: say('body-without-data'),
        params: { table: paths.surfaceArea },
      });
  });
  if (!inBulletinMonth) {
    problems.error({
      code: 'bulletin-month-without-data',
      file: configLabel,
      line: 0,
      column: 'issue.month',
      value: config.issue.month,
      expected: `a month present in ${paths.surfaceArea}`,
      message: say('bulletin-month-without-data'),
    });
  }
  const { firstYear: baselineFirst, lastYear: baselineLast } = config.baseline;
  if (baselineFirst < firstYear || baselineLast > lastYear) {
    problems.error({
      code: 'baseline-outside-data',
      file: configLabel,
      line: 0,
      column: 'baseline',
      value: `${baselineFirst}-${baselineLast}`,
      expected: `years within ${firstYear}-${lastYear}, the years of ${paths.surfaceArea}`,
      message: say('baseline-outside-data'),
    });
  }
  if (baselineLast >= yearOf(bulletinMonth)) {
    problems.warning({
      code: 'baseline-includes-bulletin-year',
      file: configLabel,
      line: 0,
      column: 'baseline.lastYear',
      value: String(baselineLast),
      expected: `a baseline ending before ${yearOf(bulletinMonth)}`,
      message: say('baseline-includes-bulletin-year', { month: monthLabel(bulletinMonth) }),
      params: { year: String(yearOf(bulletinMonth)), month: monthLabel(bulletinMonth) },
    });
  }
}
