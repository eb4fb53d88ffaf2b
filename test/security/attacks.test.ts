/**
 * The attack corpus: one test per class of attack or fault that once got through (paths out of the
 * folder, links, pipes and devices, a destructive --out, stored script through a published input,
 * concurrent and killed builds, crashes and silently accepted inputs). Every test that could touch a
 * published site compares its tree before and after.
 */
import { say } from '../../src/common/problemMessages.ts';
import { spawn, spawnSync } from 'node:child_process';
import {
  existsSync,
  lstatSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  readlinkSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/build.ts';
import { loadIssues } from '../../src/ingest/issues.ts';
import type { Problem } from '../../src/ingest/index.ts';
import { serveFolder } from '../../src/site/serve.ts';
import { verifySite } from '../../src/site/verify.ts';
import { csvField } from '../../src/text/csv.ts';
import { isolateBidi } from '../../src/text/bidi.ts';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';
import { treeHashes } from '../support/gates.ts';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
const run = (...args: string[]) => spawnSync(process.execPath, [cli, ...args], { encoding: 'utf8' });
const config = (change: (c: typeof MINI_CONFIG & Record<string, unknown>) => void) => {
  const c = structuredClone(MINI_CONFIG) as typeof MINI_CONFIG & Record<string, unknown>;
  change(c);
  return JSON.stringify(c, null, 2);
};
const codes = (problems: Problem[]) => problems.filter((p) => p.severity === 'error').map((p) => p.code);
async function errorsOf(folder: string): Promise<string[]> {
  const { problems } = await loadIssues(folder);
  return codes(problems);
}

/** A published site of the mini bulletin, and a scratch folder beside it. */
async function publishedMini(): Promise<{ folder: string; site: string; before: Record<string, string> }> {
  const folder = writeMini();
  const site = join(folder, '..', 'site');
  await build({ bulletinFolder: folder, outDir: site });
  return { folder, site, before: treeHashes(site) };
}

describe('confinement: input paths stay inside the bulletin folder', () => {
  it('refuses ../ paths, absolute paths and links out, and reads none of them', async () => {
    const outside = mkdtempSync(join(tmpdir(), 'limnopress-outside-'));
    writeFileSync(join(outside, 'rain.csv'), 'subregion_id,month,rainfall_mm\nR1,2020-06,50\n');
    const up = writeMini({
      'bulletin.json': config((c) => (c.inputs.rainfall = '../../../../../../../../../../' + join(outside, 'rain.csv').slice(1))),
    });
    expect(await errorsOf(up)).toEqual(['path-outside']);
    const absolute = writeMini({ 'bulletin.json': config((c) => (c.inputs.rainfall = join(outside, 'rain.csv'))) });
    expect(await errorsOf(absolute)).toEqual(['path-outside']);
    const linked = writeMini();
    symlinkSync(join(outside, 'rain.csv'), join(linked, 'linked.csv'));
    writeFileSync(
      join(linked, 'bulletin.json'),
      config((c) => (c.inputs.rainfall = 'linked.csv')),
    );
    expect(await errorsOf(linked)).toEqual(['path-outside']);
    // The system's password file through an inventory path: refused before a byte is read or echoed.
    const passwd = writeMini({ 'bulletin.json': config((c) => (c.inputs.inventory = '../../../../../../../../etc/passwd')) });
    const { problems } = await loadIssues(passwd);
    expect(codes(problems)).toEqual(['path-outside']);
    expect(JSON.stringify(problems)).not.toContain('root:');
  });

  it('a link inside the folder to a file inside it is read as that file', async () => {
    const folder = writeMini();
    symlinkSync(join(folder, 'rain.csv'), join(folder, 'rain-link.csv'));
    writeFileSync(
      join(folder, 'bulletin.json'),
      config((c) => (c.inputs.rainfall = 'rain-link.csv')),
    );
    expect(await errorsOf(folder)).toEqual([]);
  });

  it('a foreword linked out of the folder, a FIFO as the foreword and a device as the boundaries are refused without hanging', async () => {
    const foreword = writeMini();
    mkdirSync(join(foreword, 'content'));
    symlinkSync('/etc/passwd', join(foreword, 'content', 'foreword.md'));
    expect(await errorsOf(foreword)).toEqual(['path-outside']);
    const fifo = writeMini();
    mkdirSync(join(fifo, 'content'));
    expect(spawnSync('mkfifo', [join(fifo, 'content', 'foreword.md')]).status).toBe(0);
    expect(await errorsOf(fifo)).toEqual(['not-regular-file']);
    const device = writeMini();
    symlinkSync('/dev/zero', join(device, 'zero.geojson'));
    writeFileSync(
      join(device, 'bulletin.json'),
      config((c) => (c.inputs.boundaries = 'zero.geojson')),
    );
    expect(await errorsOf(device)).toEqual(['path-outside']);
  });

  it('a Latin-1 foreword is refused, not published with replacement characters', async () => {
    const folder = writeMini();
    mkdirSync(join(folder, 'content'));
    writeFileSync(join(folder, 'content', 'foreword.md'), Buffer.from([0x43, 0x61, 0x66, 0xe9, 0x0a]));
    expect(await errorsOf(folder)).toEqual(['not-utf8']);
  });

  it('a symlink loop in a Parquet folder and an archive entry linked outside are refused, not followed', async () => {
    const loop = writeMini();
    mkdirSync(join(loop, 'parts'));
    symlinkSync(join(loop, 'parts'), join(loop, 'parts', 'again'));
    writeFileSync(
      join(loop, 'bulletin.json'),
      config((c) => (c.inputs.rainfall = 'parts')),
    );
    expect(await errorsOf(loop)).toEqual(['partition-link']);
    const archive = writeMini();
    const elsewhere = writeMini();
    mkdirSync(join(archive, 'archive'));
    symlinkSync(elsewhere, join(archive, 'archive', '2020-05'));
    expect(await errorsOf(archive)).toEqual(['archive-link']);
  });
});

describe('published inputs keep a safe name and type', () => {
  it('an inventory named bodies.html is published as water-bodies.csv, and preview serves it with CSP and nosniff', async () => {
    const folder = writeMini();
    const csv = readFileSync(join(folder, 'bodies.csv'), 'utf8').replace('Lake One', '<script>alert(1)</script>');
    writeFileSync(join(folder, 'bodies.html'), csv);
    writeFileSync(
      join(folder, 'bulletin.json'),
      config((c) => (c.inputs.inventory = 'bodies.html')),
    );
    const site = join(folder, '..', 'site');
    await build({ bulletinFolder: folder, outDir: site });
    const inputs = join(site, 'issues', '2020-06', 'data', 'inputs');
    expect(readdirSync(inputs).sort()).toEqual([
      'bulletin.json',
      'distribution.csv',
      'field-measurements.csv',
      'rainfall.csv',
      'subregions.geojson',
      'surface-area.csv',
      'water-bodies.csv',
      'water-quality.csv',
    ]);
    const server = await serveFolder(site);
    try {
      const response = await fetch(`${server.origin}/issues/2020-06/data/inputs/water-bodies.csv`);
      expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
      expect(response.headers.get('x-content-type-options')).toBe('nosniff');
      expect(response.headers.get('content-security-policy')).toContain("script-src 'none'");
      expect((await fetch(`${server.origin}/%`)).status).toBe(404);
      expect((await fetch(`${server.origin}/`)).status).toBe(200);
    } finally {
      await server.close();
    }
  });
});

describe('a safe --out', () => {
  it('refuses --out that is the bulletin folder, inside it, the current folder, "", / or a file, and changes nothing', async () => {
    const folder = writeMini();
    const before = treeHashes(folder);
    for (const out of [folder, join(folder, 'site'), join(folder, '..'), '', '/', process.cwd()]) {
      await expect(build({ bulletinFolder: folder, outDir: out })).rejects.toMatchObject({ name: 'PublishError' });
    }
    const file = join(folder, '..', 'file.txt');
    writeFileSync(file, 'mine');
    await expect(build({ bulletinFolder: folder, outDir: file })).rejects.toThrow(/is a file/);
    expect(readFileSync(file, 'utf8')).toBe('mine');
    expect(treeHashes(folder)).toEqual(before);
  });

  it('refuses a non-empty folder that is not a limnopress site; --force keeps it under a new name', async () => {
    const folder = writeMini();
    const out = join(folder, '..', 'mine');
    mkdirSync(out);
    writeFileSync(join(out, 'thesis.docx'), 'only copy');
    await expect(build({ bulletinFolder: folder, outDir: out })).rejects.toThrow(/no limnopress site/);
    expect(readFileSync(join(out, 'thesis.docx'), 'utf8')).toBe('only copy');
    await build({ bulletinFolder: folder, outDir: out, force: true });
    const kept = readdirSync(join(folder, '..')).filter((name) => name.startsWith('mine.replaced-'));
    expect(kept).toHaveLength(1);
    expect(readFileSync(join(folder, '..', kept[0] as string, 'thesis.docx'), 'utf8')).toBe('only copy');
    expect(lstatSync(out).isSymbolicLink()).toBe(true);
  });

  it('publishes as a link into its own store; a rebuild swaps the link and leaves one version', async () => {
    const { folder, site } = await publishedMini();
    const first = readlinkSync(site);
    await build({ bulletinFolder: folder, outDir: site });
    expect(readlinkSync(site)).not.toBe(first);
    expect(readdirSync(join(folder, '..', '.site.limnopress'))).toEqual([readlinkSync(site).split('/').pop()]);
    expect(verifySite(site).findings).toEqual([]);
  });
});

describe('locked, crash-proof publishing', () => {
  it('a second build to the same --out while one is running fails clearly; the first completes', async () => {
    const folder = writeMini();
    const site = join(folder, '..', 'site');
    let release = () => {};
    let paused = () => {};
    const reached = new Promise<void>((resolve) => (paused = resolve));
    const first = build({
      bulletinFolder: folder,
      outDir: site,
      pause: async (point) => {
        if (point !== 'pages') return;
        paused();
        await new Promise<void>((resolve) => (release = resolve));
      },
    });
    await reached;
    await expect(build({ bulletinFolder: folder, outDir: site })).rejects.toThrow(/another build is publishing/);
    release();
    await first;
    expect(verifySite(site).findings).toEqual([]);
  });

  // Each kill lands at one exact step (the build pauses there through the test hook).
  for (const point of ['locked', 'inputs', 'model', 'charts', 'pages', 'renamed', 'linked', 'swapped'] as const) {
    it(`kill -9 at "${point}" leaves a complete site, and the next build succeeds`, async () => {
      const { folder, site, before } = await publishedMini();
      const child = spawn(process.execPath, [cli, 'build', folder, '--out', site, '--quiet'], {
        stdio: ['ignore', 'ignore', 'pipe'],
        env: { ...process.env, LIMNOPRESS_TEST_PAUSE: point },
      });
      let err = '';
      await new Promise<void>((resolve) => {
        child.stderr.on('data', (chunk: Buffer) => {
          err += chunk.toString();
          if (err.includes(`limnopress-paused ${point}`)) child.kill('SIGKILL');
        });
        child.on('exit', () => resolve());
      });
      expect(child.signalCode).toBe('SIGKILL');
      expect(verifySite(site).findings).toEqual([]);
      // Before the link is swapped the old site stands; after, the new one (the same inputs give the same bytes).
      expect(treeHashes(site)).toEqual(before);
      await build({ bulletinFolder: folder, outDir: site });
      expect(verifySite(site).findings).toEqual([]);
      expect(readdirSync(join(folder, '..', '.site.limnopress'))).toHaveLength(1);
    });
  }

  it('SIGTERM during a build removes its staging folder and lock and leaves the old site', async () => {
    const { folder, site, before } = await publishedMini();
    const child = spawn(process.execPath, [cli, 'build', folder, '--out', site, '--quiet'], {
      stdio: ['ignore', 'ignore', 'pipe'],
      env: { ...process.env, LIMNOPRESS_TEST_PAUSE: 'pages' },
    });
    let err = '';
    const code = await new Promise<number | null>((resolve) => {
      child.stderr.on('data', (chunk: Buffer) => {
        err += chunk.toString();
        if (err.includes('limnopress-paused pages')) child.kill('SIGTERM');
      });
      child.on('exit', (exit) => resolve(exit));
    });
    expect(code).toBe(143);
    expect(readdirSync(join(folder, '..', '.site.limnopress'))).toEqual([readlinkSync(site).split('/').pop()]);
    expect(treeHashes(site)).toEqual(before);
  });

  it('an unwritable --out fails before the build, in one line and with no stack', () => {
    const folder = writeMini();
    const result = run('build', folder, '--out', '/proc/limnopress-site');
    expect(result.status).toBe(1);
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
    expect(result.stderr).not.toMatch(/\n\s+at /);
  });
});

describe('crash inputs are caught by check, in one line each, with no stack', () => {
  const cases: Array<[string, () => string, string]> = [
    [
      'a javascript: base URL',
      () => writeMini({ 'bulletin.json': config((c) => (c.site.baseUrl = 'javascript:alert(1)')) }),
      'config-invalid',
    ],
    [
      'a status band without wording',
      () => writeMini({ 'bulletin.json': config((c) => (c.statusBands[1]!.key = 'below-normal')) }),
      'config-band-words',
    ],
    [
      'a 302-character id',
      () =>
        writeMini({
          'bodies.csv': `body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page\n${'A'.repeat(302)},Lake,R1,10.1,50.1,10,lake,no\nB,Two,R1,10.2,50.2,200,reservoir,yes\n`,
        }),
      'value-too-long',
    ],
    [
      'ids S1 and s1 on one page path',
      () =>
        writeMini({
          'bodies.csv':
            'body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page\nA,Lake,R1,10.1,50.1,10,lake,no\nB,Two,R1,10.2,50.2,200,reservoir,yes\nb,Three,R1,10.3,50.3,20,lake,no\n',
        }),
      'id-path-collision',
    ],
    [
      'polygon coordinates of ±1e300',
      () =>
        writeMini({
          'regions.geojson': JSON.stringify({
            type: 'FeatureCollection',
            features: [
              {
                type: 'Feature',
                properties: { subregion_id: 'R1', name: 'R' },
                geometry: {
                  type: 'Polygon',
                  coordinates: [
                    [
                      [-1e300, -1e300],
                      [1e300, -1e300],
                      [1e300, 1e300],
                      [-1e300, -1e300],
                    ],
                  ],
                },
              },
            ],
          }),
        }),
      'geojson-position',
    ],
    ['a null GeoJSON feature', () => writeMini({ 'regions.geojson': '{"type":"FeatureCollection","features":[null]}' }), 'geojson-feature'],
    [
      'latitudes of 95-100',
      () =>
        writeMini({
          'regions.geojson': JSON.stringify({
            type: 'FeatureCollection',
            features: [
              {
                type: 'Feature',
                properties: { subregion_id: 'R1', name: 'R' },
                geometry: {
                  type: 'Polygon',
                  coordinates: [
                    [
                      [10, 95],
                      [11, 95],
                      [11, 100],
                      [10, 95],
                    ],
                  ],
                },
              },
            ],
          }),
        }),
      'geojson-position',
    ],
    [
      'an empty ring list',
      () =>
        writeMini({
          'regions.geojson': JSON.stringify({
            type: 'FeatureCollection',
            features: [
              { type: 'Feature', properties: { subregion_id: 'R1', name: 'R' }, geometry: { type: 'Polygon', coordinates: [[]] } },
            ],
          }),
        }),
      'geojson-ring',
    ],
    ['issue.month 1900-01', () => writeMini({ 'bulletin.json': config((c) => (c.issue.month = '1900-01')) }), 'config-invalid'],
    ['published 2026-02-30', () => writeMini({ 'bulletin.json': config((c) => (c.issue.published = '2026-02-30')) }), 'config-invalid'],
    ['an empty input path', () => writeMini({ 'bulletin.json': config((c) => (c.inputs.rainfall = '')) }), 'config-invalid'],
  ];
  for (const [name, make, code] of cases) {
    it(`${name} → ${code}`, async () => {
      expect(await errorsOf(make())).toContain(code);
    });
  }

  it('the command line prints one line per problem, no stack, exit 1 (check) and nothing written (build)', () => {
    const folder = writeMini({ 'regions.geojson': '{"type":"FeatureCollection","features":[null]}' });
    const check = run('check', folder);
    expect(check.status).toBe(1);
    expect(check.stdout).toContain('a feature is not an object');
    const out = join(folder, '..', 'site');
    const result = run('build', folder, '--out', out);
    expect(result.status).toBe(1);
    expect(result.stderr).not.toMatch(/\n\s+at /);
    expect(existsSync(out)).toBe(false);
  });

  it('a base URL without a trailing slash keeps its path in canonical URLs', async () => {
    const folder = writeMini({ 'bulletin.json': config((c) => (c.site.baseUrl = 'https://example.org/water')) });
    const site = join(folder, '..', 'site');
    await build({ bulletinFolder: folder, outDir: site });
    expect(readFileSync(join(site, 'issues', '2020-06', 'index.html'), 'utf8')).toContain(
      'href="https://example.org/water/issues/2020-06/"',
    );
  });
});

describe('verify stays inside the site', () => {
  it('a manifest listing ../ paths, or of the wrong shape, is a finding, never a crash or a read outside', async () => {
    const { site } = await publishedMini();
    const manifest = JSON.parse(readFileSync(join(site, 'manifest.json'), 'utf8')) as { outputs: Array<{ path: string; sha256: string }> };
    manifest.outputs.push({ path: '../../../../etc/passwd', sha256: '0'.repeat(64) });
    writeFileSync(join(site, 'manifest.json'), JSON.stringify(manifest));
    expect(verifySite(site).findings).toContainEqual({ path: 'manifest.json', kind: 'manifest-unreadable' });
    writeFileSync(join(site, 'manifest.json'), '{"issues": 5}');
    expect(verifySite(site).findings).toEqual([{ path: 'manifest.json', kind: 'manifest-unreadable' }]);
  });
});

describe('new-issue', () => {
  it('refuses an issue with errors (so a second run never archives an empty month) and leaves no half-made archive', async () => {
    const folder = writeMini();
    expect(run('new-issue', folder).status).toBe(0);
    expect(existsSync(join(folder, 'archive', '2020-06', 'bodies.csv'))).toBe(true);
    const again = run('new-issue', folder);
    expect(again.status).toBe(1);
    expect(again.stderr).toContain('nothing was archived');
    expect(readdirSync(join(folder, 'archive'))).toEqual(['2020-06']);
    const broken = writeMini({ 'bulletin.json': config((c) => (c.inputs.rainfall = 'missing.csv')) });
    expect(run('new-issue', broken).status).toBe(1);
    expect(existsSync(join(broken, 'archive'))).toBe(false);
  });
});

describe('lesser items', () => {
  it('CSV cells that a spreadsheet would run are neutralized; numbers stay numbers (OWASP CSV injection guidance)', () => {
    expect(['=1+1', '+cmd', '-x', '@SUM(A1)', '\tx', 'plain', '-0.5', '+3', '1e-3'].map(csvField)).toEqual([
      "'=1+1",
      "'+cmd",
      "'-x",
      "'@SUM(A1)",
      "'\tx",
      'plain',
      '-0.5',
      '+3',
      '1e-3',
    ]);
  });

  it('names with right-to-left overrides are isolated (Unicode Standard Annex #9, FSI … PDI)', () => {
    expect(isolateBidi('Lake \u202Eevil')).toBe('\u2068Lake \u202Eevil\u2069');
    expect(isolateBidi('Lake One')).toBe('Lake One');
  });

  it('a 10 MB value is echoed as its first 200 characters', async () => {
    const folder = writeMini({
      'area.csv': `body_id,month,water_area_ha,observed_share,scenes\nA,2020-06,${'9'.repeat(10_000_000)}x,0.95,3\n`,
    });
    const { problems } = await loadIssues(folder);
    const longest = Math.max(...problems.map((problem) => problem.value.length));
    expect(longest).toBeLessThanOrEqual(201);
  });

  it('markup in a body name is escaped once in <title>', async () => {
    const folder = writeMini({
      'bodies.csv':
        'body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page\nA,Lake One,R1,10.1,50.1,10,lake,no\nB,Tom & <b>Jerry</b>,R1,10.2,50.2,200,reservoir,yes\n',
    });
    const site = join(folder, '..', 'site');
    await build({ bulletinFolder: folder, outDir: site });
    const page = readFileSync(join(site, 'issues', '2020-06', 'water-bodies', 'b', 'index.html'), 'utf8');
    expect(page).toContain('<title>Tom &amp; &lt;b&gt;Jerry&lt;/b&gt; · ');
  });

  it('trend refuses values beyond the arithmetic and series beyond the pairwise limit', () => {
    const dir = mkdtempSync(join(tmpdir(), 'limnopress-trend-'));
    writeFileSync(join(dir, 'big.csv'), `t,v\n1,1e308\n2,-1e308\n3,1e308\n4,1\n`);
    const big = run('trend', join(dir, 'big.csv'), '--time', 't', '--value', 'v');
    expect(big.status).toBe(1);
    expect(big.stderr).toContain('too large for the trend arithmetic');
    writeFileSync(join(dir, 'long.csv'), `t,v\n${Array.from({ length: 6000 }, (_, k) => `${k},${k % 7}`).join('\n')}\n`);
    const long = run('trend', join(dir, 'long.csv'), '--time', 't', '--value', 'v');
    expect(long.status).toBe(1);
    expect(long.stderr).toContain('more than the pairwise trend methods are run on');
  });
});

describe('root cause first', () => {
  it('problems of the configuration, boundaries and inventory come before those they cause', async () => {
    const { ProblemList } = await import('../../src/ingest/problems.ts');
    const list = new ProblemList();
    const base = { line: 2, column: '', value: '', expected: '' };
    list.error({ ...base, code: 'unknown-body', file: 'area.csv', message: say('unknown-body') });
    list.error({ ...base, code: 'value-not-number', file: 'water-bodies.csv', message: say('value-not-number') });
    list.error({ ...base, code: 'config-invalid', file: 'bulletin.json', message: say('config-invalid', { detail: 'bad' }) });
    expect(list.sorted().map((problem) => problem.file)).toEqual(['bulletin.json', 'water-bodies.csv', 'area.csv']);
  });
});

describe('isInside', () => {
  it('a name that starts with two dots is inside; .. and absolute paths out are not', async () => {
    const { isInside } = await import('../../src/common/paths.ts');
    expect(isInside('/srv/bulletin', '/srv/bulletin/..notes.csv')).toBe(true);
    expect(isInside('/srv/bulletin', '/srv/bulletin')).toBe(true);
    expect(isInside('/srv/bulletin', '/srv/bulletin-2/x.csv')).toBe(false);
    expect(isInside('/srv/bulletin', '/srv')).toBe(false);
  });
});
