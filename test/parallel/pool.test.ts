/** The pool is generic: any module's exported function runs on its threads by module URL and name. */
import { afterAll, describe, expect, it } from 'vitest';
import { WorkerPool } from '../../src/parallel/pool.ts';
import { DOUBLED, FAILS, MISSING } from './fixtureTasks.ts';

const pool = new WorkerPool(2);
afterAll(() => pool.close());

describe('the worker pool', () => {
  it('runs a task declared by a module outside src/, moving its typed arrays both ways', async () => {
    const values = Float64Array.from([1, 2, 3.5]);
    const output = await pool.run(DOUBLED, { values }, [values.buffer]);
    expect(Array.from(output.values)).toEqual([2, 4, 7]);
    expect(values.length).toBe(0); // moved to the thread, not copied
  });

  it('keeps order when more tasks than threads are queued', async () => {
    const outputs = await Promise.all(Array.from({ length: 9 }, (_, k) => pool.run(DOUBLED, { values: Float64Array.of(k) })));
    expect(outputs.map((output) => output.values[0])).toEqual(Array.from({ length: 9 }, (_, k) => 2 * k));
  });

  it('rejects with the thread error, and names a missing export', async () => {
    await expect(pool.run(FAILS, { message: 'on purpose' })).rejects.toThrow(/RangeError: on purpose/);
    await expect(pool.run(MISSING, { message: '' })).rejects.toThrow(/no task noSuchExport/);
    // The pool still serves after failures.
    expect((await pool.run(DOUBLED, { values: Float64Array.of(5) })).values[0]).toBe(10);
  });
});
