/**
 * A large inventory's trend tests run on the worker pool; the model must be the same, byte for
 * byte, as when everything runs in one thread.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { prepareModel } from '../../src/model/index.ts';
import { buildModel } from '../../src/wording/index.ts';
import { closeSharedPool, WorkerPool } from '../../src/parallel/pool.ts';
import { generateNational } from '../../scripts/bench/national.ts';

const pool = new WorkerPool(2);
afterAll(async () => {
  await pool.close();
  await closeSharedPool();
});

describe('the model on the worker pool', () => {
  it('buildModel with prepareModel on two threads gives the same JSON as in one thread (4,500 bodies, above the threshold for threads)', async () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'limnopress-pool-')), 'national');
    generateNational(folder, { bodies: 4500, months: 72 });
    const { inputs, problems } = await loadBulletin(folder);
    expect(problems.errors).toEqual([]);
    if (!inputs) throw new Error('no inputs');
    const alone = JSON.stringify(buildModel(inputs, [], 'test'));
    let series = 0;
    const prepared = await prepareModel(inputs, pool, (done) => (series += done));
    expect(series).toBe(3 * 4500); // bodies, and bodies × two quality parameters
    expect(JSON.stringify(buildModel(inputs, [], 'test', { prepared }))).toBe(alone);
  });
});
