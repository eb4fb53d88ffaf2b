/**
 * The tasks a worker thread can run, by name: the one table the pool and the workers share, so a
 * task's input and output types are checked on both sides.
 */
import { trendRow, type TrendOptions, type TrendSeries } from '../model/seriesTrends.ts';
import { encodedTestBatch } from '../model/trends.ts';
import { scanRange, type ScanInventory, type ScanResult, type ScanTask } from '../ingest/plainScan.ts';

export const TASKS = {
  /** One byte range of a large table (see ingest/plainScan.ts). */
  scan: (input: { task: ScanTask; inventory: ScanInventory }): ScanResult => scanRange(input.task, input.inventory),
  /** The trend tests of a batch of water bodies (see model/trends.ts). */
  trendTests: encodedTestBatch,
  /** The trend rows of a batch of series (the trend command, see model/parallelTrends.ts). */
  trendRows: (input: { series: TrendSeries[]; options: TrendOptions }) => input.series.map((entry) => trendRow(entry, input.options)),
};

export type TaskName = keyof typeof TASKS;
export type TaskInput<N extends TaskName> = Parameters<(typeof TASKS)[N]>[0];
export type TaskOutput<N extends TaskName> = ReturnType<(typeof TASKS)[N]>;
