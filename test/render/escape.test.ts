import { cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

describe('renderSite', () => {
  it('renderSite escapes text from the configuration and the input tables in pages, SVG, feeds and JSON-LD of both languages', async () => {
    const root = mkdtempSync(join(tmpdir(), 'limnopress-escape-'));
    const folder = join(root, 'bulletin');
    // The current issue alone is enough here: the archive would only make the build longer.
    cpSync(EXAMPLE, folder, { recursive: true, filter: (source) => !source.includes(`${EXAMPLE}/archive`) });
    const configPath = join(folder, 'bulletin.json');
    const config = JSON.parse(readFileSync(configPath, 'utf8'));
    config.title = 'Lakes <script>alert(1)</script> & "more"';
    config.region.name = '<img src=x onerror=alert(1)>';
    writeFileSync(configPath, JSON.stringify(config));
    // A monitored water body and a sub-region whose names are markup with both kinds of quote.
    const body = '<b onmouseover="x">Lake</b> & \'Co\'';
    const subRegion = '</title><i>Flats</i> "&"';
    const inventory = join(folder, 'data', 'water-bodies.csv');
    writeFileSync(inventory, readFileSync(inventory, 'utf8').replace(/^WB079,[^,]*,/m, `WB079,"${body.replace(/"/g, '""')}",`));
    const boundaries = join(folder, 'data', 'subregions.geojson');
    writeFileSync(boundaries, readFileSync(boundaries, 'utf8').replace('"Brennic Vale"', JSON.stringify(subRegion)));
    await build({ bulletinFolder: folder, outDir: join(root, 'site') });
    const read = (...path: string[]) => readFileSync(join(root, 'site', ...path), 'utf8');
    const overview = read('issues', '2026-11', 'index.html');
    expect(overview).not.toContain('<script>');
    expect(overview).not.toContain('<img src=x');
    expect(overview).toContain('Lakes &lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;more&quot;');
    expect(overview).toContain('&lt;img src=x onerror=alert(1)&gt;');
    // In both languages, in headings made from catalogue sentences, tables, SVG titles and JSON-LD.
    for (const prefix of [[], ['fr']]) {
      const bodyPage = read(...prefix, 'issues', '2026-11', 'water-bodies', 'wb079', 'index.html');
      expect(bodyPage).not.toMatch(/<b onmouseover|<i>Flats|<\/title><i>/);
      expect(bodyPage).toContain('&lt;b onmouseover=&quot;x&quot;&gt;Lake&lt;/b&gt; &amp; &#39;Co&#39;');
      expect(bodyPage).toContain('&lt;/title&gt;&lt;i&gt;Flats&lt;/i&gt; &quot;&amp;&quot;');
      const surface = read(...prefix, 'issues', '2026-11', 'surface-water', 'index.html');
      expect(surface).not.toMatch(/<b onmouseover|<i>Flats/);
      const ld =
        /<script type="application\/ld\+json">(.*?)<\/script>/s.exec(read(...prefix, 'issues', '2026-11', 'index.html'))?.[1] ?? '';
      expect(ld).not.toMatch(/[<>]/);
      expect(JSON.parse(ld).spatialCoverage.name).toBe('<img src=x onerror=alert(1)>');
      const atom = read(...prefix, 'feed.xml');
      expect(atom).not.toContain('<script>');
      expect(atom).toContain('Lakes &lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;more&quot;');
      expect(JSON.parse(read(...prefix, 'feed.json')).title).toBe(config.title);
    }
  });
});
