/**
 * The whole build as numbered stages, each handing the next a typed value:
 * 1 ingest (every issue of the folder) → 2 model (stats inside) → 3 charts → 4 render → 5 publish.
 */
import { readFileSync } from 'node:fs';
import { relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildCharts, type ChartSet } from './charts/index.ts';
import { InputError, loadBulletin, monthLabel, type BulletinInputs, type Problem } from './ingest/index.ts';
import { issueFolders } from './ingest/issues.ts';
import { buildModel, prepareModel, type BulletinModel } from './model/index.ts';
import { renderSite, type IssueBundle } from './render/index.ts';
import { publishAtomically } from './site/publish.ts';
import { closeSharedPool, sharedPool } from './parallel/pool.ts';

export interface BuildOptions {
  bulletinFolder: string;
  outDir: string;
  /** Progress lines for a person; silent by default. */
  log?: (line: string) => void;
}

export interface BuildResult {
  /** The current issue's model (the folder itself). */
  model: BulletinModel;
  issues: BulletinModel[];
  warnings: Problem[];
  outDir: string;
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
  const log = options.log ?? (() => {});
  // Wall time per stage, for the closing summary (progress only: nothing of it reaches the site).
  const times: Array<[string, number]> = [];
  let stageStart = performance.now();
  const lap = (stage: string) => {
    const now = performance.now();
    times.push([stage, now - stageStart]);
    stageStart = now;
  };

  const folders = issueFolders(options.bulletinFolder);
  log(`1/5 reading and checking inputs of ${folders.length} issue(s)`);
  const loaded: Array<{ inputs: BulletinInputs; warnings: Problem[] }> = [];
  const problems: Problem[] = [];
  for (const folder of folders) {
    const prefix = relative(options.bulletinFolder, folder);
    const result = await loadBulletin(folder, prefix ? `${prefix.split('\\').join('/')}/` : '');
    problems.push(...result.problems.sorted());
    if (result.inputs) loaded.push({ inputs: result.inputs, warnings: result.problems.warnings });
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
  lap('inputs');

  log('2/5 computing the bulletin models');
  const paths = issuePaths(loaded.map(({ inputs }) => ({ month: inputs.bulletinMonth, revision: inputs.config.issue.revision })));
  const models: BulletinModel[] = [];
  for (const [k, { inputs, warnings: own }] of loaded.entries()) {
    const prepared = await prepareModel(inputs, sharedPool());
    models.push(buildModel(inputs, own, toolVersion(), { issuePath: paths[k] as string, prepared }));
  }
  lap('model');

  log('3/5 rendering charts');
  const chartSets: ChartSet[] = [];
  for (const model of models) chartSets.push(await buildCharts(model));
  lap('charts');

  log('4/5 rendering pages');
  const bundles: IssueBundle[] = models.map((model, k) => ({ model, charts: chartSets[k] as ChartSet, folder: folders[k] as string, inputs: loaded[k]?.inputs as BulletinInputs }));
  await publishAtomically(options.outDir, (staging) => renderSite(bundles, staging));

  lap('pages');
  log(`5/5 published to ${options.outDir}`);
  log(`time: ${times.map(([stage, ms]) => `${stage} ${(ms / 1000).toFixed(1)} s`).join(', ')}`);
  return { model: models[models.length - 1] as BulletinModel, issues: models, warnings, outDir: options.outDir };
}
