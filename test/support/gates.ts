/**
 * The site's quality gates, shared by the example-build test and by the tests that prove each gate
 * fails on a broken page: links (linkinator, fragments too), HTML (html-validate), accessibility
 * (axe-core in Debian's Chromium through playwright-core), and tree hashing for determinism.
 */
import { existsSync, readFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { join } from 'node:path';
import { createRequire } from 'node:module';
import { HtmlValidate } from 'html-validate';
import { LinkChecker } from 'linkinator';
import { chromium, type Browser } from 'playwright-core';

export const CHROMIUM_PATH = process.env.LIMNOPRESS_CHROMIUM ?? '/usr/bin/chromium';

export { listFiles } from '../../src/common/files.ts';
import { listFiles, sha256 } from '../../src/common/files.ts';

export function treeHashes(dir: string): Record<string, string> {
  const hashes: Record<string, string> = {};
  for (const file of listFiles(dir)) hashes[file] = sha256(readFileSync(join(dir, file)));
  return hashes;
}

export const htmlPages = (dir: string) => listFiles(dir).filter((file) => file.endsWith('.html'));

/**
 * The template a page is rendered from, read off its path: the issue, revision, sub-region,
 * water-body and list-page parts are folded, the language prefix kept (`fr/issues/…/trends/`).
 */
export const templateOf = (page: string) =>
  page
    .replace(/issues\/\d{4}-\d{2}\//, 'issues/*/')
    .replace(/revisions\/\d+\//, '')
    .replace(/(water-bodies|sub-regions)\/(?!index\.html|page-\d+\/)[^/]+\//g, '$1/*/')
    .replace(/page-\d+\//, 'page-*/');

/** One page per template and language: the last in path order (the newest issue's). */
export function onePagePerTemplate(pages: string[]): string[] {
  const chosen = new Map<string, string>();
  for (const page of [...pages].sort()) chosen.set(templateOf(page), page);
  return [...chosen.values()].sort();
}

/**
 * Which pages the accessibility audit opens: every page unless LIMNOPRESS_AXE=quick asks for one per
 * template and language (the contributor's loop; .ci/run and a plain `npm test` audit them all).
 */
export const auditedPages = (dir: string) => (process.env.LIMNOPRESS_AXE === 'quick' ? onePagePerTemplate(htmlPages(dir)) : htmlPages(dir));

async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return typeof address === 'object' && address ? address.port : 0;
}

export interface BrokenLink {
  url: string;
  parent: string;
  status: number | undefined;
}

/**
 * Links of a built site, fragments included. Absolute links to the site's own future address
 * (`baseUrl`, as in og:image) are checked against the built files instead, since the site is not
 * published yet; any other outside link counts as broken, as there is no network here.
 */
export async function checkLinks(dir: string, baseUrl?: string): Promise<{ checked: number; broken: BrokenLink[] }> {
  const checker = new LinkChecker();
  const escaped = baseUrl?.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  // linkinator serves the folder on this port; the site's own absolute links are sent there.
  const port = await freePort();
  const result = await checker.check({
    path: dir,
    port,
    recurse: true,
    checkFragments: true,
    concurrency: 8,
    ...(escaped ? { urlRewriteExpressions: [{ pattern: new RegExp(`^${escaped}`), replacement: `http://localhost:${port}/` }] } : {}),
  });
  const broken = result.links
    .filter((link) => link.state === 'BROKEN')
    .map((link) => ({ url: link.url, parent: link.parent ?? '', status: link.status }));
  return { checked: result.links.length, broken };
}

export async function validateHtml(dir: string): Promise<{ pages: number; errors: string[] }> {
  const validator = new HtmlValidate({
    extends: ['html-validate:recommended'],
    rules: {
      // Vega's SVG writes attributes html-validate does not know in every case; SVG is checked by axe.
      'no-inline-style': 'off',
      'attribute-boolean-style': 'off',
      'long-title': 'off',
    },
  });
  const errors: string[] = [];
  const pages = htmlPages(dir);
  for (const page of pages) {
    const report = await validator.validateFile(join(dir, page));
    for (const result of report.results) {
      for (const message of result.messages)
        if (message.severity === 2) errors.push(`${page}:${message.line}:${message.column} ${message.ruleId} ${message.message}`);
    }
  }
  return { pages: pages.length, errors };
}

export { serveFolder } from '../../src/site/serve.ts';
import { serveFolder } from '../../src/site/serve.ts';

export async function launchChromium(): Promise<Browser> {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new Error(
      `Chromium not found at ${CHROMIUM_PATH}. Install it with "apt-get install -y chromium fonts-dejavu-core" (or set LIMNOPRESS_CHROMIUM to a Chromium binary); the browser tests need it and are never skipped.`,
    );
  }
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

export interface AxeViolation {
  page: string;
  id: string;
  impact: string | null;
  help: string;
  targets: string[];
}

/**
 * Runs axe-core on HTML pages of a folder (all of them unless a list is given), served on loopback.
 * The marks inside a chart's <svg role="img"> are excluded: an image's children are presentational
 * in ARIA, and the chart's name, description and data table are what assistive technology gets;
 * the <svg> element itself is still audited.
 */
export async function auditAccessibility(
  dir: string,
  browser: Browser,
  only?: string[],
): Promise<{ pages: number; violations: AxeViolation[] }> {
  const server = await serveFolder(dir);
  const violations: AxeViolation[] = [];
  const pages = only ?? htmlPages(dir);
  // Two lanes, each with its own browser context: the audits are CPU-bound and there are two cores.
  const lanes = [pages.filter((_, k) => k % 2 === 0), pages.filter((_, k) => k % 2 === 1)];
  try {
    await Promise.all(
      lanes.map(async (lane) => {
        // The site's Content-Security-Policy allows no script, axe's included: the audit injects it
        // past the policy (the policy itself is checked by its own test in test/site/archive.test.ts).
        // axe is an init script of the context and each lane reuses one tab: injecting 650 KB of
        // script into a fresh tab per page cost about 0.7 s a page, three times the audit itself.
        const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true });
        await context.addInitScript({ content: axeSource });
        try {
          const page = await context.newPage();
          for (const pagePath of lane) {
            await page.goto(`${server.origin}/${pagePath}`);
            const result = (await page.evaluate(async (tags) => {
              // Runs in the page; typed loosely so the project needs no DOM library types.
              const scope = globalThis as unknown as { axe: { run: (context: unknown, options: object) => Promise<unknown> } };
              return scope.axe.run(
                { exclude: [['svg[role="img"] > *']] },
                { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] },
              );
            }, WCAG_TAGS)) as {
              violations: Array<{ id: string; impact: string | null; help: string; nodes: Array<{ target: string[] }> }>;
            };
            for (const violation of result.violations) {
              violations.push({
                page: pagePath,
                id: violation.id,
                impact: violation.impact,
                help: violation.help,
                targets: violation.nodes.flatMap((node) => node.target.map(String)),
              });
            }
          }
        } finally {
          await context.close();
        }
      }),
    );
  } finally {
    await server.close();
  }
  violations.sort((a, b) => a.page.localeCompare(b.page) || a.id.localeCompare(b.id));
  return { pages: pages.length, violations };
}

/** Paths whose bytes differ between two trees, or that stand in only one. */
export function diffTrees(a: string, b: string): string[] {
  const left = treeHashes(a);
  const right = treeHashes(b);
  const paths = [...new Set([...Object.keys(left), ...Object.keys(right)])].sort();
  return paths.filter((path) => left[path] !== right[path]);
}
