/**
 * The published archive on the example: four issues (September, October in two revisions,
 * November), previous/next links, the earlier revision at its own path, corrections shown, feeds
 * with their required fields, the sitemap, and verify catching a changed byte.
 */
import { cpSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { verifySite } from '../../src/site/verify.ts';
import { launchChromium, serveFolder } from '../support/gates.ts';

let site: string;
const read = (path: string) => readFileSync(join(site, path), 'utf8');

beforeAll(() => {
  site = inject('exampleSite');
});

describe('the archive', () => {
  it('gives every issue and language its one-page briefing PDF, linked from the overview and listed in the manifest', () => {
    for (const issue of ['issues/2026-09/', 'issues/2026-10/', 'issues/2026-10/revisions/1/', 'issues/2026-11/'])
      for (const prefix of ['', 'fr/']) {
        const path = `${prefix}${issue}`;
        expect(
          readFileSync(join(site, path, 'briefing.pdf'))
            .subarray(0, 5)
            .toString('latin1'),
          path,
        ).toBe('%PDF-');
        expect(read(`${path}index.html`)).toContain(`href="/${path}briefing.pdf"`);
        expect(read(`${path}manifest.json`)).toContain('briefing.pdf');
      }
  });

  it('links each issue to the one before and after it', () => {
    expect(read('issues/2026-10/index.html')).toContain('<a rel="prev" href="/issues/2026-09/">Previous issue: September 2026</a>');
    expect(read('issues/2026-10/index.html')).toContain('<a rel="next" href="/issues/2026-11/">Next issue: November 2026</a>');
    expect(read('issues/2026-09/index.html')).not.toContain('rel="prev"');
    expect(read('issues/2026-11/index.html')).not.toContain('rel="next"');
  });

  it('shows the correction at the top of the corrected issue, and keeps revision 1 at its own path', () => {
    const current = read('issues/2026-10/index.html');
    expect(current).toContain('Corrections in this revision');
    expect(current).toContain('entered ten times too large');
    const first = read('issues/2026-10/revisions/1/index.html');
    expect(first).toContain('this is revision 1 of the October 2026 issue');
    expect(first).toContain('href="/issues/2026-10/"');
    expect(read('issues/2026-10/data-and-methods/index.html')).toContain('<a href="/issues/2026-10/revisions/1/">Revision 1</a>');
  });

  it('lists the issues by year in the archive, and points the latest address at the newest issue', () => {
    const archive = read('archive/index.html');
    expect(archive).toContain('<h2>2026</h2>');
    expect(archive.indexOf('November 2026')).toBeLessThan(archive.indexOf('September 2026'));
    expect(read('latest/index.html')).toContain('<a href="/issues/2026-11/">November 2026</a>');
    expect(read('index.html')).toContain('Read the November 2026 issue');
  });

  it('writes an Atom feed (RFC 4287) with the required elements', () => {
    const atom = read('feed.xml');
    const feedHead = atom.slice(0, atom.indexOf('<entry>'));
    for (const element of ['<id>', '<title>', '<updated>', '<author><name>']) expect(feedHead).toContain(element);
    const entries = atom.split('<entry>').slice(1);
    expect(entries).toHaveLength(3);
    for (const entry of entries)
      for (const element of ['<id>https://bulletin.example.org/issues/', '<title>', '<updated>2026-', '<link rel="alternate"'])
        expect(entry).toContain(element);
    expect(entries[0]).toContain('2026-11');
  });

  it('writes a JSON Feed 1.1 with the required fields', () => {
    const feed = JSON.parse(read('feed.json')) as {
      version: string;
      title: string;
      items: Array<{ id: string; content_text?: string; url: string }>;
    };
    expect(feed.version).toBe('https://jsonfeed.org/version/1.1');
    expect(feed.title).toBe('Velduran Lakeland Water Bulletin');
    expect(feed.items).toHaveLength(3);
    for (const item of feed.items) {
      expect(item.id).toMatch(/^https:\/\/bulletin\.example\.org\/issues\/2026-\d\d\/$/);
      expect(item.content_text?.length).toBeGreaterThan(20);
    }
  });

  it('lists every page in the sitemap, and carries schema.org Dataset metadata on each overview', () => {
    const sitemap = read('sitemap.xml');
    // Every page but the 404, in both languages: 4 site pages and 4 issues × (6 + 3 sub-regions + 6 list pages + 22 bodies), less one.
    expect(sitemap.match(/<url>/g)).toHaveLength(2 * (4 + 4 * (6 + 3 + 6 + 22) - 1));
    expect(sitemap).toContain('<loc>https://bulletin.example.org/fr/issues/2026-10/revisions/1/trends/</loc>');
    expect(sitemap).toContain('<loc>https://bulletin.example.org/issues/2026-10/revisions/1/trends/</loc>');
    const ld = /<script type="application\/ld\+json">(.*?)<\/script>/.exec(read('issues/2026-11/index.html'))?.[1] ?? '';
    expect(JSON.parse(ld)).toMatchObject({ '@type': 'Dataset', datePublished: '2026-12-03', version: '1' });
  });
});

describe('verify', () => {
  it('verifySite(site) finds every file matching its manifest', () => {
    const { checked, findings } = verifySite(site);
    expect(findings).toEqual([]);
    expect(checked).toBeGreaterThan(200);
  });

  it('verifySite(copy) reports one changed byte in any kind of file, a missing file and an extra one', () => {
    for (const path of [
      'issues/2026-09/trends/index.html',
      'issues/2026-11/card.png',
      'feed.xml',
      'issues/2026-10/revisions/1/data/bulletin-model.json',
    ]) {
      const copy = `${site}-verify-${path.replace(/\W/g, '-')}`;
      cpSync(site, copy, { recursive: true, dereference: true });
      const bytes = readFileSync(join(copy, path));
      bytes[bytes.length >> 1] = (bytes[bytes.length >> 1] as number) ^ 1;
      writeFileSync(join(copy, path), bytes);
      expect(verifySite(copy).findings, path).toEqual([{ path, kind: 'changed' }]);
    }
    const copy = `${site}-verify-extra`;
    cpSync(site, copy, { recursive: true, dereference: true });
    mkdirSync(join(copy, 'extra'));
    writeFileSync(join(copy, 'extra', 'note.txt'), 'x');
    expect(verifySite(copy).findings).toEqual([{ path: 'extra/note.txt', kind: 'unlisted' }]);
  });

  it('limnopress verify exits 1 on a changed site and 0 on the built one', () => {
    const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
    expect(spawnSync(process.execPath, [cli, 'verify', site], { encoding: 'utf8' }).status).toBe(0);
    const copy = `${site}-verify-cli`;
    cpSync(site, copy, { recursive: true, dereference: true });
    writeFileSync(join(copy, 'index.html'), `${readFileSync(join(copy, 'index.html'), 'utf8')} `);
    const changed = spawnSync(process.execPath, [cli, 'verify', copy], { encoding: 'utf8' });
    expect(changed.status).toBe(1);
    expect(changed.stdout).toContain('index.html: changed since it was built');
  });
});

describe('the overview on narrow and wide screens', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchChromium();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('loads its pages under a Content-Security-Policy that allows no script, with no violation reported', async () => {
    const server = await serveFolder(site);
    try {
      const context = await browser.newContext({ viewport: { width: 800, height: 900 } });
      const page = await context.newPage();
      const refused: string[] = [];
      page.on('console', (message) => {
        if (/Content Security Policy|Refused to/i.test(message.text())) refused.push(message.text());
      });
      for (const path of ['/issues/2026-11/', '/fr/issues/2026-11/surface-water/', '/fr/issues/2026-11/water-bodies/wb079/', '/archive/']) {
        await page.goto(`${server.origin}${path}`);
        const policy = await page.locator('meta[http-equiv="Content-Security-Policy"]').getAttribute('content');
        expect(policy).toContain("script-src 'none'");
        expect(policy).toContain("style-src 'self'");
      }
      // The charts still fit their column: the width rule comes from the stylesheet, not a style attribute.
      await page.goto(`${server.origin}/issues/2026-11/surface-water/`);
      const maxWidth = await page
        .locator('svg[role="img"]')
        .first()
        .evaluate(
          (svg) => (globalThis as unknown as { getComputedStyle(element: unknown): { maxWidth: string } }).getComputedStyle(svg).maxWidth,
        );
      expect(maxWidth).toBe('100%');
      expect(refused).toEqual([]);
      await context.close();
    } finally {
      await server.close();
    }
  });

  it('has no horizontal overflow at 320 px and 1280 px in either language, and leaves a screenshot of each', async () => {
    const server = await serveFolder(site);
    const shots = join(import.meta.dirname, '..', '..', '.tmp', 'screenshots');
    mkdirSync(shots, { recursive: true });
    try {
      for (const [language, path] of [
        ['en', '/issues/2026-11/'],
        ['fr', '/fr/issues/2026-11/'],
      ] as const)
        for (const width of [320, 1280]) {
          const context = await browser.newContext({ viewport: { width, height: 900 } });
          const page = await context.newPage();
          await page.goto(`${server.origin}${path}`);
          const { scrollWidth, clientWidth } = await page.evaluate(() => {
            const root = (globalThis as unknown as { document: { documentElement: { scrollWidth: number; clientWidth: number } } }).document
              .documentElement;
            return { scrollWidth: root.scrollWidth, clientWidth: root.clientWidth };
          });
          await page.screenshot({ path: join(shots, `overview-${language}-${width}.png`), fullPage: true });
          expect(scrollWidth, `${language} at width ${width}`).toBeLessThanOrEqual(clientWidth);
          await context.close();
        }
    } finally {
      await server.close();
    }
  });

  it('shows the picture on the first screen: the status map and the recent months above the fold at 1280 px, the map at 360 px, on the overview and the home page', async () => {
    const server = await serveFolder(site);
    try {
      for (const [path, ids] of [
        ['/issues/2026-11/', ['figure-bodies-map', 'figure-recent-months']],
        ['/fr/issues/2026-11/', ['figure-bodies-map', 'figure-recent-months']],
        ['/', ['figure-bodies-map']],
      ] as const)
        for (const [width, height, shown] of [
          [1280, 800, ids],
          [360, 800, ['figure-bodies-map']],
        ] as const) {
          const context = await browser.newContext({ viewport: { width, height } });
          const page = await context.newPage();
          await page.goto(`${server.origin}${path}`);
          for (const id of shown) {
            // The top of the chart's drawing (its SVG) lies within the first screen.
            const top = await page
              .locator(`#${id} svg[role="img"]:visible`)
              .evaluate((svg) => (svg as unknown as { getBoundingClientRect(): { top: number } }).getBoundingClientRect().top);
            expect(top, `${path} at ${width} px: ${id}`).toBeLessThan(height);
          }
          await context.close();
        }
    } finally {
      await server.close();
    }
  });

  it('draws no chart text smaller than 11 CSS px at 360 px, and the wide drawing at 1280 px (both languages)', async () => {
    const server = await serveFolder(site);
    try {
      for (const [width, narrow] of [
        [360, true],
        [1280, false],
      ] as const) {
        const context = await browser.newContext({ viewport: { width, height: 900 } });
        const page = await context.newPage();
        let measured = 0;
        for (const issue of ['/issues/2026-11/', '/fr/issues/2026-11/'])
          for (const kind of ['', 'surface-water/', 'water-quality/']) {
            await page.goto(`${server.origin}${issue}${kind}`);
            // Each visible chart's smallest text, in CSS px: font size times the drawing's scale on screen.
            const charts = await page.evaluate(() => {
              type Box = { a: number; b: number };
              type Node = {
                textContent: string | null;
                getScreenCTM(): Box | null;
                closest(selector: string): { id: string; className: string } | null;
                checkVisibility(): boolean;
                querySelectorAll(selector: string): ArrayLike<Node>;
              };
              const scope = globalThis as unknown as {
                document: { querySelectorAll(selector: string): ArrayLike<Node> };
                getComputedStyle(node: Node): { fontSize: string };
              };
              return Array.from(scope.document.querySelectorAll('.chart svg[role="img"]'))
                .filter((svg) => svg.checkVisibility())
                .map((svg) => {
                  let smallest = Infinity;
                  for (const text of Array.from(svg.querySelectorAll('text'))) {
                    const ctm = text.getScreenCTM();
                    if (!ctm || !text.textContent?.trim()) continue;
                    smallest = Math.min(smallest, parseFloat(scope.getComputedStyle(text).fontSize) * Math.hypot(ctm.a, ctm.b));
                  }
                  const holder = svg.closest('.chart-narrow, .chart-wide');
                  return { id: svg.closest('.chart')?.id ?? '', smallest, narrow: holder?.className === 'chart-narrow' };
                });
            });
            for (const chart of charts) {
              expect(chart.narrow, `${issue}${kind} ${chart.id} at ${width} px`).toBe(narrow);
              if (narrow) expect(chart.smallest, `${issue}${kind} ${chart.id}`).toBeGreaterThanOrEqual(11);
            }
            measured += charts.length;
          }
        // 19 charts of the example per language: every one was measured.
        expect(measured).toBeGreaterThanOrEqual(2 * 19);
        await context.close();
      }
    } finally {
      await server.close();
    }
  });

  it('prints a folded table whole: its last row is drawn in print, and not on screen while folded', async () => {
    const server = await serveFolder(site);
    try {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const page = await context.newPage();
      await page.goto(`${server.origin}/issues/2026-11/surface-water/`);
      const lastRow = page.locator('details.table-fold:not([open]) tbody tr:last-child').first();
      expect(await page.locator('details.table-fold:not([open])').count()).toBeGreaterThan(0);
      // On screen the fold hides the rows; printed, the same closed fold shows them.
      expect(await lastRow.isVisible()).toBe(false);
      await page.emulateMedia({ media: 'print' });
      expect(await lastRow.isVisible()).toBe(true);
      const height = await lastRow.evaluate(
        (row) => (row as unknown as { getBoundingClientRect(): { height: number } }).getBoundingClientRect().height,
      );
      expect(height).toBeGreaterThan(0);
      await context.close();
    } finally {
      await server.close();
    }
  });

  it('reflows every kind of page at 320 px in both languages (tables scroll inside their own box)', async () => {
    const server = await serveFolder(site);
    const kinds = [
      '',
      'surface-water/',
      'water-quality/',
      'trends/',
      'data-and-methods/',
      'water-bodies/',
      'sub-regions/cor/',
      'sub-regions/cor/water-bodies/page-2/',
      'water-bodies/wb079/',
    ];
    const paths = [
      ...['/issues/2026-11/', '/fr/issues/2026-11/', '/fr/issues/2026-10/revisions/1/'].flatMap((issue) =>
        kinds.map((kind) => `${issue}${kind}`),
      ),
      '/',
      '/fr/archive/',
      '/latest/',
      '/404.html',
    ];
    try {
      const context = await browser.newContext({ viewport: { width: 320, height: 900 } });
      const page = await context.newPage();
      const overflowing: string[] = [];
      for (const path of paths) {
        await page.goto(`${server.origin}${path}`);
        const { scrollWidth, clientWidth } = await page.evaluate(() => {
          const root = (globalThis as unknown as { document: { documentElement: { scrollWidth: number; clientWidth: number } } }).document
            .documentElement;
          return { scrollWidth: root.scrollWidth, clientWidth: root.clientWidth };
        });
        if (scrollWidth > clientWidth) overflowing.push(`${path} ${scrollWidth} > ${clientWidth}`);
      }
      expect(overflowing).toEqual([]);
      await context.close();
    } finally {
      await server.close();
    }
  });
});
