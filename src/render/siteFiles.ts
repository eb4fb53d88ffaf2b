/**
 * Site-level files: the Atom feed (RFC 4287), the JSON Feed (version 1.1), the sitemap
 * (sitemaps.org 0.9), and the manifests: one per issue listing its input hashes, tool version,
 * configuration summary and the SHA-256 of every file under its path, and one for the site that
 * covers every other file. `limnopress verify` checks a site against them.
 */
import { siteUrl } from '../common/paths.ts';
import { join } from 'node:path';
import { listFiles, sha256, sha256File } from '../common/files.ts';
import { escapeXml } from '../text/escape.ts';
import type { BulletinModel } from '../wording/index.ts';

export const MANIFEST = 'manifest.json';

export interface SiteFile {
  /** Path inside the site folder, forward slashes. */
  path: string;
  content: string | Buffer;
}

/** Path prefix of a language: '' for the site's first language, '/<locale>' for the others. */
export function prefixOf(locale: string, siteLocale: string): string {
  return locale === siteLocale ? '' : `/${locale}`;
}

/** The languages found, each once: the site's first language first, the others in code order. */
export function siteLocales(found: Iterable<string>, siteLocale: string): string[] {
  return [...new Set(found)].sort((a, b) => Number(b === siteLocale) - Number(a === siteLocale) || a.localeCompare(b));
}

/** Absolute address of a site path on the published site. */
export { siteUrl };
const absolute = (model: BulletinModel, path: string) => siteUrl(model.meta.baseUrl, path);

function atom(models: BulletinModel[], prefix: string): string {
  const latest = models[0] as BulletinModel;
  const entries = models.map((model) =>
    [
      '  <entry>',
      `    <id>${escapeXml(absolute(model, model.meta.issuePath))}</id>`,
      `    <title>${escapeXml(`${model.meta.title}: ${model.meta.monthName}`)}</title>`,
      `    <updated>${model.meta.published}T00:00:00Z</updated>`,
      `    <link rel="alternate" type="text/html" href="${escapeXml(absolute(model, model.meta.issuePath))}"/>`,
      `    <summary>${escapeXml(model.headline)}</summary>`,
      '  </entry>',
    ].join('\n'),
  );
  return [
    '<?xml version="1.0" encoding="utf-8"?>',
    `<feed xmlns="http://www.w3.org/2005/Atom" xml:lang="${escapeXml(latest.meta.locale)}">`,
    `  <id>${escapeXml(absolute(latest, `${prefix}/`))}</id>`,
    `  <title>${escapeXml(latest.meta.title)}</title>`,
    `  <updated>${latest.meta.published}T00:00:00Z</updated>`,
    `  <author><name>${escapeXml(latest.meta.publisher)}</name></author>`,
    `  <link rel="self" type="application/atom+xml" href="${escapeXml(absolute(latest, `${prefix}/feed.xml`))}"/>`,
    `  <link rel="alternate" type="text/html" href="${escapeXml(absolute(latest, `${prefix}/`))}"/>`,
    ...entries,
    '</feed>',
    '',
  ].join('\n');
}

function jsonFeed(models: BulletinModel[], prefix: string): string {
  const latest = models[0] as BulletinModel;
  return `${JSON.stringify(
    {
      version: 'https://jsonfeed.org/version/1.1',
      title: latest.meta.title,
      home_page_url: absolute(latest, `${prefix}/`),
      feed_url: absolute(latest, `${prefix}/feed.json`),
      language: latest.meta.locale,
      authors: [{ name: latest.meta.publisher }],
      items: models.map((model) => ({
        id: absolute(model, model.meta.issuePath),
        url: absolute(model, model.meta.issuePath),
        title: `${model.meta.title}: ${model.meta.monthName}`,
        content_text: [model.headline, ...model.keyMessages.slice(1).map((message) => message.text)].join('\n'),
        date_published: `${model.meta.published}T00:00:00Z`,
        image: absolute(model, `${model.meta.issuePath}card.png`),
      })),
    },
    null,
    2,
  )}\n`;
}

/** Feeds and sitemap first; then the manifests over everything written, the site manifest last. */
export function siteFiles(
  models: BulletinModel[],
  outDir: string,
  known: ReadonlyMap<string, string> = new Map(),
  siteLocale = models[models.length - 1]?.meta.locale ?? 'en',
): SiteFile[] {
  const current = models
    .filter((model) => !model.meta.issuePath.includes('/revisions/'))
    .sort((a, b) => b.meta.month.localeCompare(a.meta.month));
  const latest = (current.find((model) => model.meta.locale === siteLocale) ?? current[0]) as BulletinModel;
  // One pair of feeds per language, the first language's at the root.
  const locales = siteLocales(
    current.map((model) => model.meta.locale),
    siteLocale,
  );
  const files: SiteFile[] = locales.flatMap((locale) => {
    const prefix = prefixOf(locale, siteLocale);
    const own = current.filter((model) => model.meta.locale === locale);
    return [
      { path: `${prefix.slice(1)}${prefix ? '/' : ''}feed.xml`, content: atom(own, prefix) },
      { path: `${prefix.slice(1)}${prefix ? '/' : ''}feed.json`, content: jsonFeed(own, prefix) },
    ];
  });
  const pages = [
    ...listFiles(outDir)
      .filter((path) => path.endsWith('index.html'))
      .map((path) => `/${path.replace(/index\.html$/, '')}`),
  ].sort();
  // Each page with its versions in the other languages (hreflang alternates, as in the pages).
  const pageSet = new Set(pages);
  const prefixes = locales.map((locale) => ({ locale, prefix: prefixOf(locale, siteLocale) }));
  const baseOf = (page: string) =>
    prefixes.filter(({ prefix }) => prefix && page.startsWith(`${prefix}/`)).map(({ prefix }) => page.slice(prefix.length))[0] ?? page;
  const entry = (page: string) => {
    const versions = prefixes
      .map(({ locale, prefix }) => ({ locale, page: `${prefix}${baseOf(page)}` }))
      .filter((version) => pageSet.has(version.page));
    const links =
      versions.length > 1
        ? versions
            .map(
              (version) =>
                `<xhtml:link rel="alternate" hreflang="${escapeXml(version.locale)}" href="${escapeXml(absolute(latest, version.page))}"/>`,
            )
            .join('')
        : '';
    return `  <url><loc>${escapeXml(absolute(latest, page))}</loc>${links}</url>`;
  };
  files.push({
    path: 'sitemap.xml',
    content: [
      '<?xml version="1.0" encoding="UTF-8"?>',
      `<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9"${locales.length > 1 ? ' xmlns:xhtml="http://www.w3.org/1999/xhtml"' : ''}>`,
      ...pages.map(entry),
      '</urlset>',
      '',
    ].join('\n'),
  });
  // Manifests cover the files on disk plus the feed files above (not yet written).
  const pending = new Map(files.map((file) => [file.path, file.content]));
  const all = [...new Set([...listFiles(outDir), ...pending.keys()])].sort();
  const hashOf = (path: string) => {
    const content = pending.get(path);
    if (content !== undefined) return sha256(content);
    return known.get(path) ?? sha256File(join(outDir, path)).sha256;
  };
  const issuePrefixes = models.map((model) => model.meta.issuePath.replace(/^\//, ''));
  const ownerOf = (path: string) =>
    issuePrefixes.filter((prefix) => path.startsWith(prefix)).sort((a, b) => b.length - a.length)[0] ?? null;
  const manifests: SiteFile[] = models.map((model) => {
    const prefix = model.meta.issuePath.replace(/^\//, '');
    const owned = all.filter((path) => ownerOf(path) === prefix && path !== `${prefix}${MANIFEST}`);
    return {
      path: `${prefix}${MANIFEST}`,
      content: `${JSON.stringify({ issue: model.meta.month, revision: model.meta.revision, published: model.meta.published, tool: { name: 'limnopress', version: model.meta.toolVersion }, configuration: { baseline: model.meta.baseline, minObservedShare: model.meta.minObservedShare, minRegionCoverage: model.meta.minRegionCoverage, maxFilledGap: model.meta.maxFilledGap, statusBands: model.meta.statusBands }, inputs: model.inputs, outputs: owned.map((path) => ({ path: path.slice(prefix.length), sha256: hashOf(path) })) }, null, 2)}\n`,
    };
  });
  for (const manifest of manifests) pending.set(manifest.path, manifest.content);
  const rest = all.filter((path) => ownerOf(path) === null && path !== MANIFEST);
  const siteManifest: SiteFile = {
    path: MANIFEST,
    content: `${JSON.stringify({ tool: { name: 'limnopress', version: latest.meta.toolVersion }, issues: manifests.map((manifest) => ({ path: manifest.path, sha256: sha256(manifest.content) })), outputs: rest.map((path) => ({ path, sha256: hashOf(path) })) }, null, 2)}\n`,
  };
  return [...files, ...manifests, siteManifest];
}
