/**
 * Storage from survey curves: the curve table's checks (file, line, column), the reader's round
 * trips, and the model's storage figures on the mini bulletin (body B of 200 ha given a curve).
 * Values by hand beside each check.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel } from '../../src/wording/index.ts';
import { StorageReader } from '../../src/model/storage.ts';
import { storageTable } from '../../src/render/views.ts';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';

/** B's curve: a paraboloid-like basin, area 25·h ha and volume 0.125·h² hm³ at depth h (0.01 × 25 h²/2), 0–10 m. */
const CURVE_B = ['body_id,elevation_m,area_ha,volume_hm3', ...[0, 2, 4, 6, 8, 10].map((h) => `B,${100 + h},${25 * h},${0.125 * h * h}`)];

async function withCurves(lines: string[], settings: Record<string, unknown> = {}) {
  const config = { ...MINI_CONFIG, ...settings, inputs: { ...MINI_CONFIG.inputs, storageCurves: 'curves.csv' } };
  const folder = writeMini({ 'bulletin.json': JSON.stringify(config) });
  writeFileSync(join(folder, 'curves.csv'), `${lines.join('\n')}\n`);
  return loadBulletin(folder);
}

describe('the storage curve table', () => {
  it('reports each broken curve at its line and column, and refuses the build', async () => {
    const { inputs, problems } = await withCurves([
      'body_id,elevation_m,area_ha,volume_hm3',
      'B,100,0,0',
      'B,102,50,0.5',
      'B,102,60,0.9', // line 4: the same elevation as line 3
      'A,10,5,1',
      'A,11,4,2', // line 6: the area falls
      'Z,1,1,1', // line 7: not in the inventory
    ]);
    expect(inputs).toBeNull();
    const found = problems.errors.map((problem) => `${problem.code} ${problem.file}:${problem.line} ${problem.column}`).sort();
    expect(found).toEqual([
      'curve-duplicate-elevation curves.csv:4 elevation_m',
      'curve-falls curves.csv:6 area_ha',
      'unknown-body curves.csv:7 body_id',
    ]);
  });

  it('needs two rows per body and refuses a falling volume', async () => {
    const { problems } = await withCurves(['body_id,elevation_m,area_ha,volume_hm3', 'A,10,5,1', 'B,100,0,3', 'B,101,10,2']);
    const found = problems.errors.map((problem) => `${problem.code} ${problem.line} ${problem.column}`).sort();
    expect(found).toEqual(['curve-falls 4 volume_hm3', 'curve-too-short 2 body_id']);
  });

  it("warns once per body when observed areas lie outside its curve, naming the curve's line and range", async () => {
    // B's areas run from 180 to 209 ha; a curve topping out at 200 ha leaves the months above it out.
    const { inputs, problems } = await withCurves(['body_id,elevation_m,area_ha,volume_hm3', 'B,100,0,0', 'B,110,200,10']);
    expect(inputs).not.toBeNull();
    const warning = problems.warnings.find((problem) => problem.code === 'area-outside-curve');
    // Areas 180 + k for k = 0 … 29: those above 200 are k = 21 … 29, nine months.
    expect(warning).toMatchObject({ file: 'curves.csv', line: 2, column: 'area_ha', value: 'B', params: { count: 9, low: 0, high: 200 } });
  });
});

describe('StorageReader', () => {
  it('reads level and volume from an area, and the way back, within 1e-9 inside the curve', () => {
    const reader = new StorageReader({
      elevationM: Float64Array.from([100, 102, 104, 106, 108, 110]),
      areaHa: Float64Array.from([0, 50, 100, 150, 200, 250]),
      volumeHm3: Float64Array.from([0, 0.5, 2, 4.5, 8, 12.5]),
    });
    // Area linear in depth (25 ha per m): 125 ha is 5 m deep, level 105 m.
    const read = reader.read(125);
    expect(read.levelM).toBeCloseTo(105, 9);
    expect(reader.areaAt(read.levelM)).toBeCloseTo(125, 9);
    expect(read.clamped).toBe(false);
    // Outside the curve: taken at its end, and said so.
    expect(reader.read(300)).toMatchObject({ levelM: 110, volumeHm3: 12.5, clamped: true });
    expect(reader.capacityHm3).toBe(12.5);
  });
});

describe('storage in the bulletin', () => {
  it('gives the body its level and volume, and the region its storage only when curves cover enough of its area', async () => {
    const { inputs, problems } = await withCurves(CURVE_B);
    if (!inputs) throw new Error(JSON.stringify(problems.errors));
    const model = buildModel(inputs, problems.warnings, 'test');
    const storage = model.storage;
    if (!storage) throw new Error('no storage figures');
    // June 2020 is month k = 29 of the mini bulletin: B's area 180 + 29 = 209 ha, 8.36 m deep (209 / 25).
    const body = storage.bodies[0];
    expect(body?.id).toBe('B');
    expect(body?.levelM).toBeCloseTo(108.36, 1);
    // PCHIP of 0.125 h² through the knots: close to 0.125 × 8.36² = 8.74 hm³ (to the Hermite bound, well within 0.05).
    expect(Math.abs((body?.volumeHm3 as number) - 0.125 * 8.36 ** 2)).toBeLessThan(0.05);
    expect(body?.capacityHm3).toBe(12.5);
    // B is 200 of the region's 210 ha: curves cover 95.2 %, above the default half.
    expect(storage.region.curveShare).toBeCloseTo(200 / 210, 11);
    expect(storage.region.status?.kind).toBe('stated');
    expect(storage.region.volumeHm3).toBeCloseTo(body?.volumeHm3 as number, 9);
    // With a minimum share above 95.2 %, nothing is stated for the region, and the table says why.
    const strict = await withCurves(CURVE_B, { storage: { minCurveShare: 0.99 } });
    if (!strict.inputs) throw new Error('does not load');
    const strictModel = buildModel(strict.inputs, strict.problems.warnings, 'test');
    expect(strictModel.storage?.region.status).toBeNull();
    expect(strictModel.storage?.region.volumeHm3).toBeNull();
    expect(storageTable(strictModel)?.rows[0]).toContain('curves cover too little of the area');
    expect(strictModel.keyMessages.some((message) => message.id === 'storage')).toBe(false);
    expect(model.keyMessages.some((message) => message.id === 'storage')).toBe(true);
  });

  it('has no storage figures, table or caveat without curves', async () => {
    const { inputs, problems } = await loadBulletin(writeMini());
    if (!inputs) throw new Error('does not load');
    const model = buildModel(inputs, problems.warnings, 'test');
    expect(model.storage).toBeNull();
    expect(storageTable(model)).toBeNull();
    expect(model.notices.some((notice) => notice.text.includes('survey curve'))).toBe(false);
  });
});

describe('fitted power laws', () => {
  async function withFits(lines: string[], curves: string[] | null = null) {
    const inputs: Record<string, string> = { ...MINI_CONFIG.inputs, storageFits: 'fits.csv' };
    if (curves) inputs.storageCurves = 'curves.csv';
    const folder = writeMini({ 'bulletin.json': JSON.stringify({ ...MINI_CONFIG, inputs }) });
    writeFileSync(join(folder, 'fits.csv'), `${lines.join('\n')}\n`);
    if (curves) writeFileSync(join(folder, 'curves.csv'), `${curves.join('\n')}\n`);
    return loadBulletin(folder);
  }

  it('gives a volume from V = a·A^b and no level', async () => {
    const { inputs, problems } = await withFits(['body_id,coefficient,exponent,min_area_ha,max_area_ha', 'B,0.0002,2,0,250']);
    if (!inputs) throw new Error(JSON.stringify(problems.errors));
    const model = buildModel(inputs, problems.warnings, 'test');
    const body = model.storage?.bodies[0];
    // June 2020: 209 ha. 0.0002 × 209² = 8.7362 hm³; capacity 0.0002 × 250² = 12.5 hm³.
    expect(body?.source).toBe('fit');
    expect(body?.levelM).toBeNull();
    expect(body?.volumeHm3).toBeCloseTo(0.0002 * 209 ** 2, 9);
    expect(body?.capacityHm3).toBeCloseTo(12.5, 9);
    expect(body?.percentOfCapacity).toBeCloseTo((100 * 8.7362) / 12.5, 9);
  });

  it('refuses a fit for a body that has a curve, a second fit and an empty area range, at their lines', async () => {
    const { problems } = await withFits(
      ['body_id,coefficient,exponent,min_area_ha,max_area_ha', 'B,0.0002,2,0,250', 'A,1,1,5,5', 'A,1,1,0,5', 'A,1,1,0,6'],
      CURVE_B,
    );
    const found = problems.errors.map((problem) => `${problem.code} ${problem.file}:${problem.line} ${problem.column}`).sort();
    expect(found).toEqual([
      'duplicate-row fits.csv:2 body_id',
      'duplicate-row fits.csv:5 body_id',
      'value-out-of-range fits.csv:3 max_area_ha',
    ]);
  });
});
