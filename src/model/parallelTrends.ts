/**
 * Trend statistics for many series on worker threads: the series are cut into batches, each thread
 * takes the next batch when it finishes one (through the caller's WorkerPool, so threads started
 * once serve every call; this module never starts a pool of its own), and the rows come back in
 * input order, so the result is identical to trendTable's whatever the number of threads.
 */
import { defineTask, type WorkerPool } from '../parallel/pool.ts';
import { adjustAcrossSeries, trendRow, type TrendOptions, type TrendRow, type TrendSeries } from './seriesTrends.ts';

/** The trend rows of a batch of series, on a worker thread. */
export function trendRows(input: { series: TrendSeries[]; options: TrendOptions }): Row[] {
  return input.series.map((entry) => trendRow(entry, input.options));
}

const TREND_ROWS = defineTask<Parameters<typeof trendRows>[0], Row[]>(import.meta.url, 'trendRows');

export interface ParallelOptions {
  /** The pool to run on (closed by its owner); without one, or with one thread, the rows are computed in this thread. */
  pool?: WorkerPool;
  /** Series per batch; default 256. */
  batchSize?: number;
  /** Called after each batch with the number of series done. */
  onProgress?: (done: number, total: number) => void;
}

type Row = Omit<TrendRow, 'pAdjusted' | 'rejected'>;

export async function parallelTrends(series: TrendSeries[], options: TrendOptions, parallel: ParallelOptions = {}): Promise<TrendRow[]> {
  const batchSize = parallel.batchSize ?? 256;
  const pool = parallel.pool;
  if (!pool || pool.size <= 1 || series.length <= batchSize) {
    const rows: Row[] = [];
    for (let start = 0; start < series.length; start += batchSize) {
      for (const entry of series.slice(start, start + batchSize)) rows.push(trendRow(entry, options));
      parallel.onProgress?.(rows.length, series.length);
    }
    return adjustAcrossSeries(rows, options.falseDiscoveryRate);
  }
  let done = 0;
  const batches: Array<Promise<Row[]>> = [];
  for (let start = 0; start < series.length; start += batchSize) {
    const batch = series.slice(start, start + batchSize);
    batches.push(
      pool.run(TREND_ROWS, { series: batch, options }).then((rows) => {
        done += rows.length;
        parallel.onProgress?.(done, series.length);
        return rows;
      }),
    );
  }
  return adjustAcrossSeries((await Promise.all(batches)).flat(), options.falseDiscoveryRate);
}
