/**
 * Trend statistics for many series on worker threads: the series are cut into batches, each worker
 * takes the next batch when it finishes one, and the rows come back in input order, so the result
 * is identical to trendTable's whatever the number of workers.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { adjustAcrossSeries, trendRow, type TrendOptions, type TrendRow, type TrendSeries } from './seriesTrends.ts';

export interface ParallelOptions {
  /** Worker threads; default: the machine's available parallelism. 1 or fewer runs in this thread. */
  workers?: number;
  /** Series per batch; default 256. */
  batchSize?: number;
  /** Called after each batch with the number of series done. */
  onProgress?: (done: number, total: number) => void;
}

type Row = Omit<TrendRow, 'pAdjusted' | 'rejected'>;

export async function parallelTrends(series: TrendSeries[], options: TrendOptions, parallel: ParallelOptions = {}): Promise<TrendRow[]> {
  const workerCount = Math.min(parallel.workers ?? availableParallelism(), Math.ceil(series.length / (parallel.batchSize ?? 256)));
  const batchSize = parallel.batchSize ?? 256;
  if (workerCount <= 1) {
    const rows: Row[] = [];
    for (let start = 0; start < series.length; start += batchSize) {
      for (const entry of series.slice(start, start + batchSize)) rows.push(trendRow(entry, options));
      parallel.onProgress?.(rows.length, series.length);
    }
    return adjustAcrossSeries(rows, options.falseDiscoveryRate);
  }
  const batches: TrendSeries[][] = [];
  for (let start = 0; start < series.length; start += batchSize) batches.push(series.slice(start, start + batchSize));
  const results: Row[][] = new Array(batches.length);
  let next = 0;
  let done = 0;
  const workers = Array.from({ length: workerCount }, () => new Worker(new URL('./trendWorkerEntry.js', import.meta.url)));
  try {
    await Promise.all(
      workers.map(
        (worker) =>
          new Promise<void>((resolve, reject) => {
            const send = () => {
              if (next >= batches.length) {
                resolve();
                return;
              }
              const id = next++;
              worker.postMessage({ id, series: batches[id], options });
            };
            worker.on('message', (message: { id: number; rows?: Row[]; error?: string }) => {
              if (message.error !== undefined || !message.rows) {
                reject(new Error(message.error ?? 'a trend worker sent no rows'));
                return;
              }
              results[message.id] = message.rows;
              done += message.rows.length;
              parallel.onProgress?.(done, series.length);
              send();
            });
            worker.on('error', reject);
            send();
          }),
      ),
    );
  } finally {
    await Promise.all(workers.map((worker) => worker.terminate()));
  }
  return adjustAcrossSeries(results.flat(), options.falseDiscoveryRate);
}
