/**
 * The tool as someone outside the clone gets it: `npm pack` (which compiles src/ into dist/
 * through `prepare`), then `npm install -g` of the tarball into a temporary prefix, then the
 * installed `limnopress` writes the `init` sample, checks it and builds it. The installed command
 * must run the compiled JavaScript: the package holds no TypeScript sources and no tsx.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const npm = (args: string[], cwd: string) =>
  spawnSync('npm', args, {
    cwd,
    encoding: 'utf8',
    env: { ...process.env, npm_config_update_notifier: 'false', npm_config_fund: 'false', npm_config_audit: 'false' },
  });

describe('the packed tool installed outside the clone', () => {
  it('installs from its tarball, runs compiled, and builds the init sample', () => {
    const work = mkdtempSync(join(tmpdir(), 'limnopress-install-'));
    const packed = npm(['pack', '--pack-destination', work, '--json'], root);
    expect(packed.status, packed.stderr).toBe(0);
    const [info] = JSON.parse(packed.stdout.slice(packed.stdout.indexOf('['))) as Array<{
      filename: string;
      files: Array<{ path: string }>;
    }>;
    const files = info!.files.map((file) => file.path);
    expect(files).toContain('dist/cli/main.js');
    expect(files).toContain('dist/parallel/worker.js');
    expect(files).toContain('content/locales/en.json');
    expect(files.filter((path) => path.endsWith('.ts') && !path.endsWith('.d.ts'))).toEqual([]);

    const prefix = join(work, 'prefix');
    const installed = npm(['install', '-g', '--prefix', prefix, '--prefer-offline', join(work, info!.filename)], work);
    expect(installed.status, installed.stderr).toBe(0);
    const bin = join(prefix, 'bin', 'limnopress');
    const packageDir = join(prefix, 'lib', 'node_modules', 'limnopress');
    expect(existsSync(join(packageDir, 'src'))).toBe(false);
    expect(existsSync(join(packageDir, 'node_modules', 'tsx'))).toBe(false);

    const run = (...args: string[]) => spawnSync(bin, args, { cwd: work, encoding: 'utf8' });
    const version = run('--version');
    expect(version.stdout).toBe(`${JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')).version}\n`);
    expect(version.stderr).toBe('');
    expect(run('init', 'sample', '--month', '2026-03').status).toBe(0);
    expect(run('check', 'sample').stdout).toBe('No problems found.\n');
    const built = run('build', 'sample', '--out', 'site', '--quiet');
    expect(built.status, built.stderr).toBe(0);
    expect(built.stderr).toBe('');
    expect(readdirSync(join(work, 'site', 'issues', '2026-03'))).toContain('index.html');
    expect(run('verify', 'site').status).toBe(0);
  });
});
