import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
const run = (...args: string[]) => spawnSync(process.execPath, [cli, 'storage', ...args], { encoding: 'utf8' });
const file = (name: string, text: string) => {
  const path = join(mkdtempSync(join(tmpdir(), 'limnopress-storage-')), name);
  writeFileSync(path, text);
  return path;
};

/** A basin whose area grows by 25 ha per metre (a paraboloid): area 25 h, volume 0.125 h² hm³ at depth h. */
const CURVES = [
  'body_id,elevation_m,area_ha,volume_hm3',
  ...[0, 2, 4, 6, 8, 10].map((h) => `R1,${100 + h},${25 * h},${0.125 * h * h}`),
].join('\n');

describe('limnopress storage', () => {
  it('turns each area into a level and a volume, leaves an empty area empty, and marks an area beyond the curve', () => {
    const areas = file('areas.csv', 'body_id,month,water_area_ha\nR1,2026-10,125\nR1,2026-11,\nR1,2026-12,400\n');
    const result = run(file('curves.csv', CURVES), '--area', areas, '--format', 'json');
    expect(result.status).toBe(0);
    const rows = JSON.parse(result.stdout) as Array<Record<string, number | string | boolean | null>>;
    // 125 ha is 5 m deep (area linear in depth, so exact): level 105 m.
    expect(rows[0]?.level_m as number).toBeCloseTo(105, 9);
    expect(rows[1]).toMatchObject({ month: '2026-11', water_area_ha: null, level_m: null, volume_hm3: null, clamped: false });
    // 400 ha is above the curve's 250: taken at its top (capacity 12.5 hm³), never extrapolated.
    expect(rows[2]).toMatchObject({ level_m: 110, volume_hm3: 12.5, percent_of_capacity: 100, clamped: true });
    expect(result.stderr).toContain('1 area(s) outside their curve');
  });

  it('prints CSV by default and reads straight lines with --interpolation linear', () => {
    const areas = file('areas.csv', 'body_id,month,water_area_ha\nR1,2026-10,75\n');
    const result = run(file('curves.csv', CURVES), '--area', areas, '--interpolation', 'linear');
    expect(result.status).toBe(0);
    const [header, row] = result.stdout.trim().split('\n');
    expect(header).toBe('body_id,month,water_area_ha,level_m,volume_hm3,percent_of_capacity,clamped');
    // 75 ha: 3 m deep, level 103 m; linear volume between 0.5 (2 m) and 2 (4 m): 1.25 hm³ (the paraboloid holds 1.125).
    const cells = (row as string).split(',');
    expect(Number(cells[3])).toBeCloseTo(103, 9);
    expect(Number(cells[4])).toBeCloseTo(1.25, 9);
  });

  it('exits 1 with file, line and column on a bad curve or an unknown body, and prints no rows', () => {
    const bad = file('curves.csv', 'body_id,elevation_m,area_ha,volume_hm3\nR1,100,0,0\nR1,101,10,5\nR1,102,20,4\n');
    const areas = file('areas.csv', 'body_id,month,water_area_ha\nR1,2026-10,5\nR9,2026-10,5\n');
    const result = run(bad, '--area', areas);
    expect(result.status).toBe(1);
    expect(result.stdout).toBe('');
    expect(result.stderr).toContain('error line 4 [volume_hm3]: the volume falls as the elevation rises for R1');
    // R9 has no curve, and R1's curve was refused: both area rows are named.
    expect(result.stderr).toContain('error line 3 [body_id]: the water body has no curve');
    expect(result.stderr).toContain('error line 2 [body_id]: the water body has no curve');
  });

  it('explains itself with --help and refuses a call without --area', () => {
    expect(run('--help').stdout).toContain('Usage: limnopress storage');
    const result = run(file('curves.csv', CURVES));
    expect(result.status).toBe(2);
    expect(result.stderr).toContain('--area');
  });
});
