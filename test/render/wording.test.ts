/**
 * A bulletin folder's own wording built end to end: an agency's own band name and reworded
 * interface text reach the pages, the charts and the model in each language, as text (escaped),
 * and an issue without wording keeps the tool's words.
 */
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';
import { toolMessages } from '../../src/text/index.ts';
import { TOOL_ACCENT } from '../../src/render/index.ts';
import { createHash } from 'node:crypto';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';

describe("a bulletin folder's own wording, built", () => {
  it('an own band name and reworded text with markup appear, escaped, in pages, charts and model of both languages', async () => {
    const config = structuredClone(MINI_CONFIG) as typeof MINI_CONFIG & { locales?: string[] };
    config.statusBands[0] = { key: 'below-usual', fromPercent: null };
    // Every month at or below usual is "below-usual": the mini bulletin's June sits in the lowest band or near it.
    config.statusBands[1] = { key: 'near', fromPercent: 150 };
    config.statusBands[2] = { key: 'higher', fromPercent: 200 };
    config.locales = ['en', 'fr'];
    // The agency's accent colour goes into the one stylesheet (tested here to share this build).
    (config.site as Record<string, unknown>).accentColour = '#7A1F5C';
    // And its logo, with markup in its alt text.
    (config.site as Record<string, unknown>).logo = { path: 'logo.svg', alt: '<b>Test</b> office' };
    const logo = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><circle cx="5" cy="5" r="4"/></svg>';
    const folder = writeMini({ 'bulletin.json': JSON.stringify(config, null, 2) });
    writeFileSync(join(folder, 'logo.svg'), logo);
    mkdirSync(join(folder, 'content', 'locales'), { recursive: true });
    const words = {
      en: { 'band.below-usual': 'below <b>our</b> usual', 'site.home': '<i>Start</i> & "go"' },
      fr: { 'band.below-usual': 'sous <b>notre</b> habitude', 'site.home': '<i>Départ</i> & « go »' },
    };
    for (const [locale, own] of Object.entries(words))
      writeFileSync(join(folder, 'content', 'locales', `${locale}.json`), JSON.stringify(own, null, 2));
    const out = join(mkdtempSync(join(tmpdir(), 'limnopress-wording-')), 'site');
    const result = await build({ bulletinFolder: folder, outDir: out });
    expect(result.warnings).toEqual([]);
    const read = (...path: string[]) => readFileSync(join(out, ...path), 'utf8');
    const cases = [
      { prefix: [] as string[], band: 'below &lt;b&gt;our&lt;/b&gt; usual', home: '&lt;i&gt;Start&lt;/i&gt; &amp; &quot;go&quot;' },
      { prefix: ['fr'], band: 'sous &lt;b&gt;notre&lt;/b&gt; habitude', home: '&lt;i&gt;Départ&lt;/i&gt; &amp; « go »' },
    ];
    for (const { prefix, band, home } of cases) {
      const overview = read(...prefix, 'issues', '2020-06', 'index.html');
      expect(overview).not.toMatch(/<b>our|<b>notre|<i>Start|<i>Départ/);
      expect(overview).toContain(home);
      expect(overview).toContain(band);
      const surface = read(...prefix, 'issues', '2020-06', 'surface-water', 'index.html');
      expect(surface).toContain(band);
      expect(surface).not.toMatch(/<b>our|<b>notre/);
      // The home page is a site-level page: it takes the current issue's wording.
      expect(read(...prefix, 'index.html')).toContain(home);
    }
    // The model is worded with the folder's words; the tool's catalogue itself is untouched.
    const model = JSON.parse(read('issues', '2020-06', 'data', 'bulletin-model.json'));
    expect(JSON.stringify(model)).toContain('below <b>our</b> usual');
    // The charts (their Vega-Lite specs, published beside them) carry the band's own words in each language.
    expect(read('issues', '2020-06', 'charts', 'bodies-map.vl.json')).toContain('below <b>our</b> usual');
    expect(read('fr', 'issues', '2020-06', 'charts', 'bodies-map.vl.json')).toContain('sous <b>notre</b> habitude');
    expect(toolMessages('en')['site.home']).toBe('Home');
    // The stylesheet carries the accent, the manifest its new hash, and the tool's template keeps its own.
    const css = read('assets', 'site.css');
    expect(css).toContain('--accent: #7a1f5c;');
    expect(css).not.toContain(TOOL_ACCENT);
    const manifest = JSON.parse(read('manifest.json')) as { outputs: Array<{ path: string; sha256: string }> };
    const listed = manifest.outputs.find((entry) => entry.path === 'assets/site.css');
    expect(listed?.sha256).toBe(createHash('sha256').update(css).digest('hex'));
    expect(readFileSync(new URL('../../templates/assets/site.css', import.meta.url), 'utf8')).toContain(TOOL_ACCENT);
    // The logo: copied as it is, listed in the manifest, shown on every page with its alt text escaped.
    expect(read('assets', 'logo.svg')).toBe(logo);
    expect(manifest.outputs.map((entry) => entry.path)).toContain('assets/logo.svg');
    for (const page of [['index.html'], ['fr', 'issues', '2020-06', 'trends', 'index.html']])
      expect(read(...page)).toContain('<img class="logo" src="/assets/logo.svg" alt="&lt;b&gt;Test&lt;/b&gt; office" height="40">');
  });
});
