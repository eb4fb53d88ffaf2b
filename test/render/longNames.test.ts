/**
 * Long names do not widen pages: with every water body and sub-region given a name of 60 characters
 * or more without a space, markup characters included, no page of the issue is wider than a 320 px
 * screen (WCAG 2.2 success criterion 1.4.10, Reflow: 320 CSS px). Tables may scroll inside their own
 * box; nothing else may.
 */
import { cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';
import { EXAMPLE } from '../support/exampleSite.ts';
import { htmlPages, launchChromium, serveFolder } from '../support/gates.ts';

const BODY = 'Reservoir-of-the-Upper-Velduran-Basin-Southern-Arm<b>&amp;</b>Outflow';
const SUB_REGION = 'Southern-Uplands-and-Lowlands-of-the-Velduran-Basin<i>Catchment</i>';

describe('long names at 320 px', () => {
  it('no page of an issue whose names are 60+ characters without a space is wider than 320 px, in either language', async () => {
    expect(BODY.length).toBeGreaterThanOrEqual(60);
    expect(SUB_REGION.length).toBeGreaterThanOrEqual(60);
    const root = mkdtempSync(join(tmpdir(), 'limnopress-long-names-'));
    const folder = join(root, 'bulletin');
    // The current issue alone: the archive would only make the build longer.
    cpSync(EXAMPLE, folder, { recursive: true, filter: (source) => !source.includes(`${EXAMPLE}/archive`) });
    const inventory = join(folder, 'data', 'water-bodies.csv');
    writeFileSync(
      inventory,
      readFileSync(inventory, 'utf8').replace(/^(WB\d+),[^,]*,/gm, (_, id: string) => `${id},"${BODY}-${id}",`),
    );
    const boundaries = join(folder, 'data', 'subregions.geojson');
    writeFileSync(
      boundaries,
      readFileSync(boundaries, 'utf8').replace(/"name": ?"[^"]*"/g, JSON.stringify({ name: SUB_REGION }).slice(1, -1)),
    );
    const out = join(root, 'site');
    await build({ bulletinFolder: folder, outDir: out });
    const server = await serveFolder(out);
    const browser = await launchChromium();
    try {
      const page = await browser.newPage({ viewport: { width: 320, height: 640 } });
      const pages = htmlPages(out);
      const overflowing: string[] = [];
      for (const file of pages) {
        const path = `/${file
          .split('\\')
          .join('/')
          .replace(/index\.html$/, '')}`;
        await page.goto(`${server.origin}${path}`);
        const { scrollWidth, clientWidth, shown } = await page.evaluate((name) => {
          const document = (
            globalThis as unknown as { document: { documentElement: { scrollWidth: number; clientWidth: number; textContent: string } } }
          ).document;
          const root = document.documentElement;
          return { scrollWidth: root.scrollWidth, clientWidth: root.clientWidth, shown: root.textContent.includes(name) };
        }, BODY);
        if (scrollWidth > clientWidth) overflowing.push(`${path} ${scrollWidth} > ${clientWidth}`);
        if (path.endsWith('/water-bodies/wb079/')) expect(shown, path).toBe(true);
      }
      expect(pages.length).toBeGreaterThan(60);
      expect(overflowing).toEqual([]);
    } finally {
      await browser.close();
      await server.close();
    }
  });
});
