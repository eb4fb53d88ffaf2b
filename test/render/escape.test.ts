import { cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

describe('renderSite', () => {
  it('renderSite escapes text from the configuration in pages', async () => {
    const root = mkdtempSync(join(tmpdir(), 'limnopress-escape-'));
    const folder = join(root, 'bulletin');
    // The current issue alone is enough here: the archive would only make the build longer.
    cpSync(EXAMPLE, folder, { recursive: true, filter: (source) => !source.includes(`${EXAMPLE}/archive`) });
    const configPath = join(folder, 'bulletin.json');
    const config = JSON.parse(readFileSync(configPath, 'utf8'));
    config.title = 'Lakes <script>alert(1)</script> & "more"';
    config.region.name = '<img src=x onerror=alert(1)>';
    writeFileSync(configPath, JSON.stringify(config));
    await build({ bulletinFolder: folder, outDir: join(root, 'site') });
    const overview = readFileSync(join(root, 'site', 'issues', '2026-11', 'index.html'), 'utf8');
    expect(overview).not.toContain('<script>');
    expect(overview).not.toContain('<img src=x');
    expect(overview).toContain('Lakes &lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;more&quot;');
    expect(overview).toContain('&lt;img src=x onerror=alert(1)&gt;');
  }, 240_000);
});
