import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { describe, expect, it } from 'vitest';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
const run = (...args: string[]) => spawnSync(process.execPath, [cli, ...args], { encoding: 'utf8' });

describe('limnopress command line', () => {
  it('limnopress --help and build --help print usage and exit 0', () => {
    const main = run('--help');
    expect(main.status).toBe(0);
    expect(main.stdout).toContain('Usage: limnopress <command>');
    const buildHelp = run('build', '--help');
    expect(buildHelp.status).toBe(0);
    expect(buildHelp.stdout).toContain('--out <dir>');
  });

  it('limnopress with an unknown command or option exits 2', () => {
    expect(run('publish-everything').status).toBe(2);
    expect(run('build', '--colour', 'x').status).toBe(2);
  });

  it('limnopress build on a folder without a configuration exits 1 and names the file', () => {
    const empty = mkdtempSync(join(tmpdir(), 'limnopress-cli-'));
    const result = run('build', empty, '--out', join(empty, '..', `${basename(empty)}-out`));
    expect(result.status).toBe(1);
    expect(result.stderr).toContain('bulletin.json');
    expect(result.stderr).toContain('nothing was written');
  });
});
