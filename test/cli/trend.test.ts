import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
const run = (...args: string[]) => spawnSync(process.execPath, [cli, 'trend', ...args], { encoding: 'utf8' });
const table = (text: string) => {
  const path = join(mkdtempSync(join(tmpdir(), 'limnopress-trend-')), 'series.csv');
  writeFileSync(path, text);
  return path;
};

// Little, "A Mann-Kendall Example (By Hand)", College of the Holy Cross: S = 54, Z = 2.9058.
const LITTLE = [12.9, 14.8, 13.2, 15.7, 13.8, 15.6, 12.9, 11.0, 17.3, 15.9, 19.0, 18.3, 20.1, 21.7];

describe('limnopress trend', () => {
  it('limnopress trend --by prints one row per series with BH-adjusted p', () => {
    const rows = [
      'site,year,value',
      ...LITTLE.map((value, k) => `up,${2000 + k},${value}`),
      ...LITTLE.map((value, k) => `down,${2000 + k},${-value}`),
      ...LITTLE.map((value, k) => `gappy,${2000 + k},${k % 4 === 1 ? '' : value}`),
    ];
    const result = run(table(rows.join('\n')), '--time', 'year', '--value', 'value', '--by', 'site', '--format', 'json');
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const out = JSON.parse(result.stdout) as Array<Record<string, number | string | boolean | null>>;
    expect(out.map((row) => row.series)).toEqual(['down', 'gappy', 'up']);
    const up = out[2]!;
    expect(up.s).toBe(54);
    expect(up.mk_z as number).toBeCloseTo(2.9058, 4);
    // The decision is the AR(1)-corrected test (checked against numpy lines in test/stats/reference.test.ts).
    expect(up.method).toBe('mann-kendall-ar1');
    expect(up.p as number).toBeGreaterThanOrEqual(up.mk_p as number);
    // scipy 1.17.1 scipy.stats.theilslopes(LITTLE, 2000..2013): slope 0.566666666666667 (value per year).
    expect(up.sen_slope_per_year as number).toBeCloseTo(0.566666666666667, 12);
    expect(out[0]!.s).toBe(-54);
    // Three series: the adjusted p can only be at least the raw p.
    for (const row of out) expect(row.p_adjusted as number).toBeGreaterThanOrEqual(row.p as number);
    expect(out[1]!.n).toBe(10);
    // null is the only "no value" in the JSON: no empty strings, no -1 sentinels.
    for (const row of out) for (const value of Object.values(row)) expect(value).not.toBe('');
    expect(out.map((row) => row.reason)).toEqual([null, null, null]);
  });

  it('limnopress trend reports a non-numeric value with file, line and column, and exits 1', () => {
    const path = table('month,chl\n2020-01,3.5\n2020-02,high\n2020-03,4\n');
    const result = run(path, '--time', 'month', '--value', 'chl');
    expect(result.status).toBe(1);
    // Grouped under the file, as check prints them.
    expect(result.stderr).toContain(`${path}\n  error line 3 [chl]: the value is not a number (found "high"`);
    expect(result.stdout).toBe('');
  });

  it('limnopress trend reports a missing column and a missing file, and exits 1', () => {
    const missingColumn = run(table('month,chl\n2020-01,3\n'), '--time', 'month', '--value', 'turbidity');
    expect(missingColumn.status).toBe(1);
    expect(missingColumn.stderr).toContain('  error line 1 [turbidity]: a required column is missing');
    const missingFile = run(join(tmpdir(), 'no-such-limnopress-table.csv'), '--time', 'month', '--value', 'chl');
    expect(missingFile.status).toBe(1);
    expect(missingFile.stderr).toMatch(/no-such-limnopress-table.csv\n  error file: the file does not exist/);
  });

  it('limnopress trend without --time exits 2 and --seasonal refuses yearly times', () => {
    expect(run(table('a,b\n1,2\n'), '--value', 'b').status).toBe(2);
    const yearly = run(table('year,v\n2000,1\n2001,2\n2002,3\n'), '--time', 'year', '--value', 'v', '--seasonal');
    expect(yearly.status).toBe(1);
    expect(yearly.stderr).toContain('--seasonal needs monthly times');
  });
});
