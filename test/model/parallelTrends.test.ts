import { afterAll, describe, expect, it } from 'vitest';
import { WorkerPool } from '../../src/parallel/pool.ts';
import { parallelTrends } from '../../src/model/parallelTrends.ts';
import { trendTable, type TrendSeries } from '../../src/model/seriesTrends.ts';

/** Deterministic series with a small trend, a season, ties and gaps (no randomness needed). */
function series(count: number, years: number): TrendSeries[] {
  return Array.from({ length: count }, (_, index) => {
    const months = Float64Array.from({ length: years * 12 }, (_, k) => 2015 * 12 + k);
    const values = Float64Array.from(months, (month, k) =>
      (k * 7 + index * 13) % 11 === 0
        ? Number.NaN
        : Math.round(10 * (Math.sin(month + index) + 0.01 * ((index % 5) - 2) * k + Math.cos((2 * Math.PI * month) / 12))) / 10,
    );
    return { key: `s${index}`, times: Float64Array.from(months, (month) => month / 12), months, values };
  });
}

const pool = new WorkerPool(2);
afterAll(() => pool.close());

describe('parallelTrends', () => {
  it('parallelTrends(series, a pool of 2) gives exactly the rows of trendTable in input order', async () => {
    const input = series(40, 6);
    const sequential = trendTable(input, { seasonal: true });
    let done = 0;
    const parallel = await parallelTrends(input, { seasonal: true }, { pool, batchSize: 7, onProgress: (count) => (done = count) });
    expect(done).toBe(40); // the batches really went through the pool's progress path
    expect(parallel).toEqual(sequential);
    expect(parallel.map((row) => row.series)).toEqual(input.map((entry) => entry.key));
  });
});
