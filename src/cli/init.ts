/**
 * `limnopress init <folder>`: a new bulletin folder that builds at once: a configuration, small
 * invented sample tables (two sub-regions, four water bodies, three years of months), and content
 * stubs, each to be replaced by the real ones. `limnopress new-issue <folder>` archives the current
 * issue and starts the next month's.
 */
import { cpSync, existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { parseArgs } from 'node:util';
import { CONFIG_FILE, formatProblem, loadBulletin } from '../ingest/index.ts';
import { monthLabel, parseMonth } from '../common/months.ts';
import { isCalendarDate, LOCALES } from '../ingest/config.ts';
import { ARCHIVE_FOLDER } from '../ingest/issues.ts';
import { isLink } from '../common/paths.ts';
import { HELP, UsageError } from './usage.ts';
import { placeholderForeword } from '../text/index.ts';

/** content/foreword.md starts as the English placeholder; content/foreword.<locale>.md in its own language. */
const FOREWORD = placeholderForeword('en');

/** Sample tables: deterministic, invented, just enough for every page to have content. */
function sampleFiles(month: string, locales: string[]): Record<string, string> {
  const last = parseMonth(month) as number;
  const first = last - 35;
  const bodies = [
    // Over open ocean in the South Pacific, so the invented sample cannot be taken for a real place.
    ['S1', 'Sample Lake North', 'NORTH', -129.88, -39.38, 40, 'lake', 'yes'],
    ['S2', 'Sample Reservoir North', 'NORTH', -129.66, -39.29, 320, 'reservoir', 'yes'],
    ['S3', 'Sample Pond South', 'SOUTH', -129.79, -39.82, 3, 'pond', 'no'],
    ['S4', 'Sample Reservoir South', 'SOUTH', -129.59, -39.71, 1200, 'reservoir', 'yes'],
  ] as const;
  const area = ['body_id,month,water_area_ha,observed_share,scenes'];
  const quality = ['body_id,month,parameter,unit,p10,p25,median,p75,p90,valid_pixels'];
  const rain = ['subregion_id,month,rainfall_mm'];
  for (let m = first; m <= last; m++) {
    const season = Math.cos((2 * Math.PI * ((m % 12) - 3)) / 12);
    for (const [id, , , , , ha] of bodies) {
      const fill = 0.75 + 0.1 * season - 0.002 * (m - first);
      area.push(`${id},${monthLabel(m)},${(ha * fill).toFixed(2)},0.95,3`);
      const chl = 6 + 3 * Math.sin((2 * Math.PI * (m % 12)) / 12);
      quality.push(
        `${id},${monthLabel(m)},chlorophyll_a,ug/L,${(chl * 0.6).toFixed(2)},${(chl * 0.8).toFixed(2)},${chl.toFixed(2)},${(chl * 1.25).toFixed(2)},${(chl * 1.6).toFixed(2)},${Math.round(ha * 80)}`,
      );
    }
    for (const region of ['NORTH', 'SOUTH']) rain.push(`${region},${monthLabel(m)},${(60 + 40 * season).toFixed(1)}`);
  }
  const ring = (south: number) => [
    [-130, south],
    [-129.5, south],
    [-129.5, south + 0.5],
    [-130, south + 0.5],
    [-130, south],
  ];
  const geojson = {
    type: 'FeatureCollection',
    features: [
      {
        type: 'Feature',
        properties: { subregion_id: 'NORTH', name: 'Sample North' },
        geometry: { type: 'Polygon', coordinates: [ring(-39.5)] },
      },
      {
        type: 'Feature',
        properties: { subregion_id: 'SOUTH', name: 'Sample South' },
        geometry: { type: 'Polygon', coordinates: [ring(-40)] },
      },
    ],
  };
  const year = Math.floor(last / 12);
  const config = {
    title: 'Sample Water Bulletin',
    publisher: 'Sample publisher',
    region: { name: 'Sample region' },
    issue: { month, published: `${monthLabel(last + 1)}-03`, revision: 1, draft: true },
    baseline: { firstYear: year - 2, lastYear: year - 1, minYears: 2 },
    coverage: { minObservedShare: 0.6, minRegionCoverage: 0.5 },
    statusBands: [
      { key: 'much-lower', fromPercent: null },
      { key: 'lower', fromPercent: 75 },
      { key: 'near', fromPercent: 90 },
      { key: 'higher', fromPercent: 110 },
      { key: 'much-higher', fromPercent: 125 },
    ],
    site: { baseUrl: 'https://bulletin.example.org/' },
    locales,
    inputs: {
      inventory: 'data/water-bodies.csv',
      surfaceArea: 'data/surface-area.csv',
      quality: 'data/water-quality.csv',
      rainfall: 'data/rainfall.csv',
      boundaries: 'data/subregions.geojson',
    },
  };
  return {
    [CONFIG_FILE]: `${JSON.stringify(config, null, 2)}\n`,
    'data/water-bodies.csv': `${['body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page', ...bodies.map((row) => row.join(','))].join('\n')}\n`,
    'data/surface-area.csv': `${area.join('\n')}\n`,
    'data/water-quality.csv': `${quality.join('\n')}\n`,
    'data/rainfall.csv': `${rain.join('\n')}\n`,
    'data/subregions.geojson': `${JSON.stringify(geojson)}\n`,
    'content/foreword.md': FOREWORD,
    ...Object.fromEntries(locales.slice(1).map((locale) => [`content/foreword.${locale}.md`, placeholderForeword(locale)])),
    'README.md': `# ${config.title}\n\nA bulletin folder made by \`limnopress init\`. The tables in \`data/\` are invented samples: replace them with your own (formats in limnopress's docs/input-format.md), edit \`bulletin.json\`, then run \`limnopress check .\` and \`limnopress build . --out _site\`. The issue is marked as a draft until you set \`issue.draft\` to false.\n`,
  };
}

export async function runInit(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { month: { type: 'string' }, locales: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
  });
  if (values.help) {
    process.stdout.write(HELP.init);
    return 0;
  }
  const locales = (values.locales ?? 'en').split(',').map((locale) => locale.trim());
  const unknown = locales.filter((locale) => !(LOCALES as readonly string[]).includes(locale));
  if (unknown.length > 0 || new Set(locales).size !== locales.length)
    throw new UsageError(`--locales takes a comma-separated list of ${LOCALES.join(', ')}, each once (found "${values.locales}")`);
  if (positionals.length !== 1) throw new UsageError('init needs exactly one folder');
  const month = values.month ?? '';
  if (parseMonth(month) === null) throw new UsageError('init needs --month YYYY-MM, the month of the first issue');
  const folder = positionals[0] as string;
  if (existsSync(folder) && readdirSync(folder).length > 0) {
    process.stderr.write(`limnopress: ${folder} is not empty; init writes only into a new or empty folder\n`);
    return 1;
  }
  for (const [path, content] of Object.entries(sampleFiles(month, locales))) {
    mkdirSync(join(folder, path, '..'), { recursive: true });
    writeFileSync(join(folder, path), content);
  }
  process.stdout.write(`A new bulletin folder is ready in ${folder}. Build it with: limnopress build ${folder} --out <site-folder>\n`);
  return 0;
}

export async function runNewIssue(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { published: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
  });
  if (values.help) {
    process.stdout.write(HELP['new-issue']);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('new-issue needs exactly one bulletin folder');
  const folder = positionals[0] as string;
  const published = values.published;
  if (published !== undefined && (!/^\d{4}-\d{2}-\d{2}$/.test(published) || !isCalendarDate(published)))
    throw new UsageError('--published needs a date as YYYY-MM-DD');
  // The issue must check clean before it is archived: an issue with errors (a month with no rows, as
  // after a first new-issue, or a missing input) would be archived hollow.
  const { inputs, problems } = await loadBulletin(folder);
  if (!inputs) {
    for (const problem of problems.sorted()) if (problem.severity === 'error') process.stderr.write(`${formatProblem(problem)}\n`);
    process.stderr.write(
      `limnopress: the current issue of ${folder} has errors; nothing was archived. Fix them (limnopress check ${folder}) and run new-issue again\n`,
    );
    return 1;
  }
  const configPath = inputs.sources[CONFIG_FILE] as string;
  const config = JSON.parse(readFileSync(configPath, 'utf8')) as {
    issue: { month: string; revision?: number; published: string; draft?: boolean; corrections?: unknown[] };
    inputs: Record<string, string>;
  };
  const current = inputs.bulletinMonth;
  const archiveRoot = join(folder, ARCHIVE_FOLDER);
  const archived = join(archiveRoot, config.issue.month);
  if (existsSync(archived) || isLink(archived)) {
    process.stderr.write(`limnopress: ${archived} exists already; the current issue seems archived\n`);
    return 1;
  }
  const next = monthLabel(current + 1);
  const nextPublished = published ?? `${monthLabel(current + 2)}-03`;
  // 1. Archive the current issue into a staging folder (its configuration, every input it names, its
  // content), then rename it into place: a failure part way leaves no half-made archive to block a retry.
  mkdirSync(archiveRoot, { recursive: true });
  const staging = join(archiveRoot, `.${config.issue.month}.partial-${process.pid}`);
  rmSync(staging, { recursive: true, force: true });
  try {
    mkdirSync(staging);
    for (const file of inputs.files) {
      // Paths were confined by the check above: every copy lands inside the staging folder.
      const to = join(staging, file.path);
      mkdirSync(dirname(to), { recursive: true });
      cpSync(inputs.sources[file.path] as string, to, { recursive: true, dereference: true });
    }
    for (const [name, text] of Object.entries(inputs.content)) {
      mkdirSync(join(staging, 'content'), { recursive: true });
      writeFileSync(join(staging, 'content', `${name}.md`), text);
    }
    renameSync(staging, archived);
  } catch (error) {
    rmSync(staging, { recursive: true, force: true });
    throw error;
  }
  // 2. Start the next issue: new month and date, first revision, no corrections, a draft, fresh foreword.
  config.issue = { ...config.issue, month: next, published: nextPublished, revision: 1, draft: true, corrections: [] };
  // Written beside and renamed over, so the configuration is never half-written.
  const nextConfig = join(folder, `.${CONFIG_FILE}.next-${process.pid}`);
  writeFileSync(nextConfig, `${JSON.stringify(config, null, 2)}\n`);
  renameSync(nextConfig, join(folder, CONFIG_FILE));
  mkdirSync(join(folder, 'content'), { recursive: true });
  writeFileSync(join(folder, 'content', 'foreword.md'), FOREWORD);
  // Last month's translated forewords are archived with it; the new issue gets fresh stubs.
  for (const name of readdirSync(join(folder, 'content'))) {
    const locale = /^foreword\.([a-z]{2})\.md$/.exec(name)?.[1];
    if (locale) writeFileSync(join(folder, 'content', name), placeholderForeword(locale));
  }
  process.stdout.write(
    `Archived ${monthLabel(current)} in ${archived}. The folder now holds the ${next} issue (a draft): add the ${next} rows to the tables, then run limnopress check ${folder}.\n`,
  );
  return 0;
}
