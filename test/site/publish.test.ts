import { spawn } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';
import { publishAtomically } from '../../src/site/publish.ts';
import { EXAMPLE } from '../support/exampleSite.ts';
import { treeHashes } from '../support/gates.ts';

const scratch = () => mkdtempSync(join(tmpdir(), 'limnopress-publish-'));

/** A site in the earlier layout (a plain folder) that this tool published: its manifest says so. */
function publishedSite(root: string): string {
  const site = join(root, 'site');
  mkdirSync(join(site, 'a'), { recursive: true });
  writeFileSync(join(site, 'index.html'), 'old');
  writeFileSync(join(site, 'a', 'page.html'), 'old page');
  writeFileSync(join(site, 'manifest.json'), '{"tool":{"name":"limnopress"}}\n');
  return site;
}

describe('publishAtomically', () => {
  it('publishAtomically(dir, write) replaces the folder only after the write succeeded', async () => {
    const root = scratch();
    const site = publishedSite(root);
    await publishAtomically(site, async (staging) => writeFileSync(join(staging, 'index.html'), 'new'));
    expect(readdirSync(site)).toEqual(['index.html']);
    // The old folder is gone (it was ours); the site is a link into the store beside it.
    expect(readdirSync(root).sort()).toEqual(['.site.limnopress', 'site']);
    expect(readlinkSync(site)).toMatch(/^\.site\.limnopress\/site-/);
  });

  it('publishAtomically(dir, write) leaves the old site intact and no staging folder when write throws', async () => {
    const root = scratch();
    const site = publishedSite(root);
    const before = treeHashes(site);
    await expect(
      publishAtomically(site, async (staging) => {
        writeFileSync(join(staging, 'index.html'), 'half');
        throw new Error('disk full');
      }),
    ).rejects.toThrow('disk full');
    expect(treeHashes(site)).toEqual(before);
    expect(readdirSync(root).sort()).toEqual(['.site.limnopress', 'site']);
    expect(readdirSync(join(root, '.site.limnopress'))).toEqual([]);
  });
});

describe('build on bad input', () => {
  it('build(bad folder) throws InputError and leaves the published site byte-for-byte intact', async () => {
    const root = scratch();
    const site = publishedSite(root);
    const before = treeHashes(site);
    const bad = join(root, 'bulletin');
    cpSync(EXAMPLE, bad, { recursive: true });
    writeFileSync(join(bad, 'data', 'surface-area.csv'), 'body_id,month,water_area_ha,observed_share\nWB001,2026-11,abc,0.9\n');
    await expect(build({ bulletinFolder: bad, outDir: site })).rejects.toMatchObject({ name: 'InputError' });
    expect(treeHashes(site)).toEqual(before);
    expect(readdirSync(root).sort()).toEqual(['.site.limnopress', 'bulletin', 'site']);
    expect(readdirSync(join(root, '.site.limnopress'))).toEqual([]);
  });

  it('a build killed part way leaves the old site intact, and the next build cleans up after it', async () => {
    const root = scratch();
    const site = publishedSite(root);
    const before = treeHashes(site);
    const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
    const child = spawn(process.execPath, [cli, 'build', EXAMPLE, '--out', site], { stdio: ['ignore', 'ignore', 'pipe'] });
    // Kill it as soon as it reports the page stage, while the staging folder is being written.
    await new Promise<void>((resolve) => {
      child.stderr.on('data', (chunk: Buffer) => {
        if (chunk.toString().includes('4/5')) {
          child.kill('SIGKILL');
        }
      });
      child.on('exit', () => resolve());
    });
    expect(child.signalCode).toBe('SIGKILL');
    expect(treeHashes(site)).toEqual(before);
    await build({ bulletinFolder: EXAMPLE, outDir: site });
    expect(existsSync(join(site, 'issues', '2026-11', 'index.html'))).toBe(true);
    expect(readdirSync(root).sort()).toEqual(['.site.limnopress', 'site']);
    expect(readdirSync(join(root, '.site.limnopress'))).toEqual([readlinkSync(site).split('/').pop()]);
  });
});
