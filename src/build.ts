/**
 * The whole build as numbered stages, each handing the next a typed value:
 * 1 ingest → 2 model (stats inside) → 3 charts → 4 render → 5 publish.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { buildCharts } from './charts/index.ts';
import { InputError, loadBulletin, type Problem } from './ingest/index.ts';
import { buildModel, type BulletinModel } from './model/index.ts';
import { renderSite } from './render/index.ts';
import { publishAtomically } from './site/publish.ts';

export interface BuildOptions {
  bulletinFolder: string;
  outDir: string;
  /** Progress lines for a person; silent by default. */
  log?: (line: string) => void;
}

export interface BuildResult {
  model: BulletinModel;
  warnings: Problem[];
  outDir: string;
}

export function toolVersion(): string {
  const pkg = JSON.parse(readFileSync(fileURLToPath(new URL('../package.json', import.meta.url)), 'utf8')) as { version: string };
  return pkg.version;
}

export async function build(options: BuildOptions): Promise<BuildResult> {
  const log = options.log ?? (() => {});

  log('1/5 reading and checking inputs');
  const { inputs, problems } = await loadBulletin(options.bulletinFolder);
  if (!inputs || problems.errors.length > 0) throw new InputError(problems.sorted());
  const warnings = problems.warnings;

  log('2/5 computing the bulletin model');
  const model = buildModel(inputs, warnings, toolVersion());

  log('3/5 rendering charts');
  const charts = await buildCharts(model);

  log('4/5 rendering pages');
  await publishAtomically(options.outDir, (staging) => renderSite(model, charts, staging));

  log(`5/5 published to ${options.outDir}`);
  return { model, warnings, outDir: options.outDir };
}
