import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
const run = (...args: string[]) => spawnSync(process.execPath, [cli, ...args], { encoding: 'utf8' });

describe('limnopress init and new-issue', () => {
  it('init writes a folder that checks clean and builds at once, as a draft with a banner and noindex', async () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'limnopress-init-')), 'bulletin');
    const result = run('init', folder, '--month', '2026-03');
    expect(result.status).toBe(0);
    expect(run('check', folder).stdout).toBe('No problems found.\n');
    const site = join(folder, '..', 'site');
    await build({ bulletinFolder: folder, outDir: site });
    const overview = readFileSync(join(site, 'issues', '2026-03', 'index.html'), 'utf8');
    expect(overview).toContain('<meta name="robots" content="noindex">');
    expect(overview).toContain('Draft: this issue is not yet published');
    expect(overview).toContain('Write the foreword of this issue here');
  });

  it('init --locales en,fr writes a bilingual folder with a French foreword stub, and new-issue renews it', async () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'limnopress-init-')), 'bulletin');
    expect(run('init', folder, '--month', '2026-03', '--locales', 'en,fr').status).toBe(0);
    expect(JSON.parse(readFileSync(join(folder, 'bulletin.json'), 'utf8')).locales).toEqual(['en', 'fr']);
    const site = join(folder, '..', 'site');
    await build({ bulletinFolder: folder, outDir: site });
    const french = readFileSync(join(site, 'fr', 'issues', '2026-03', 'index.html'), 'utf8');
    expect(french).toContain('<html lang="fr">');
    expect(french).toContain('Brouillon\u00a0: ce numéro n&#39;est pas encore publié');
    expect(french).toContain("Écrivez ici l'avant-propos de ce numéro en français");
    // The French foreword written for March goes to the archive; April starts from a fresh stub.
    writeFileSync(join(folder, 'content', 'foreword.fr.md'), 'Avant-propos de mars.\n');
    expect(run('new-issue', folder).status).toBe(0);
    expect(readFileSync(join(folder, 'archive', '2026-03', 'content', 'foreword.fr.md'), 'utf8')).toBe('Avant-propos de mars.\n');
    expect(readFileSync(join(folder, 'content', 'foreword.fr.md'), 'utf8')).toContain("Écrivez ici l'avant-propos");
    const unknown = run('init', join(folder, '..', 'other'), '--month', '2026-03', '--locales', 'en,xx');
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toContain('--locales takes a comma-separated list of en, fr');
  });

  it('init refuses a folder that is not empty, and needs --month', () => {
    const folder = mkdtempSync(join(tmpdir(), 'limnopress-init-'));
    writeFileSync(join(folder, 'keep.txt'), 'mine');
    expect(run('init', folder, '--month', '2026-03').status).toBe(1);
    expect(readFileSync(join(folder, 'keep.txt'), 'utf8')).toBe('mine');
    expect(run('init', join(folder, 'new')).status).toBe(2);
  });

  it('new-issue archives the current issue with its inputs and starts the next month as a draft', async () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'limnopress-new-')), 'bulletin');
    run('init', folder, '--month', '2026-03');
    const result = run('new-issue', folder, '--published', '2026-05-04');
    expect(result.status).toBe(0);
    const archived = join(folder, 'archive', '2026-03');
    expect(existsSync(join(archived, 'data', 'surface-area.csv'))).toBe(true);
    expect(JSON.parse(readFileSync(join(archived, 'bulletin.json'), 'utf8')).issue.month).toBe('2026-03');
    const next = JSON.parse(readFileSync(join(folder, 'bulletin.json'), 'utf8')).issue;
    expect(next).toMatchObject({ month: '2026-04', published: '2026-05-04', revision: 1, draft: true, corrections: [] });
    // The new month has no rows yet: the check says so, and the archived issue still checks clean.
    expect(run('check', folder).stdout).toContain('the surface-area table has no row for the bulletin month');
    expect(run('check', archived).stdout).toBe('No problems found.\n');
    expect(run('new-issue', join(folder, 'missing')).status).toBe(1);
  });
});
