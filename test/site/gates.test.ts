/**
 * The four quality gates on a fresh build of the example, and for each gate a deliberately broken
 * copy of a page that the gate must catch (so no gate can pass by checking nothing).
 */
import { cpSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import {
  auditAccessibility,
  auditedPages,
  checkLinks,
  diffTrees,
  htmlPages,
  launchChromium,
  onePagePerTemplate,
  templateOf,
  validateHtml,
} from '../support/gates.ts';
import { buildExample, EXAMPLE } from '../support/exampleSite.ts';

const BASE_URL = (JSON.parse(readFileSync(join(EXAMPLE, 'bulletin.json'), 'utf8')) as { site: { baseUrl: string } }).site.baseUrl;
let site: string;
let browser: Browser;

beforeAll(async () => {
  site = inject('exampleSite');
  browser = await launchChromium();
});

afterAll(async () => {
  await browser?.close();
});

/** A copy of the built site whose overview page has `edit` applied. */
function brokenCopy(name: string, edit: (html: string) => string): string {
  const copy = `${site}-${name}`;
  cpSync(site, copy, { recursive: true, dereference: true });
  const page = join(copy, 'issues', '2026-11', 'index.html');
  writeFileSync(page, edit(readFileSync(page, 'utf8')));
  return copy;
}

describe('example site', () => {
  it('has the site pages and, for each of the four issues in both languages, its six pages, three sub-regions, their water-body lists in pages of 20 and 22 monitored water bodies', () => {
    const pages = htmlPages(site);
    // Each sub-region has 26 or 27 water bodies: two list pages of at most 20 (site.bodiesPerListPage).
    // English at the root with the 404 page, French under fr/ with its own home, archive and latest page.
    expect(pages).toHaveLength(4 + 3 + 2 * 4 * (6 + 3 + 3 * 2 + 22));
    for (const page of [
      'index.html',
      '404.html',
      'archive/index.html',
      'latest/index.html',
      'fr/index.html',
      'fr/archive/index.html',
      'fr/latest/index.html',
    ])
      expect(pages).toContain(page);
    for (const issue of [
      'issues/2026-09/',
      'issues/2026-10/',
      'issues/2026-10/revisions/1/',
      'issues/2026-11/',
      'fr/issues/2026-09/',
      'fr/issues/2026-10/',
      'fr/issues/2026-10/revisions/1/',
      'fr/issues/2026-11/',
    ]) {
      for (const page of [
        '',
        'surface-water/',
        'water-quality/',
        'trends/',
        'data-and-methods/',
        'water-bodies/',
        'sub-regions/cor/',
        'sub-regions/cor/water-bodies/',
        'sub-regions/cor/water-bodies/page-2/',
        'water-bodies/wb079/',
      ])
        expect(pages).toContain(`${issue}${page}index.html`);
    }
  });

  it('checkLinks(site) finds no broken link, fragments included', async () => {
    const { checked, broken } = await checkLinks(site, BASE_URL);
    expect(broken).toEqual([]);
    expect(checked).toBeGreaterThanOrEqual(10);
  });

  it('validateHtml(site) finds no error', async () => {
    const { pages, errors } = await validateHtml(site);
    expect(errors).toEqual([]);
    expect(pages).toBe(htmlPages(site).length);
  });

  it(`auditAccessibility(site) finds no WCAG 2.x A or AA violation (${process.env.LIMNOPRESS_AXE === 'quick' ? 'one page per template and language' : 'every page'})`, async () => {
    const audited = auditedPages(site);
    const { pages, violations } = await auditAccessibility(site, browser, audited);
    expect(violations).toEqual([]);
    expect(pages).toBe(audited.length);
  });

  it('the quick audit covers every template in both languages: each page’s template has one audited page', () => {
    const all = htmlPages(site);
    const quick = onePagePerTemplate(all);
    expect(new Set(quick.map(templateOf))).toEqual(new Set(all.map(templateOf)));
    expect(quick.length).toBe(new Set(all.map(templateOf)).size);
    // A body page, a sub-region's list page and a revision are folded into their templates.
    expect(templateOf('fr/issues/2026-10/revisions/1/water-bodies/b-12/index.html')).toBe('fr/issues/*/water-bodies/*/index.html');
    expect(templateOf('issues/2026-11/sub-regions/north/water-bodies/page-2/index.html')).toBe(
      'issues/*/sub-regions/*/water-bodies/page-*/index.html',
    );
    expect(templateOf('issues/2026-11/water-bodies/index.html')).toBe('issues/*/water-bodies/index.html');
    expect(quick.filter((page) => page.startsWith('fr/')).length).toBeGreaterThan(0);
  });

  it('no page repeats an id, though every chart of the page is inlined', () => {
    for (const page of htmlPages(site)) {
      const ids = [...readFileSync(join(site, page), 'utf8').matchAll(/\sid="([^"]+)"/g)].map((match) => match[1]);
      const repeated = ids.filter((id, k) => ids.indexOf(id) !== k);
      expect(repeated, page).toEqual([]);
    }
    const surface = readFileSync(join(site, 'issues', '2026-11', 'surface-water', 'index.html'), 'utf8');
    expect(surface.match(/<svg/g)?.length).toBeGreaterThan(20);
  });

  it('building twice gives byte-identical output', async () => {
    const again = (await buildExample('again')).dir;
    expect(diffTrees(site, again)).toEqual([]);
  });
});

describe('each gate fails on a broken page', () => {
  it('checkLinks reports a missing page and a missing fragment', async () => {
    const copy = brokenCopy('links', (html) =>
      html.replace('</main>', '<p><a href="/issues/2026-11/no-such-page/">gone</a> <a href="#no-such-fragment">nowhere</a></p></main>'),
    );
    const { broken } = await checkLinks(copy, BASE_URL);
    const urls = broken.map((link) => link.url);
    expect(urls.some((url) => url.includes('/no-such-page/'))).toBe(true);
    expect(urls.some((url) => url.includes('#no-such-fragment'))).toBe(true);
    // The preview card is linked by its future absolute address; a missing card is caught too.
    rmSync(join(copy, 'issues', '2026-11', 'card.png'));
    const again = await checkLinks(copy, BASE_URL);
    expect(again.broken.some((link) => link.url.includes('card.png'))).toBe(true);
  });

  it('validateHtml reports a duplicate id and a stray end tag', async () => {
    const copy = brokenCopy('html', (html) => html.replace('</main>', '<p id="main">twice</p></div></main>'));
    const { errors } = await validateHtml(copy);
    expect(errors.some((error) => error.includes('no-dup-id'))).toBe(true);
    expect(errors.some((error) => error.includes('close-order'))).toBe(true);
  });

  it('auditAccessibility reports an image without a text alternative and low contrast', async () => {
    const copy = brokenCopy('axe', (html) =>
      html.replace(
        '</main>',
        '<svg role="img" width="10" height="10"><rect width="10" height="10"/></svg><p style="color:#bbbbbb;background:#ffffff">faint</p></main>',
      ),
    );
    const { violations } = await auditAccessibility(copy, browser, ['issues/2026-11/index.html']);
    const ids = violations.map((violation) => violation.id);
    expect(ids).toContain('svg-img-alt');
    expect(ids).toContain('color-contrast');
  });

  it('diffTrees reports a page whose bytes changed', () => {
    const copy = brokenCopy('bytes', (html) => html.replace('</main>', '<!-- built at 12:00 --></main>'));
    expect(diffTrees(site, copy)).toEqual(['issues/2026-11/index.html']);
  });
});
