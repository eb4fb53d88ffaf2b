/** `limnopress trend`: trend statistics for the series of one table. */
import { parseArgs } from 'node:util';
import { say } from '../common/problemMessages.ts';
import { InputError, ProblemList } from '../ingest/index.ts';
import { readSeriesTable } from '../ingest/seriesTable.ts';
import { parallelTrends } from '../model/parallelTrends.ts';
import { closeSharedPool, sharedPool } from '../parallel/pool.ts';
import type { TrendRow } from '../model/seriesTrends.ts';
import { csvField } from '../text/csv.ts';
import { HELP, UsageError } from './usage.ts';

/**
 * The decision first (method, p, adjusted p, rejected: the test the bulletin uses), then every
 * other test for comparison.
 */
const COLUMNS: Array<[string, keyof TrendRow]> = [
  ['series', 'series'],
  ['n', 'n'],
  ['method', 'method'],
  ['p', 'p'],
  ['p_adjusted', 'pAdjusted'],
  ['rejected', 'rejected'],
  ['ar1_lag1', 'ar1Lag1'],
  ['ar1_phi', 'ar1Phi'],
  ['ar1_factor', 'ar1Factor'],
  ['ar1_df', 'ar1DegreesOfFreedom'],
  ['ar1_z', 'ar1Z'],
  ['s', 's'],
  ['var_s', 'varianceS'],
  ['mk_z', 'mannKendallZ'],
  ['mk_p', 'mannKendallP'],
  ['z_uncorrected', 'zUncorrected'],
  ['p_uncorrected', 'pUncorrected'],
  ['tau_b', 'tau'],
  ['sen_slope_per_year', 'slopePerYear'],
  ['sen_intercept', 'intercept'],
  ['sen_lower', 'slopeLower'],
  ['sen_upper', 'slopeUpper'],
  ['hamed_rao_factor', 'autocorrelationFactor'],
  ['hamed_rao_z', 'autocorrelationZ'],
  ['hamed_rao_p', 'autocorrelationP'],
  ['pettitt_k', 'changePointK'],
  ['pettitt_p', 'changePointP'],
  ['seasonal_s', 'seasonalS'],
  ['seasonal_var_s', 'seasonalVarianceS'],
  ['seasonal_z', 'seasonalZ'],
  ['seasonal_p', 'seasonalP'],
  ['seasonal_slope_per_year', 'seasonalSlopePerYear'],
  ['seasonal_covariance_z', 'seasonalCovarianceZ'],
  ['seasonal_covariance_p', 'seasonalCovarianceP'],
  ['reason', 'reason'],
];

function probability(text: string | undefined, name: string, fallback: number): number {
  if (text === undefined) return fallback;
  const value = Number(text);
  if (!(value > 0 && value < 1)) throw new UsageError(`--${name} needs a number between 0 and 1, not "${text}"`);
  return value;
}

export async function runTrend(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      time: { type: 'string' },
      value: { type: 'string' },
      by: { type: 'string' },
      seasonal: { type: 'boolean' },
      format: { type: 'string', default: 'csv' },
      confidence: { type: 'string' },
      fdr: { type: 'string' },
      workers: { type: 'string' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    process.stdout.write(HELP.trend);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('trend needs exactly one table');
  if (!values.time || !values.value) throw new UsageError('trend needs --time and --value');
  if (values.format !== 'csv' && values.format !== 'json') throw new UsageError(`--format must be csv or json, not "${values.format}"`);
  const workers = values.workers === undefined ? undefined : Number(values.workers);
  if (workers !== undefined && !(Number.isInteger(workers) && workers >= 1))
    throw new UsageError('--workers needs a whole number of at least 1');
  const confidence = probability(values.confidence, 'confidence', 0.95);
  const falseDiscoveryRate = probability(values.fdr, 'fdr', 0.05);

  const path = positionals[0] as string;
  const problems = new ProblemList();
  const series = await readSeriesTable(
    path,
    path,
    { time: values.time, value: values.value, ...(values.by ? { by: values.by } : {}) },
    problems,
  );
  if (values.seasonal) {
    for (const entry of series) {
      if (entry.months.some((month) => Number.isNaN(month))) {
        problems.error({
          code: 'time-not-monthly',
          file: path,
          line: 0,
          column: values.time,
          value: entry.key,
          expected: 'YYYY-MM or YYYY-MM-DD times',
          message: say('time-not-monthly', { key: entry.key }),
        });
      }
    }
  }
  if (problems.errors.length > 0) throw new InputError(problems.sorted());
  // The process's one pool (none with --workers 1), closed when the rows are in.
  const pool = workers === 1 ? undefined : sharedPool(workers);
  let rows;
  try {
    rows = await parallelTrends(
      series.map((entry) => ({ key: entry.key, times: entry.times, months: entry.months, values: entry.values })),
      { seasonal: Boolean(values.seasonal), confidence, falseDiscoveryRate },
      { pool },
    );
  } finally {
    await closeSharedPool();
  }

  const labelled = rows.map((row, k) => ({
    ...row,
    changePointTime: row.changePointIndex === null ? null : (series[k]?.labels[row.changePointIndex] ?? null),
  }));
  if (values.format === 'json') {
    const clean = labelled.map((row) =>
      Object.fromEntries(
        [...COLUMNS.map(([name, key]) => [name, row[key]] as const), ['pettitt_change_time', row.changePointTime]].map(([name, value]) => [
          name,
          typeof value === 'number' && !Number.isFinite(value) ? null : value,
        ]),
      ),
    );
    process.stdout.write(`${JSON.stringify(clean, null, 2)}\n`);
  } else {
    const header = [...COLUMNS.map(([name]) => name), 'pettitt_change_time'];
    const lines = [
      header.join(','),
      ...labelled.map((row) =>
        [...COLUMNS.map(([, key]) => csvField(row[key] as string | number | boolean | null)), csvField(row.changePointTime)].join(','),
      ),
    ];
    process.stdout.write(`${lines.join('\n')}\n`);
  }
  return 0;
}
