/**
 * Trend statistics for many series on worker threads: the series are cut into batches, each thread
 * takes the next batch when it finishes one (through a WorkerPool, so threads started once serve
 * every call), and the rows come back in input order, so the result is identical to trendTable's
 * whatever the number of threads.
 */
import { WorkerPool, defaultWorkers } from '../parallel/pool.ts';
import { adjustAcrossSeries, trendRow, type TrendOptions, type TrendRow, type TrendSeries } from './seriesTrends.ts';

export interface ParallelOptions {
  /** Worker threads when no pool is given; default: the machine's cores. 1 or fewer runs in this thread. */
  workers?: number;
  /** Threads already started (their start-up then is not paid again); closed by its owner. */
  pool?: WorkerPool;
  /** Series per batch; default 256. */
  batchSize?: number;
  /** Called after each batch with the number of series done. */
  onProgress?: (done: number, total: number) => void;
}

type Row = Omit<TrendRow, 'pAdjusted' | 'rejected'>;

export async function parallelTrends(series: TrendSeries[], options: TrendOptions, parallel: ParallelOptions = {}): Promise<TrendRow[]> {
  const batchSize = parallel.batchSize ?? 256;
  const threads = parallel.pool?.size ?? Math.min(parallel.workers ?? defaultWorkers(), Math.ceil(series.length / batchSize));
  if (threads <= 1) {
    const rows: Row[] = [];
    for (let start = 0; start < series.length; start += batchSize) {
      for (const entry of series.slice(start, start + batchSize)) rows.push(trendRow(entry, options));
      parallel.onProgress?.(rows.length, series.length);
    }
    return adjustAcrossSeries(rows, options.falseDiscoveryRate);
  }
  const pool = parallel.pool ?? new WorkerPool(threads);
  let done = 0;
  try {
    const batches: Array<Promise<Row[]>> = [];
    for (let start = 0; start < series.length; start += batchSize) {
      const batch = series.slice(start, start + batchSize);
      batches.push(
        pool.run('trendRows', { series: batch, options }).then((rows) => {
          done += rows.length;
          parallel.onProgress?.(done, series.length);
          return rows;
        }),
      );
    }
    return adjustAcrossSeries((await Promise.all(batches)).flat(), options.falseDiscoveryRate);
  } finally {
    if (!parallel.pool) await pool.close();
  }
}
