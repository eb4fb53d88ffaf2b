/**
 * The whole build as numbered stages, each handing the next a typed value:
 * 1 ingest (every issue of the folder) → 2 model (stats inside) → 3 charts → 4 render → 5 publish.
 */
import { statSync } from 'node:fs';
import { join } from 'node:path';
import { buildCharts, chartCount, type ChartSet } from './charts/index.ts';
import { InputError, type BulletinInputs, type Problem } from './ingest/index.ts';
import { monthLabel } from './common/months.ts';
import { loadIssues } from './ingest/issues.ts';
import { issueFigures, prepareModel, trendSeriesCount } from './model/index.ts';
import { withWording } from './text/index.ts';
import { wordModel, type BulletinModel } from './wording/index.ts';
import { printedEarlier } from './wording/revisions.ts';
import { prefixOf, renderSite, type IssueBundle } from './render/index.ts';
import { openTarget, pauseAt, PublishError, systemReason, type PausePoint, type Target } from './site/publish.ts';
import { closeSharedPool, sharedPool } from './parallel/pool.ts';
import { lineProgress, seconds, silentProgress, type Progress } from './progress.ts';
import { HashCache, listFiles } from './common/files.ts';
import { StageError, toolVersion } from './common/tool.ts';

export interface BuildOptions {
  bulletinFolder: string;
  outDir: string;
  /** Progress for a person (see progress.ts); silent by default. */
  progress?: Progress;
  /** Or plain progress lines to this function. */
  log?: (line: string) => void;
  /** Publish over a non-empty folder that is not a limnopress site (kept under a new name, never deleted). */
  force?: boolean;
  /** Clean up (staging, lock) and exit on SIGINT and SIGTERM: for the command line. */
  handleSignals?: boolean;
  /** Test hook: called at each pause point of the build and the swap. */
  pause?: (point: PausePoint) => Promise<void>;
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
  // The target is checked and locked before any work, and released whatever happens.
  const target = openTarget(options.outDir, { bulletinFolder: options.bulletinFolder, ...(options.force ? { force: true } : {}) });
  const onSignal = (signal: NodeJS.Signals) => {
    target.release();
    process.stderr.write(`limnopress: stopped by ${signal}; the published site is as it was\n`);
    process.exit(signal === 'SIGINT' ? 130 : 143);
  };
  if (options.handleSignals) {
    process.on('SIGINT', onSignal);
    process.on('SIGTERM', onSignal);
  }
  try {
    await pauseAt('locked', options.pause);
    return await buildStages(options, target);
  } finally {
    target.release();
    if (options.handleSignals) {
      process.off('SIGINT', onSignal);
      process.off('SIGTERM', onSignal);
    }
    await closeSharedPool();
  }
}

/** Runs one stage; a failure that is not an input problem becomes a StageError naming the stage. */
async function stage<T>(name: string, work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof InputError || error instanceof StageError || error instanceof PublishError) throw error;
    throw new StageError(name, systemReason(error), { cause: error });
  }
}

async function buildStages(options: BuildOptions, target: Target): Promise<BuildResult> {
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

  // The inputs' hashes, taken while reading them, so the site's copies need not be read again.
  const hashes = new HashCache();
  const read = await stage('reading the inputs', () =>
    loadIssues(options.bulletinFolder, {
      hashes,
      // Counted by issue only when there are several: with one, a count would sit at 0 % until the end.
      begin: (issues) => progress.begin('1/5', `reading and checking the inputs of ${issues} issue(s)`, issues > 1 ? issues : undefined),
      advance: (k, detail) => progress.advance(k, detail),
    }),
  );
  const problems = read.problems;
  if (read.errors > 0) throw new InputError(problems);
  const loaded = read.issues.map(({ inputs, warnings }) => ({ inputs: inputs as BulletinInputs, warnings }));
  const warnings = problems.filter((problem) => problem.severity === 'warning');
  const rows = loaded.reduce((sum, { inputs }) => sum + inputs.area.length + (inputs.quality?.length ?? 0), 0);
  const inputSeconds = lap('inputs');
  await pauseAt('inputs', options.pause);
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
  await stage('computing the models', async () => {
    for (const [k, { inputs, warnings: own }] of loaded.entries()) {
      const prepared = await prepareModel(inputs, sharedPool(), (done) =>
        progress.advance((seriesDone += done), `trend tests, ${monthLabel(inputs.bulletinMonth)}`),
      );
      progress.advance(seriesDone, `the rest of ${monthLabel(inputs.bulletinMonth)}`);
      // The figures once per issue; each language's model holds them by reference with its own words.
      const figures = issueFigures(inputs, prepared);
      for (const [l, locale] of inputs.config.locales.entries()) {
        const model = wordModel(inputs, figures, own, toolVersion(), {
          issuePath: `${prefixOf(locale, siteLocale)}${paths[k] as string}`,
          locale,
        });
        localized.push({ model, issue: k, inputsPath: paths[k] as string, firstLocale: inputs.config.locales[0] as string });
        if (l === 0) models.push(model);
      }
      // The model holds everything later stages need: the tables can go (a national inventory's are gigabytes).
      loaded[k] = { inputs: { ...inputs, area: EMPTY_AREA, quality: null }, warnings: own };
    }
  });
  // What earlier issues printed with another value: known only once every issue is worded, and needed by the charts' tables.
  const every = localized.map(({ model }) => model);
  for (const model of every) model.revised = printedEarlier(model, every);
  // The worker threads have done their part (reading, trend tests): their memory goes back now.
  await closeSharedPool();
  const modelSeconds = lap('model');
  await pauseAt('model', options.pause);
  progress.end(`${count(seriesTotal)} trend series, ${count(seriesTotal / modelSeconds)} series/s`);

  // Chart words come from the catalogue: each issue's charts are made under its folder's own wording.
  const wordingOf = (issue: number) => (loaded[issue] as { inputs: BulletinInputs }).inputs.wording;
  const chartTotal = localized.reduce((sum, { model, issue }) => sum + withWording(wordingOf(issue), () => chartCount(model)), 0);
  progress.begin('3/5', 'rendering charts', chartTotal);
  let chartsDone = 0;
  const chartSets: ChartSet[] = [];
  await stage('rendering charts', async () => {
    for (const { model, issue } of localized)
      chartSets.push(await withWording(wordingOf(issue), () => buildCharts(model, (id) => progress.advance(++chartsDone, id))));
  });
  lap('charts');
  await pauseAt('charts', options.pause);
  progress.end(`${chartTotal} charts`);

  progress.begin('4/5', 'rendering pages');
  const bundles: IssueBundle[] = localized.map(({ model, issue, inputsPath, firstLocale }, k) => {
    const { content, sources, wording, logo } = (loaded[issue] as { inputs: BulletinInputs }).inputs;
    return { model, charts: chartSets[k] as ChartSet, content, sources, inputsPath, siteLocale, firstLocale, wording, logo };
  });
  let site = { files: 0, pages: 0, bytes: 0 };
  await stage('writing the site', () =>
    target.publish(async (staging) => {
      await renderSite(bundles, staging, hashes);
      site = siteSize(staging);
      await pauseAt('pages', options.pause);
    }, options.pause),
  );
  lap('pages');
  progress.end(`${count(site.pages)} pages, ${count(site.files)} files`);
  progress.note(`5/5 published to ${options.outDir}: ${count(site.pages)} pages, ${count(site.files)} files, ${megabytes(site.bytes)}`);
  progress.note(
    `time: ${times.map(([stage, ms]) => `${stage} ${seconds(ms)}`).join(', ')}; total ${seconds(times.reduce((sum, [, ms]) => sum + ms, 0))}`,
  );
  const stats: BuildStats = {
    times: Object.fromEntries(times.map(([stage, ms]) => [stage, ms / 1000])),
    rows,
    series: seriesTotal,
    charts: chartTotal,
    ...site,
  };
  return { model: models[models.length - 1] as BulletinModel, issues: models, warnings, outDir: options.outDir, stats };
}

const EMPTY_AREA: BulletinInputs['area'] = {
  length: 0,
  body: new Int32Array(0),
  month: new Int32Array(0),
  waterHa: new Float64Array(0),
  observedShare: new Float64Array(0),
  scenes: new Float64Array(0),
};

/** Files, HTML pages and bytes of a built site. */
function siteSize(dir: string): { files: number; pages: number; bytes: number } {
  const files = listFiles(dir);
  return {
    files: files.length,
    pages: files.filter((path) => path.endsWith('.html')).length,
    bytes: files.reduce((sum, path) => sum + statSync(join(dir, path)).size, 0),
  };
}

const count = (value: number) => Math.round(value).toLocaleString('en');
const megabytes = (bytes: number) => `${(bytes / 1e6).toFixed(1)} MB`;
