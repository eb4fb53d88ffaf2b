/**
 * Stage 4, render: Eleventy and the Nunjucks templates turn the model and rendered charts into
 * pages inside a given folder, and the downloads are written beside them.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Eleventy from '@11ty/eleventy';
import type { ChartSet } from '../charts/index.ts';
import type { BulletinModel } from '../model/index.ts';
import { formatMessage, loadMessages } from '../text/index.ts';
import { views } from './views.ts';

const projectRoot = fileURLToPath(new URL('../../', import.meta.url));

export interface SiteFile {
  /** Path inside the site folder, forward slashes. */
  path: string;
  content: string | Buffer;
}

/** Everything the templates read, computed here so templates only place it. */
export function pageData(model: BulletinModel, chartSet: ChartSet) {
  const messages = loadMessages(model.meta.locale);
  const t = (key: string, params?: Record<string, string | number>) => formatMessage(messages, key, params);
  const issue = model.meta.issuePath;
  return {
    bulletin: model,
    charts: chartSet.charts,
    sparklines: chartSet.sparklines,
    cardUrl: new URL(`${issue.replace(/^\//, '')}card.png`, model.meta.baseUrl).href,
    t: messages,
    view: views(model),
    navigation: [
      { key: 'home', href: '/', label: t('site.home') },
      { key: 'overview', href: issue, label: t('page.overview') },
      { key: 'surfaceWater', href: `${issue}surface-water/`, label: t('page.surfaceWater') },
      { key: 'waterQuality', href: `${issue}water-quality/`, label: t('page.waterQuality') },
      { key: 'trends', href: `${issue}trends/`, label: t('page.trends') },
      { key: 'dataMethods', href: `${issue}data-and-methods/`, label: t('page.dataMethods') },
    ],
    footer: t('site.footer', { publisher: model.meta.publisher, version: model.meta.toolVersion }),
    noticeLabels: { notice: 'Note', caveat: 'Caveat', caution: 'Caution' },
  };
}

/** The files written beside the pages: the model and each chart's data and specification. */
export function downloadFiles(model: BulletinModel, chartSet: ChartSet): SiteFile[] {
  const issue = model.meta.issuePath.replace(/^\//, '');
  const files: SiteFile[] = [
    { path: `${issue}data/bulletin-model.json`, content: JSON.stringify(model, null, 2) + '\n' },
    { path: `${issue}card.png`, content: chartSet.card.png },
  ];
  for (const chart of Object.values(chartSet.charts)) {
    files.push({ path: `${issue}charts/${chart.id}.csv`, content: chart.csv });
    files.push({ path: `${issue}charts/${chart.id}.vl.json`, content: chart.specJson });
    if (chart.png) files.push({ path: `${issue}charts/${chart.id}.png`, content: chart.png });
  }
  return files;
}

export async function renderSite(model: BulletinModel, chartSet: ChartSet, outDir: string): Promise<void> {
  const data = pageData(model, chartSet);
  const eleventy = new Eleventy(join(projectRoot, 'templates'), outDir, {
    configPath: join(projectRoot, '.eleventy.js'),
    quietMode: true,
    config: (eleventyConfig) => {
      for (const [name, value] of Object.entries(data)) eleventyConfig.addGlobalData(name, value);
    },
  });
  // Its closing "Wrote N files" line is forced past quiet mode; the build reports progress itself.
  eleventy.disableLogger();
  await eleventy.write();
  for (const file of downloadFiles(model, chartSet)) {
    const target = join(outDir, file.path);
    mkdirSync(dirname(target), { recursive: true });
    writeFileSync(target, file.content);
  }
}
