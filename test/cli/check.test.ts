import { say } from '../../src/common/problemMessages.ts';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXAMPLE } from '../support/exampleSite.ts';
import { miniFiles, writeMini } from '../support/miniBulletin.ts';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
const run = (...args: string[]) => spawnSync(process.execPath, [cli, 'check', ...args], { encoding: 'utf8' });

describe('limnopress check', () => {
  it('limnopress check example-bulletin reads its archived issues too, as build does, and exits 0 (warnings only)', () => {
    const result = run(EXAMPLE);
    expect(result.stdout).toMatch(/^archive\/2026-10-r1\/data\/surface-area.csv$/m);
    expect(result.stdout).toMatch(/^0 errors, \d+ warnings? in \d+ files?\.$/m);
    expect(result.status).toBe(0);
  });

  it('limnopress check groups problems by file in line order, counts them, and exits 1', () => {
    const base = miniFiles();
    const area = base['area.csv']
      .replace('A,2018-02,9.0,0.95,3', 'A,2018-02,9.0,1.95,3')
      .replace('B,2018-01,180.0,0.9,2', 'B,2018-01,many,0.9,2');
    const folder = writeMini({ 'area.csv': area, 'rain.csv': base['rain.csv'].replace('rainfall_mm', 'rain_mm') });
    const result = run(folder);
    expect(result.status).toBe(1);
    expect(result.stdout).toBe(
      [
        'area.csv',
        '  error line 3 [water_area_ha]: the value is not a number (found "many"; expected a finite decimal number)',
        '  error line 4 [observed_share]: the value is out of range (found "1.95"; expected from 0 to 1)',
        'rain.csv',
        '  error line 1 [rainfall_mm]: a required column is missing (expected a column named rainfall_mm)',
        '  warning line 1 [rain_mm]: an unknown column is ignored (found "rain_mm"; expected subregion_id, month, rainfall_mm)',
        '3 errors, 1 warning in 2 files.',
        '',
      ].join('\n'),
    );
  });

  it('limnopress check with warnings only exits 0, and without a folder exits 2', () => {
    const warned = run(writeMini({ 'area.csv': miniFiles()['area.csv'].replace('A,2018-01,8.0', 'A,2018-01,16') }));
    expect(warned.status).toBe(0);
    expect(warned.stdout).toContain('0 errors, 1 warning in 1 file.');
    expect(run().status).toBe(2);
  });
});

describe('formatReport folds floods', () => {
  it('shows the first three of a kind in full and folds the rest into one line with their count and first lines', async () => {
    const { formatReport } = await import('../../src/cli/check.ts');
    const problem = (line: number, code: 'unknown-body' | 'value-empty' = 'unknown-body') => ({
      severity: 'error' as const,
      code,
      file: 'data/area.csv',
      line,
      column: 'body_id',
      value: 'X',
      expected: 'an id from the water-body inventory',
      message: say('unknown-body'),
    });
    const problems = [...Array.from({ length: 40 }, (_, k) => problem(k + 2)), problem(50, 'value-empty')];
    const report = formatReport(problems, { errors: 41, warnings: 0 });
    const lines = report.trimEnd().split('\n');
    expect(lines[0]).toBe('data/area.csv');
    expect(lines.filter((line) => line.includes('not in the inventory'))).toHaveLength(4); // three in full and the different code's one
    expect(lines).toContain('  … and 37 more like this (lines 5, 6, 7, 8, 9, …)');
    expect(lines[lines.length - 1]).toBe('41 errors, 0 warnings in 1 file.');
  });
});
