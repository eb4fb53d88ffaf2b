/**
 * The whole build as numbered stages, each handing the next a typed value:
 * 1 ingest (every issue of the folder) → 2 model (stats inside) → 3 charts → 4 render → 5 publish.
 */
import { readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildCharts, chartCount, type ChartSet } from './charts/index.ts';
import { InputError, loadBulletin, monthLabel, type BulletinInputs, type Problem } from './ingest/index.ts';
import { issueFolders } from './ingest/issues.ts';
import { buildModel, prepareModel, trendSeriesCount, type BulletinModel } from './model/index.ts';
import { prefixOf, renderSite, type IssueBundle } from './render/index.ts';
import { publishAtomically } from './site/publish.ts';
import { closeSharedPool, sharedPool } from './parallel/pool.ts';
import { lineProgress, seconds, silentProgress, type Progress } from './progress.ts';
import { listFiles } from './site/files.ts';

export interface BuildOptions {
  bulletinFolder: string;
  outDir: string;
  /** Progress for a person (see progress.ts); silent by default. */
  progress?: Progress;
  /** Or plain progress lines to this function. */
  log?: (line: string) => void;
}

/** What the build did, in figures: seconds per stage, table rows read, trend series, charts, and the site written. */
export interface BuildStats {
  times: Record<string, number>;
  rows: number;
  series: number;
  charts: number;
  files: number;
  pages: number;
  bytes: number;
}

export interface BuildResult {
  /** The current issue's model (the folder itself). */
  model: BulletinModel;
  issues: BulletinModel[];
  warnings: Problem[];
  outDir: string;
  stats: BuildStats;
}

export function toolVersion(): string {
  const pkg = JSON.parse(readFileSync(fileURLToPath(new URL('../package.json', import.meta.url)), 'utf8')) as { version: string };
  return pkg.version;
}

/** Site path of each issue: the latest revision of a month at /issues/YYYY-MM/, earlier ones below it. */
export function issuePaths(issues: Array<{ month: number; revision: number }>): string[] {
  const latest = new Map<number, number>();
  for (const issue of issues) latest.set(issue.month, Math.max(latest.get(issue.month) ?? 0, issue.revision));
  return issues.map((issue) => {
    const base = `/issues/${monthLabel(issue.month)}/`;
    return issue.revision === latest.get(issue.month) ? base : `${base}revisions/${issue.revision}/`;
  });
}

export async function build(options: BuildOptions): Promise<BuildResult> {
  try {
    return await buildStages(options);
  } finally {
    await closeSharedPool();
  }
}

async function buildStages(options: BuildOptions): Promise<BuildResult> {
  const progress = options.progress ?? (options.log ? lineProgress(options.log) : silentProgress);
  // Wall time per stage, for the closing summary (progress only: nothing of it reaches the site).
  const times: Array<[string, number]> = [];
  let stageStart = performance.now();
  const lap = (stage: string) => {
    const now = performance.now();
    const ms = now - stageStart;
    times.push([stage, ms]);
    stageStart = now;
    return ms / 1000;
  };

  const folders = issueFolders(options.bulletinFolder);
  // Counted by issue only when there are several: with one, a count would sit at 0 % until the end.
  progress.begin('1/5', `reading and checking the inputs of ${folders.length} issue(s)`, folders.length > 1 ? folders.length : undefined);
  const loaded: Array<{ inputs: BulletinInputs; warnings: Problem[] }> = [];
  const problems: Problem[] = [];
  for (const [k, folder] of folders.entries()) {
    const prefix = relative(options.bulletinFolder, folder);
    const result = await loadBulletin(folder, prefix ? `${prefix.split('\\').join('/')}/` : '', (detail) => progress.advance(k, detail));
    problems.push(...result.problems.sorted());
    if (result.inputs) loaded.push({ inputs: result.inputs, warnings: result.problems.warnings });
    progress.advance(k + 1);
  }
  const seen = new Map<string, string>();
  loaded.forEach(({ inputs }, k) => {
    const key = `${inputs.bulletinMonth} ${inputs.config.issue.revision}`;
    const other = seen.get(key);
    if (other !== undefined) problems.push({ severity: 'error', code: 'issue-twice', file: relative(options.bulletinFolder, folders[k] as string) || '.', line: 0, column: 'issue', value: `${monthLabel(inputs.bulletinMonth)} revision ${inputs.config.issue.revision}`, expected: 'each month and revision once', message: `the same issue and revision is also in ${other}` });
    seen.set(key, relative(options.bulletinFolder, folders[k] as string) || '.');
  });
  if (problems.some((problem) => problem.severity === 'error') || loaded.length < folders.length) throw new InputError(problems);
  const warnings = problems.filter((problem) => problem.severity === 'warning');
  const rows = loaded.reduce((sum, { inputs }) => sum + inputs.area.length + (inputs.quality?.length ?? 0), 0);
  const inputSeconds = lap('inputs');
  progress.end(`${count(rows)} table rows, ${count(rows / inputSeconds)} rows/s`);

  const paths = issuePaths(loaded.map(({ inputs }) => ({ month: inputs.bulletinMonth, revision: inputs.config.issue.revision })));
  const seriesTotal = loaded.reduce((sum, { inputs }) => sum + trendSeriesCount(inputs), 0);
  progress.begin('2/5', 'computing the bulletin models', seriesTotal);
  let seriesDone = 0;
  // The site's first language is the current issue's first locale, published at the root; every
  // other language of an issue lives under /<locale>/ with the same paths below it.
  const siteLocale = loaded[loaded.length - 1]?.inputs.config.locales[0] ?? 'en';
  const models: BulletinModel[] = [];
  const localized: Array<{ model: BulletinModel; issue: number; inputsPath: string; firstLocale: string }> = [];
  for (const [k, { inputs, warnings: own }] of loaded.entries()) {
    const prepared = await prepareModel(inputs, sharedPool(), (done) => progress.advance((seriesDone += done), `trend tests, ${monthLabel(inputs.bulletinMonth)}`));
    progress.advance(seriesDone, `the rest of ${monthLabel(inputs.bulletinMonth)}`);
    // The statistics are shared: the first language's model carries the figures, every other
    // language reuses them and gets its own words, dates and numbers.
    let first: BulletinModel | undefined;
    for (const locale of inputs.config.locales) {
      const model = buildModel(inputs, own, toolVersion(), { issuePath: `${prefixOf(locale, siteLocale)}${paths[k] as string}`, prepared, locale, base: first });
      localized.push({ model, issue: k, inputsPath: paths[k] as string, firstLocale: inputs.config.locales[0] as string });
      if (first === undefined) models.push((first = model));
    }
    // The model holds everything later stages need: the tables can go (a national inventory's are gigabytes).
    loaded[k] = { inputs: { ...inputs, area: EMPTY_AREA, quality: null }, warnings: own };
  }
  // The worker threads have done their part (reading, trend tests): their memory goes back now.
  await closeSharedPool();
  const modelSeconds = lap('model');
  progress.end(`${count(seriesTotal)} trend series, ${count(seriesTotal / modelSeconds)} series/s`);

  const chartTotal = localized.reduce((sum, { model }) => sum + chartCount(model), 0);
  progress.begin('3/5', 'rendering charts', chartTotal);
  let chartsDone = 0;
  const chartSets: ChartSet[] = [];
  for (const { model } of localized) chartSets.push(await buildCharts(model, (id) => progress.advance(++chartsDone, id)));
  lap('charts');
  progress.end(`${chartTotal} charts`);

  progress.begin('4/5', 'rendering pages');
  const bundles: IssueBundle[] = localized.map(({ model, issue, inputsPath, firstLocale }, k) => ({ model, charts: chartSets[k] as ChartSet, folder: folders[issue] as string, inputsPath, siteLocale, firstLocale }));
  let site = { files: 0, pages: 0, bytes: 0 };
  await publishAtomically(options.outDir, async (staging) => {
    await renderSite(bundles, staging);
    site = siteSize(staging);
  });
  lap('pages');
  progress.end(`${count(site.pages)} pages, ${count(site.files)} files`);
  progress.note(`5/5 published to ${options.outDir}: ${count(site.pages)} pages, ${count(site.files)} files, ${megabytes(site.bytes)}`);
  progress.note(`time: ${times.map(([stage, ms]) => `${stage} ${seconds(ms)}`).join(', ')}; total ${seconds(times.reduce((sum, [, ms]) => sum + ms, 0))}`);
  const stats: BuildStats = { times: Object.fromEntries(times.map(([stage, ms]) => [stage, ms / 1000])), rows, series: seriesTotal, charts: chartTotal, ...site };
  return { model: models[models.length - 1] as BulletinModel, issues: models, warnings, outDir: options.outDir, stats };
}

const EMPTY_AREA: BulletinInputs['area'] = { length: 0, body: new Int32Array(0), month: new Int32Array(0), waterHa: new Float64Array(0), observedShare: new Float64Array(0), scenes: new Float64Array(0) };

/** Files, HTML pages and bytes of a built site. */
function siteSize(dir: string): { files: number; pages: number; bytes: number } {
  const files = listFiles(dir);
  return { files: files.length, pages: files.filter((path) => path.endsWith('.html')).length, bytes: files.reduce((sum, path) => sum + statSync(join(dir, path)).size, 0) };
}

const count = (value: number) => Math.round(value).toLocaleString('en');
const megabytes = (bytes: number) => `${(bytes / 1e6).toFixed(1)} MB`;
