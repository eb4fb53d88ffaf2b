/**
 * The second language on the example: every page of every issue in French under /fr/, a language
 * switch to the same page in the other language, hreflang alternates, French feeds, French words,
 * numbers and dates, and the input files published once and linked from both languages.
 */
import { cpSync, existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { build } from '../../src/build.ts';
import { renderMarkdown } from '../../src/render/markdown.ts';
import { TABLE_FOLD_ROWS } from '../../src/render/index.ts';
import { listFiles } from '../../src/common/files.ts';
import { checkLinks } from '../support/gates.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

let site: string;
const read = (path: string) => readFileSync(join(site, path), 'utf8');

beforeAll(() => {
  site = inject('exampleSite');
});

describe('the French edition', () => {
  it('has a French page for every English page and the other way round (the 404 page apart)', () => {
    const pages = listFiles(site).filter((path) => path.endsWith('.html') && path !== '404.html');
    const french = pages
      .filter((path) => path.startsWith('fr/'))
      .map((path) => path.slice(3))
      .sort();
    const english = pages.filter((path) => !path.startsWith('fr/')).sort();
    expect(french.length).toBeGreaterThan(100);
    expect(french).toEqual(english);
  });

  it('marks each page with its language and links the same page in the other language', () => {
    const page = read('fr/issues/2026-11/trends/index.html');
    expect(page).toContain('<html lang="fr">');
    expect(page).toContain('<meta property="og:locale" content="fr_FR">\n<meta property="og:locale:alternate" content="en_GB">');
    expect(page).toMatch(
      /<meta property="og:image:alt" content="Velduran Lakeland Water Bulletin: novembre 2026\. En novembre 2026, la surface couverte d&#39;eau des plans d&#39;eau/,
    );
    expect(page).toContain('<link rel="alternate" hreflang="en" href="https://bulletin.example.org/issues/2026-11/trends/">');
    expect(page).toContain('<link rel="alternate" hreflang="fr" href="https://bulletin.example.org/fr/issues/2026-11/trends/">');
    expect(page).toContain('<a href="/issues/2026-11/trends/" hreflang="en" lang="en">English</a>');
    expect(page).toContain('<a href="/fr/issues/2026-11/trends/" aria-current="page" lang="fr">Français</a>');
    const english = read('issues/2026-10/revisions/1/water-quality/index.html');
    expect(english).toContain('<html lang="en">');
    expect(english).toContain('<a href="/fr/issues/2026-10/revisions/1/water-quality/" hreflang="fr" lang="fr">Français</a>');
  });

  it('speaks French in headings, navigation, key messages, tables and charts, with French numbers and dates', () => {
    const overview = read('fr/issues/2026-11/index.html');
    for (const text of [
      'Messages clés',
      'Chiffres principaux',
      'Réserves et précautions',
      'Qualité de l&#39;eau',
      'novembre 2026',
      '3 décembre 2026',
      'Aller au contenu principal',
    ])
      expect(overview).toContain(text);
    for (const text of ['Key messages', 'Headline figures', 'Skip to main content', 'See the figures'])
      expect(overview).not.toContain(text);
    // Intl's French percent: a no-break space before the sign (U+00A0 in Node 20's ICU data).
    expect(overview).toMatch(/\d\u00a0%/);
    expect(overview).not.toMatch(/\d%/);
    const surface = read('fr/issues/2026-11/surface-water/index.html');
    expect(surface).toContain('Anomalie standardisée');
    expect(surface).toMatch(/<title id="[^"]+">Sous-régions par état, novembre 2026<\/title>/);
    expect(surface).not.toContain('Grid cells against usual');
    // Map graticules: French decimal comma and O(uest) for west.
    expect(surface).toMatch(/>\d+,\d° O<\/text>/);
    expect(surface).not.toMatch(/>\d+\.\d° W<\/text>/);
  });

  it('writes months, p values and rates the French way in the trend tables', () => {
    const trends = read('fr/issues/2026-11/trends/index.html');
    expect(trends).toContain('<h1>Tendances depuis janvier 2018</h1>');
    expect(trends).toContain('taux de fausses découvertes 0,05');
    expect(trends).toContain('<td>&lt; 0,001</td>');
    expect(trends).not.toMatch(/\d\.\d{2,3}</);
    expect(read('issues/2026-11/trends/index.html')).toContain('<h1>Trends since January 2018</h1>');
  });

  it('words the input check warnings in French, marked as French', () => {
    const methods = read('fr/issues/2026-10/revisions/1/data-and-methods/index.html');
    expect(methods).toContain(
      '<code lang="fr">avertissement archive/2026-10-r1/data/surface-area.csv:8046 [water_area_ha]\u00a0: la surface en eau dépasse de loin la surface de référence',
    );
    expect(methods).not.toContain('Certains avertissements sont en anglais');
  });

  it('names the configured seasons in each language', () => {
    expect(read('fr/issues/2026-11/water-quality/index.html')).toContain('Chlorophylle a, saison sèche, 1–5 ha');
    expect(read('issues/2026-11/water-quality/index.html')).toContain('Chlorophyll-a, dry season, 1–5 ha');
  });

  it('shows the correction note in French where the configuration gives its translation', () => {
    const corrected = read('fr/issues/2026-10/index.html');
    expect(corrected).toContain('<h2 id="corrections-heading">Corrections de cette révision</h2>');
    expect(corrected).toContain(
      '<time datetime="2026-11-10">10 novembre 2026</time>\u00a0: <span>La surface en eau d’octobre 2026 du plan d’eau WB079 avait été saisie dix fois trop grande.',
    );
    expect(read('issues/2026-10/index.html')).toContain(
      '<time datetime="2026-11-10">10 November 2026</time>: <span>The October 2026 water area of water body WB079',
    );
  });

  it('folds a long table behind a summary that names it and counts its rows, in both languages, and keeps the lead table open', () => {
    for (const [prefix, words] of [
      ['', /<details class="table-fold">\n<summary>Grid cells of [^<]*: show the table \((\d+) rows\)<\/summary>/],
      ['fr/', /<details class="table-fold">\n<summary>Mailles de [^<]*\u00a0: afficher le tableau \((\d+) lignes\)<\/summary>/],
    ] as const) {
      const page = read(`${prefix}issues/2026-11/surface-water/index.html`);
      const rows = Number(words.exec(page)?.[1]);
      expect(rows).toBeGreaterThan(TABLE_FOLD_ROWS);
      // The region's status table leads the page: open, although it too is longer than the fold.
      const status = /<section class="table-block" id="status"[^>]*>\n(<[a-z]+)/.exec(page)?.[1];
      expect(status).toBe('<div');
    }
  });

  it('shows the health cautions in French too', () => {
    const quality = read('fr/issues/2026-11/water-quality/index.html');
    expect(quality).toContain('<strong>Précaution\u00a0:</strong> Là où la chlorophylle a est élevée');
    // The example names its (invented) health authority in bulletin.json "wording", and the caution still defers to it.
    expect(quality).toContain(
      'L&#39;autorité sanitaire locale, Velduran Basin Health Office, décide de la sécurité de la baignade et de l&#39;eau potable',
    );
  });

  it('lists each page with its other-language version in the sitemap', () => {
    const sitemap = read('sitemap.xml');
    expect(sitemap).toContain('xmlns:xhtml="http://www.w3.org/1999/xhtml"');
    const both =
      '<xhtml:link rel="alternate" hreflang="en" href="https://bulletin.example.org/issues/2026-11/trends/"/><xhtml:link rel="alternate" hreflang="fr" href="https://bulletin.example.org/fr/issues/2026-11/trends/"/>';
    expect(sitemap).toContain(`<url><loc>https://bulletin.example.org/issues/2026-11/trends/</loc>${both}</url>`);
    expect(sitemap).toContain(`<url><loc>https://bulletin.example.org/fr/issues/2026-11/trends/</loc>${both}</url>`);
  });

  it('says its language in the schema.org Dataset metadata', () => {
    const ld = (path: string) =>
      JSON.parse(/<script type="application\/ld\+json">(.*?)<\/script>/.exec(read(path))?.[1] ?? '{}') as {
        inLanguage: string;
        url: string;
      };
    expect(ld('fr/issues/2026-11/index.html')).toMatchObject({ inLanguage: 'fr', url: 'https://bulletin.example.org/fr/issues/2026-11/' });
    expect(ld('issues/2026-11/index.html')).toMatchObject({ inLanguage: 'en', url: 'https://bulletin.example.org/issues/2026-11/' });
  });

  it('has its own home, archive, latest page and feeds', () => {
    expect(read('fr/index.html')).toContain('Lire le numéro de novembre 2026');
    expect(read('fr/archive/index.html')).toContain('<a href="/fr/issues/2026-10/revisions/1/">révision 1</a>');
    expect(read('fr/latest/index.html')).toContain('href="/fr/issues/2026-11/"');
    const atom = read('fr/feed.xml');
    expect(atom).toContain('xml:lang="fr"');
    expect(atom).toContain('<link rel="self" type="application/atom+xml" href="https://bulletin.example.org/fr/feed.xml"/>');
    expect(atom).toContain('<id>https://bulletin.example.org/fr/issues/2026-11/</id>');
    const json = JSON.parse(read('fr/feed.json')) as { language: string; feed_url: string; items: Array<{ url: string }> };
    expect(json.language).toBe('fr');
    expect(json.feed_url).toBe('https://bulletin.example.org/fr/feed.json');
    expect(json.items.map((item) => item.url)).toContain('https://bulletin.example.org/fr/issues/2026-09/');
  });

  it('links the input files published once, beside the first language, from both languages', () => {
    const methods = read('fr/issues/2026-11/data-and-methods/index.html');
    expect(methods).toContain('href="/issues/2026-11/data/inputs/water-bodies.csv"');
    expect(existsSync(join(site, 'issues/2026-11/data/inputs/water-bodies.csv'))).toBe(true);
    expect(existsSync(join(site, 'fr/issues/2026-11/data/inputs'))).toBe(false);
    // Each language has its own model (its words) and manifest.
    expect(JSON.parse(read('fr/issues/2026-11/data/bulletin-model.json')).meta.locale).toBe('fr');
    expect(JSON.parse(read('fr/issues/2026-11/manifest.json')).issue).toBe('2026-11');
  });

  it('uses the French editorial text where the editors wrote one', () => {
    expect(read('fr/issues/2026-11/index.html')).toContain('La période sèche commencée en décembre 2024 se poursuit.');
    expect(read('issues/2026-11/index.html')).toContain('The dry spell that began in December 2024 goes on.');
  });
});

describe('page weight', () => {
  it('keeps each overview, with its stylesheet and inline SVG, under 300 KB and fetches nothing from other hosts', () => {
    const css = readFileSync(join(site, 'assets/site.css')).length;
    for (const path of ['issues/2026-11/index.html', 'fr/issues/2026-11/index.html']) {
      const html = read(path);
      expect(Buffer.byteLength(html) + css, path).toBeLessThanOrEqual(300 * 1024);
      // Resources a browser would fetch: stylesheets, scripts, images, fonts. Only site paths.
      const fetched = [...html.matchAll(/<(?:link rel="stylesheet"|script|img|source)[^>]*(?:href|src)="([^"]+)"/g)].map(
        (match) => match[1],
      );
      for (const url of fetched) expect(url, path).toMatch(/^\/(?!\/)/);
    }
  });
});

describe('renderMarkdown', () => {
  it('renderMarkdown(content, locale, firstLocale) falls back to the first language, marked with its lang', () => {
    const folder = { foreword: 'Only in *English*.\n', 'notes.fr': 'Seulement en français.\n' };
    const french = renderMarkdown(folder, 'fr', 'en');
    expect(french.foreword).toBe('<div lang="en">\n<p>Only in <em>English</em>.</p>\n</div>\n');
    expect(french.notes).toBe('<p>Seulement en français.</p>\n');
    const english = renderMarkdown(folder, 'en', 'en');
    expect(english.foreword).toBe('<p>Only in <em>English</em>.</p>\n');
    expect(english.notes).toBeNull();
  });
});

describe('a language added later', () => {
  it('publishes the older issues in their own languages only, with no link to a page that does not exist', async () => {
    const root = mkdtempSync(join(tmpdir(), 'limnopress-languages-'));
    const folder = join(root, 'bulletin');
    cpSync(EXAMPLE, folder, { recursive: true });
    // September was published in English only; French starts with October.
    const september = join(folder, 'archive', '2026-09', 'bulletin.json');
    writeFileSync(september, readFileSync(september, 'utf8').replace('"en",\n    "fr"', '"en"'));
    const out = join(root, 'site');
    await build({ bulletinFolder: folder, outDir: out });
    const page = (path: string) => readFileSync(join(out, path), 'utf8');
    expect(existsSync(join(out, 'fr', 'issues', '2026-09'))).toBe(false);
    expect(page('issues/2026-09/index.html')).not.toContain('hreflang');
    expect(page('issues/2026-09/index.html')).not.toContain('class="languages"');
    expect(page('fr/issues/2026-10/index.html')).not.toContain('rel="prev"');
    expect(page('issues/2026-10/index.html')).toContain('<a rel="prev" href="/issues/2026-09/">');
    expect(page('fr/archive/index.html')).not.toContain('/fr/issues/2026-09/');
    const { broken } = await checkLinks(out, 'https://bulletin.example.org/');
    expect(broken).toEqual([]);
  });
});
