/** Worker-thread side of parallelTrends: computes trend rows for the batches it is sent. */
import { parentPort } from 'node:worker_threads';
import { trendRow, type TrendOptions, type TrendSeries } from './seriesTrends.ts';

parentPort?.on('message', (message: { id: number; series: TrendSeries[]; options: TrendOptions }) => {
  try {
    parentPort?.postMessage({ id: message.id, rows: message.series.map((entry) => trendRow(entry, message.options)) });
  } catch (error) {
    parentPort?.postMessage({ id: message.id, error: error instanceof Error ? error.message : String(error) });
  }
});
