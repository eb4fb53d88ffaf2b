/**
 * `npm run bench:stats`: speed of the statistics core, measured, never asserted.
 *
 * For n = 48, 120 and 240 monthly values it builds identical seeded series (rounded to one
 * decimal, so with ties, and 5 % missing), runs the full set per series (Mann-Kendall with ties
 * and the continuity correction, Sen's slope with its confidence interval, the seasonal Kendall
 * test with its seasonal slope) on one core, then on worker threads, and in the same run on the
 * same data (a) a per-series loop with scipy kendalltau + theilslopes and (b) a vectorized numpy
 * implementation, checking that all results agree. Prints series per second (the best of three
 * passes on each side) and the ratios.
 *
 * Targets at n = 120 on one core: ≥ 50× the scipy loop, ≥ 2× the vectorized numpy.
 * Usage: npm run bench:stats [-- --series 2000]
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { parallelTrends } from '../../src/model/parallelTrends.ts';
import { WorkerPool } from '../../src/parallel/pool.ts';
import { mannKendall, seasonalKendall, sensSlope } from '../../src/stats/index.ts';
import { mulberry32 } from '../random.ts';

const seriesArg = process.argv.indexOf('--series');
const SERIES = seriesArg > 0 ? Number(process.argv[seriesArg + 1]) : 2000;
const LOOP_SERIES = 300;
const REPEATS = 3;
const LENGTHS = [48, 120, 240];

function makeCase(n: number) {
  const random = mulberry32(1000 + n);
  const months = Float64Array.from({ length: n }, (_, k) => 2010 * 12 + k);
  const times = Float64Array.from(months, (month) => month / 12);
  const values = Array.from({ length: SERIES }, () => {
    const trend = (random() - 0.5) * 0.04;
    return Float64Array.from(months, (month, k) =>
      random() < 0.05
        ? Number.NaN
        : Math.round(10 * (trend * k + Math.cos((2 * Math.PI * (month % 12)) / 12) + (random() + random() + random() - 1.5))) / 10,
    );
  });
  return { n, months, times, values };
}

function fullSet(months: Float64Array, times: Float64Array, values: Float64Array) {
  const mk = mannKendall(values);
  const sen = sensSlope(times, values);
  const seasonal = seasonalKendall(months, values);
  return { mk, sen, seasonal };
}

const nullable = (value: number) => (Number.isFinite(value) ? value : null);
const python = spawnSync('python3', ['-c', 'import scipy, numpy'], { encoding: 'utf8' });
const havePython = python.status === 0;
const work = mkdtempSync(join(tmpdir(), 'limnopress-bench-'));
const cases = LENGTHS.map(makeCase);
const results: Record<string, Record<string, Array<number | null>>> = {};
const lines: string[] = [];
const singleRates = new Map<number, number>();

process.stdout.write(`bench:stats: ${SERIES} series per length, ${availableParallelism()} cores, Node ${process.version}\n`);
for (const c of cases) {
  // Warm-up so the JIT has compiled the hot loops before timing.
  for (let k = 0; k < 200; k++) fullSet(c.months, c.times, c.values[k % SERIES] as Float64Array);
  const out = {
    s: [],
    varianceS: [],
    z: [],
    p: [],
    pUncorrected: [],
    tau: [],
    slope: [],
    lower: [],
    upper: [],
    seasonalS: [],
    seasonalVarianceS: [],
    seasonalZ: [],
    seasonalP: [],
    seasonalSlope: [],
  } as Record<string, Array<number | null>>;
  // Best of REPEATS passes over the same series (the Python side does the same): the machine's
  // other work only ever adds time, so the fastest pass is the fairest figure for both.
  let seconds = Infinity;
  let computed: Array<ReturnType<typeof fullSet>> = [];
  for (let repeat = 0; repeat < REPEATS; repeat++) {
    const start = process.hrtime.bigint();
    computed = c.values.map((values) => fullSet(c.months, c.times, values));
    seconds = Math.min(seconds, Number(process.hrtime.bigint() - start) / 1e9);
  }
  for (const { mk, sen, seasonal } of computed) {
    out.s!.push(mk.s);
    out.varianceS!.push(mk.varianceS);
    out.z!.push(nullable(mk.z));
    out.p!.push(nullable(mk.p));
    out.pUncorrected!.push(nullable(mk.pUncorrected));
    out.tau!.push(nullable(mk.tau));
    out.slope!.push(nullable(sen.slope));
    out.lower!.push(nullable(sen.lower));
    out.upper!.push(nullable(sen.upper));
    out.seasonalS!.push(seasonal.s);
    out.seasonalVarianceS!.push(seasonal.varianceS);
    out.seasonalZ!.push(nullable(seasonal.z));
    out.seasonalP!.push(nullable(seasonal.p));
    out.seasonalSlope!.push(nullable(seasonal.slope));
  }
  results[String(c.n)] = out;
  const rate = SERIES / seconds;
  singleRates.set(c.n, rate);
  lines.push(
    `n=${String(c.n).padStart(3)}  TypeScript, one core: ${rate.toFixed(0).padStart(8)} series/s  (${((seconds / SERIES) * 1e6).toFixed(1)} µs a series)`,
  );
}
lines.forEach((line) => process.stdout.write(`${line}\n`));

// Worker threads over the whole trend row (which adds Hamed-Rao and Pettitt), against one thread,
// on four times the series. The threads' start-up (each loads the TypeScript sources) is timed on
// its own; the speed-up is then measured on the started threads, as a build that keeps its pool
// pays the start-up once.
for (const c of cases.filter((entry) => entry.n === 120)) {
  const many = Array.from({ length: 4 }, () => c.values).flat();
  const series = many.map((values, k) => ({ key: String(k), times: c.times, months: c.months, values }));
  const timeIt = async (run: () => Promise<unknown>) => {
    const start = process.hrtime.bigint();
    await run();
    return Number(process.hrtime.bigint() - start) / 1e9;
  };
  await timeIt(() => parallelTrends(series.slice(0, 500), { seasonal: true }));
  const one = await timeIt(() => parallelTrends(series, { seasonal: true }, { batchSize: 250 }));
  const workers = Math.max(2, availableParallelism());
  const pool = new WorkerPool(workers);
  const startup = await timeIt(() => parallelTrends(series.slice(0, workers * 10), { seasonal: true }, { pool, batchSize: 10 }));
  const threaded = await timeIt(() => parallelTrends(series, { seasonal: true }, { pool, batchSize: 250 }));
  await pool.close();
  process.stdout.write(
    `n=120  whole trend row over ${series.length} series: 1 thread ${(series.length / one).toFixed(0)} series/s; ${workers} started worker threads ${(series.length / threaded).toFixed(0)} series/s; ` +
      `speed-up ${(one / threaded).toFixed(2)}× (starting the ${workers} threads, with a first tiny batch: ${(startup * 1000).toFixed(0)} ms; with it the speed-up would be ${(one / (threaded + startup)).toFixed(2)}×)\n`,
  );
}

if (!havePython) {
  process.stdout.write('python3 with scipy and numpy not found: no comparison run\n');
} else {
  const dataPath = join(work, 'data.json');
  const resultPath = join(work, 'typescript.json');
  writeFileSync(
    dataPath,
    JSON.stringify({
      repeats: REPEATS,
      cases: cases.map((c) => ({
        n: c.n,
        times: Array.from(c.times),
        loopSeries: LOOP_SERIES,
        values: c.values.map((v) => Array.from(v, nullable)),
      })),
    }),
  );
  writeFileSync(resultPath, JSON.stringify(results));
  const run = spawnSync('python3', [join(import.meta.dirname, 'stats_python.py'), dataPath, resultPath], {
    encoding: 'utf8',
    maxBuffer: 1 << 26,
  });
  if (run.status !== 0) {
    process.stderr.write(run.stderr);
    process.exit(1);
  }
  const report = JSON.parse(run.stdout) as Array<{
    n: number;
    scipyLoopSeriesPerSecond: number;
    numpySeriesPerSecond: number;
    worstRelativeDifference: Record<string, number>;
  }>;
  let agree = true;
  for (const entry of report) {
    const rate = singleRates.get(entry.n) as number;
    const worst = Math.max(...Object.values(entry.worstRelativeDifference));
    agree &&= worst <= 1e-9;
    process.stdout.write(
      `n=${String(entry.n).padStart(3)}  scipy loop ${entry.scipyLoopSeriesPerSecond.toFixed(0).padStart(6)} series/s (ratio ${(rate / entry.scipyLoopSeriesPerSecond).toFixed(1)}×)  ` +
        `numpy vectorized ${entry.numpySeriesPerSecond.toFixed(0).padStart(7)} series/s (ratio ${(rate / entry.numpySeriesPerSecond).toFixed(2)}×)  worst relative difference ${worst.toExponential(2)}\n`,
    );
  }
  const at120 = report.find((entry) => entry.n === 120);
  if (at120) {
    const rate = singleRates.get(120) as number;
    process.stdout.write(
      `targets at n=120: scipy loop ratio ${(rate / at120.scipyLoopSeriesPerSecond).toFixed(1)}× (target ≥ 50×), numpy ratio ${(rate / at120.numpySeriesPerSecond).toFixed(2)}× (target ≥ 2×)\n`,
    );
  }
  process.stdout.write(agree ? 'results agree to 1e-9 relative\n' : 'RESULTS DISAGREE: see the worst relative differences above\n');
  if (!agree) process.exitCode = 1;
}
