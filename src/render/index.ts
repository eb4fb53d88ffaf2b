/**
 * Stage 4, render: Eleventy and the Nunjucks templates turn every issue's model and charts into
 * pages inside a given folder; downloads, feeds, the sitemap and the manifests are written beside
 * them. Issue pages come from pagination over the issues, so each issue keeps its own path.
 */
import { mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { copyHashed, HashCache } from '../common/files.ts';
import { dirname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import Eleventy from '@11ty/eleventy';
import type { ChartSet } from '../charts/index.ts';

import type { BulletinModel } from '../wording/index.ts';
import type { Logo } from '../ingest/logo.ts';
import { localeEntry } from '../text/locales.ts';
import { fillMessage, formatMessage, loadMessages, withWording, type MessageKey, type WordingLayer } from '../text/index.ts';
import { renderMarkdown } from './markdown.ts';
import { prefixOf, siteFiles, siteLocales, siteUrl, type SiteFile } from './siteFiles.ts';

export { prefixOf, type SiteFile } from './siteFiles.ts';
import { bodyView, changesSince, revisedFigures, subRegionView, views } from './views.ts';

const projectRoot = fileURLToPath(new URL('../../', import.meta.url));
/** Tables with more rows than this fold behind a summary line that names them (templates/_includes/table.njk). */
export const TABLE_FOLD_ROWS = 8;
/** The tool's accent colour as templates/assets/site.css declares it; site.accentColour replaces it. */
export const TOOL_ACCENT = '--accent: #0b5d6e;';

export interface IssueBundle {
  model: BulletinModel;
  charts: ChartSet;
  /** The issue's editorial text, as ingest read and checked it. */
  content: Record<string, string>;
  /** Real path of each input file (by its path in the model's inputs), resolved inside the bulletin folder by ingest. */
  sources: Record<string, string>;
  /** Site path of the issue in the site's first language, where its input files are published once for every language. */
  inputsPath?: string;
  /** The site's first language, published at the root; others live under /<locale>/. */
  siteLocale?: string;
  /** The issue's first language, the one its editorial text is written in unless a translation is given. */
  firstLocale?: string;
  /** The agency's logo, as ingest read and checked it; the site shows the current issue's. */
  logo?: Logo | null;
  /** The issue folder's own wording over the tool's catalogue (ingest/wording.ts); the site-level pages use the current issue's. */
  wording?: WordingLayer;
}

/** Each language's own name, for the language switch (in that language, as readers look for it). */

/** A language as the switch, hreflang and Open Graph links need it. */
function languageOf(locale: string, siteLocale: string) {
  return {
    locale,
    prefix: prefixOf(locale, siteLocale),
    name: localeEntry(locale)?.name ?? locale,
    ogLocale: loadMessages(locale)['site.ogLocale'],
  };
}

/** Everything one issue's pages read, computed here so templates only place it. */
export function issueData(bundle: IssueBundle, all: IssueBundle[]) {
  const { model, charts } = bundle;
  const locale = model.meta.locale;
  const siteLocale = bundle.siteLocale ?? locale;
  const prefix = prefixOf(locale, siteLocale);
  const messages = loadMessages(locale);
  const t = (key: MessageKey, params?: Record<string, string | number>) => formatMessage(messages, key, params);
  const issue = model.meta.issuePath;
  const sameLanguage = all.filter((other) => other.model.meta.locale === locale);
  const current = sameLanguage.filter((other) => !other.model.meta.issuePath.includes('/revisions/'));
  const position = current.findIndex((other) => other.model.meta.month === model.meta.month);
  const link = (other: IssueBundle | undefined) => (other ? { href: other.model.meta.issuePath, label: other.model.meta.monthName } : null);
  // The same issue and revision in the other languages: every page of it exists there at the same path below the prefix.
  const languages = all
    .filter((other) => other.model.meta.month === model.meta.month && other.model.meta.revision === model.meta.revision)
    .map((other) => ({ ...languageOf(other.model.meta.locale, siteLocale), current: other === bundle }));
  const inputsPath = bundle.inputsPath ?? issue;
  const revisions = sameLanguage
    .filter((other) => other.model.meta.month === model.meta.month)
    .map((other) => ({
      revision: other.model.meta.revision,
      published: other.model.meta.published,
      publishedName: other.model.meta.publishedName,
      href: other.model.meta.issuePath,
      corrections: other.model.meta.corrections,
      current: other === bundle,
    }))
    .sort((a, b) => a.revision - b.revision);
  return {
    bulletin: model,
    charts: charts.charts,
    sparklines: charts.sparklines,
    view: views(model),
    changes: changesSince(model, position > 0 ? (current[position - 1]?.model ?? null) : null),
    revisedFigures: revisedFigures(model),
    regionRevisions: model.revised.filter((entry) => entry.figure.kind === 'region').length,
    content: renderMarkdown(bundle.content, locale, bundle.firstLocale ?? locale),
    cardUrl: siteUrl(model.meta.baseUrl, `${issue}card.png`),
    pageUrl: siteUrl(model.meta.baseUrl, issue),
    isRevisionCopy: issue.includes('/revisions/'),
    previous: position >= 0 ? link(current[position - 1]) : null,
    next: position >= 0 ? link(current[position + 1]) : null,
    revisions,
    inputDownloads: model.inputs.map((file) => ({
      ...file,
      href: `${inputsPath}data/inputs/${file.published}`,
      parts: file.parts?.map((part) => ({ ...part, href: `${inputsPath}data/inputs/${file.published}/${part.path}` })),
    })),
    t: messages,
    prefix,
    languages,
    jsonLd: jsonLd(model),
    subRegions: model.boundaries.map((region) => subRegionView(model, region.id)),
    monitoredBodies: model.monitored.map((entry) => bodyView(model, entry.body)),
    navigation: [
      { key: 'home', href: `${prefix}/`, label: t('site.home') },
      { key: 'overview', href: issue, label: t('page.overview') },
      { key: 'surfaceWater', href: `${issue}surface-water/`, label: t('page.surfaceWater') },
      { key: 'places', href: `${issue}water-bodies/`, label: t('page.places') },
      { key: 'waterQuality', href: `${issue}water-quality/`, label: t('page.waterQuality') },
      { key: 'trends', href: `${issue}trends/`, label: t('page.trends') },
      { key: 'dataMethods', href: `${issue}data-and-methods/`, label: t('page.dataMethods') },
      { key: 'archive', href: `${prefix}/archive/`, label: t('page.archive') },
    ],
    footer: t('site.footer', { publisher: model.meta.publisher, version: model.meta.toolVersion }),
    noticeLabels: { notice: t('label.notice'), caveat: t('label.caveat'), caution: t('label.caution') },
  };
}

/**
 * schema.org Dataset metadata for the issue (JSON-LD), escaped so that no text of the inputs can
 * close the script element.
 */
function jsonLd(model: BulletinModel): string {
  const url = (path: string) => siteUrl(model.meta.baseUrl, path);
  const data = {
    '@context': 'https://schema.org',
    '@type': 'Dataset',
    name: `${model.meta.title}: ${model.meta.monthName}`,
    description: model.headline,
    url: url(model.meta.issuePath),
    datePublished: model.meta.published,
    version: String(model.meta.revision),
    inLanguage: model.meta.locale,
    temporalCoverage: `${model.meta.firstMonth}/${model.meta.month}`,
    spatialCoverage: { '@type': 'Place', name: model.meta.region },
    publisher: { '@type': 'Organization', name: model.meta.publisher },
    isAccessibleForFree: true,
    distribution: [
      { '@type': 'DataDownload', encodingFormat: 'application/json', contentUrl: url(`${model.meta.issuePath}data/bulletin-model.json`) },
    ],
  };
  return JSON.stringify(data).replace(/</g, '\\u003c').replace(/>/g, '\\u003e').replace(/&/g, '\\u0026');
}

type IssueData = ReturnType<typeof issueData>;

/** Issues the home page lists with their status. */
export const HOME_RECENT_ISSUES = 6;

/** The site-level pages of one language: its latest issue and its archive by year. */
function languageSite(issues: IssueData[], locale: string, siteLocale: string, languages: Array<ReturnType<typeof languageOf>>) {
  const current = issues.filter((issue) => !issue.isRevisionCopy && issue.bulletin.meta.locale === locale);
  const latest = current[current.length - 1] as IssueData;
  const years = [...new Set(current.map((issue) => issue.bulletin.meta.month.slice(0, 4)))].sort().reverse();
  return {
    locale,
    prefix: prefixOf(locale, siteLocale),
    latest,
    /** The last HOME_RECENT_ISSUES issues, newest first, with their status (the home page lists them). */
    recent: current.slice(-HOME_RECENT_ISSUES).reverse(),
    archive: years.map((year) => ({ year, issues: current.filter((issue) => issue.bulletin.meta.month.startsWith(year)).reverse() })),
    t: loadMessages(locale),
    languages: languages.map((language) => ({ ...language, current: language.locale === locale })),
  };
}

/** The site-level data: per language, the latest issue and the archive by year; the first language's at the root. */
export function siteData(issues: IssueData[], siteLocale?: string) {
  const first = siteLocale ?? (issues[issues.length - 1] as IssueData).bulletin.meta.locale;
  const locales = siteLocales(
    issues.map((issue) => issue.bulletin.meta.locale),
    first,
  );
  const languages = locales.map((locale) => languageOf(locale, first));
  const sites = locales.map((locale) => languageSite(issues, locale, first, languages));
  const root = sites[0] as ReturnType<typeof languageSite>;
  return { ...root, sites };
}

export async function renderSite(bundles: IssueBundle[], outDir: string, hashes: HashCache = new HashCache()): Promise<void> {
  const write = (file: SiteFile) => {
    const target = join(outDir, file.path);
    mkdirSync(dirname(target), { recursive: true });
    writeFileSync(target, file.content);
  };
  // Downloads first: a large model's JSON is written and let go before the pages take their memory.
  for (const bundle of bundles) for (const file of downloadFiles(bundle.model, bundle.charts)) write(file);
  const issues = bundles.map((bundle) => withWording(bundle.wording, () => issueData(bundle, bundles)));
  const last = bundles[bundles.length - 1];
  const site = withWording(last?.wording, () => siteData(issues, last?.siteLocale));
  const logo = last?.logo ?? null;
  const eleventy = new Eleventy(join(projectRoot, 'templates'), outDir, {
    configPath: join(projectRoot, '.eleventy.js'),
    quietMode: true,
    config: (eleventyConfig) => {
      eleventyConfig.addGlobalData('issues', issues);
      eleventyConfig.addGlobalData(
        'subRegionPages',
        issues.flatMap((issue) => issue.subRegions.map((subRegion) => ({ issue, subRegion }))),
      );
      eleventyConfig.addGlobalData(
        'bodyListPages',
        issues.flatMap((issue) =>
          issue.subRegions.flatMap((subRegion) =>
            subRegion.listPages.map((page) => ({
              issue,
              subRegion,
              page,
              pages: subRegion.listPages.map(({ number, href }) => ({ number, href })),
            })),
          ),
        ),
      );
      eleventyConfig.addGlobalData(
        'bodyPages',
        issues.flatMap((issue) => issue.monitoredBodies.map((body) => ({ issue, body }))),
      );
      // Wording: a catalogue entry with its {placeholders} filled (the result is escaped like any text).
      eleventyConfig.addFilter('fmt', (template: string, params: Record<string, string | number>) => fillMessage(template, params));
      // The same page in another language: only the language prefix of the path differs.
      eleventyConfig.addFilter(
        'switchPrefix',
        (url: string, from: string, to: string) => `${to}${from && url.startsWith(`${from}/`) ? url.slice(from.length) : url}`,
      );
      eleventyConfig.addFilter('absoluteUrl', (path: string, baseUrl: string) => siteUrl(baseUrl, path));
      eleventyConfig.addGlobalData('site', site);
      eleventyConfig.addGlobalData('sites', site.sites);
      eleventyConfig.addGlobalData('t', site.t);
      eleventyConfig.addGlobalData('tableFoldRows', TABLE_FOLD_ROWS);
      eleventyConfig.addGlobalData('siteLogo', logo ? { href: `/assets/logo.${logo.type}`, alt: logo.alt } : null);
    },
  });
  // Its closing "Wrote N files" line is forced past quiet mode; the build reports progress itself.
  eleventy.disableLogger();
  await eleventy.write();
  // The agency's accent colour, from the current issue: set in the one stylesheet (the CSP allows no inline style).
  const accent = bundles[bundles.length - 1]?.model.meta.accentColour ?? null;
  if (accent !== null) {
    const stylesheet = join(outDir, 'assets', 'site.css');
    const css = readFileSync(stylesheet, 'utf8');
    if (!css.includes(TOOL_ACCENT)) throw new Error(`templates/assets/site.css no longer sets ${TOOL_ACCENT}`);
    // A new file in the staging folder, never a write through a link to the tool's own template.
    rmSync(stylesheet);
    writeFileSync(stylesheet, css.replace(TOOL_ACCENT, `--accent: ${accent};`));
  }
  if (logo) writeFileSync(join(outDir, 'assets', `logo.${logo.type}`), logo.bytes);
  const known = copyInputs(bundles, outDir, hashes);
  for (const file of siteFiles(
    bundles.map((bundle) => bundle.model),
    outDir,
    known,
    site.locale,
  ))
    write(file);
}

/**
 * Every input table, as published, for download: once per issue, beside its first language's pages.
 * Returns the hashes of the copies by site path (known from reading them, or taken while copying),
 * so the manifests need not read them again.
 */
function copyInputs(bundles: IssueBundle[], outDir: string, hashes: HashCache): Map<string, string> {
  const known = new Map<string, string>();
  const published = new Set<string>();
  for (const bundle of bundles) {
    const inputsPath = bundle.inputsPath ?? bundle.model.meta.issuePath;
    if (published.has(inputsPath)) continue;
    published.add(inputsPath);
    for (const input of bundle.model.inputs) {
      const source = bundle.sources[input.path] as string;
      // Under its fixed published name (a data extension), never the user's own path.
      const target = join(outDir, inputsPath, 'data', 'inputs', input.published);
      // A folder of Parquet partitions is published as its partitions, the files its hash covers.
      const folder = statSync(source).isDirectory();
      for (const part of folder ? (input.parts ?? []) : [input]) {
        const to = folder ? join(target, part.path) : target;
        mkdirSync(dirname(to), { recursive: true });
        const sha256 = copyHashed(folder ? join(source, part.path) : source, to, hashes);
        // The bytes published must be the bytes read: an input changed during the build stops it.
        if (sha256 !== part.sha256)
          throw new Error(`${input.path}${folder ? `/${part.path}` : ''} changed while the bulletin was being built; build again`);
        known.set(relative(outDir, to).split(sep).join('/'), sha256);
      }
    }
  }
  return known;
}

/** Inventories larger than this get their model JSON written without indentation. */
const COMPACT_MODEL_FROM = 10_000;

/**
 * The files written beside an issue's pages: the model, the card and each chart's data, spec and
 * PNG. Made one at a time as they are asked for, so a large model's JSON is written and let go
 * before the next file is made.
 */
export function* downloadFiles(model: BulletinModel, chartSet: ChartSet): Generator<SiteFile> {
  const issue = model.meta.issuePath.replace(/^\//, '');
  // Indented for reading; compact for a large inventory, where indentation alone would add tens of megabytes.
  yield {
    path: `${issue}data/bulletin-model.json`,
    content: `${model.bodies.length > COMPACT_MODEL_FROM ? JSON.stringify(model) : JSON.stringify(model, null, 2)}\n`,
  };
  yield { path: `${issue}card.png`, content: chartSet.card.png };
  yield { path: `${issue}briefing.pdf`, content: chartSet.briefing };
  for (const chart of Object.values(chartSet.charts)) {
    yield { path: `${issue}charts/${chart.id}.csv`, content: chart.csv };
    yield { path: `${issue}charts/${chart.id}.vl.json`, content: chart.specJson };
    if (chart.png) yield { path: `${issue}charts/${chart.id}.png`, content: chart.png };
  }
}
