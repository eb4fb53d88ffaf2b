/**
 * `npm run bench:build`: the whole build on a national-scale invented inventory, measured, never
 * asserted. Generates (once, into .bench/, from a fixed seed) 100,000 water bodies × 120 months of
 * surface area and water quality, runs the build in a fresh process, and prints the wall time of
 * each stage, rows and series per second, pages written, site size and peak resident memory,
 * against the targets of a 2-core machine: whole build ≤ 60 s, peak RSS ≤ 3 GB.
 *
 * Usage: npm run bench:build [-- --bodies 100000 --months 120]
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, cpus, totalmem } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { generateNational } from './national.ts';

const { values } = parseArgs({
  options: {
    bodies: { type: 'string', default: '100000' },
    months: { type: 'string', default: '120' },
    help: { type: 'boolean', short: 'h' },
  },
});
if (values.help) {
  process.stdout.write('Usage: npm run bench:build [-- --bodies 100000 --months 120]\n');
  process.exit(0);
}
const bodies = Number(values.bodies);
const months = Number(values.months);
const root = join(import.meta.dirname, '..', '..');
const folder = join(root, '.bench', `national-${bodies}x${months}`);
const marker = join(folder, 'generated.json');
const site = join(root, '.bench', 'national-site');

process.stdout.write(
  `bench:build: ${bodies.toLocaleString('en')} water bodies × ${months} months; ${availableParallelism()} cores (${cpus()[0]?.model ?? 'unknown'}), ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}\n`,
);
if (!existsSync(marker)) {
  const start = performance.now();
  rmSync(folder, { recursive: true, force: true });
  const summary = generateNational(folder, { bodies, months });
  writeFileSync(marker, `${JSON.stringify(summary)}\n`);
  process.stdout.write(`generated in ${((performance.now() - start) / 1000).toFixed(0)} s (kept in ${folder} for the next run)\n`);
}
const generated = JSON.parse(readFileSync(marker, 'utf8')) as { areaRows: number; qualityRows: number; bytes: number };
process.stdout.write(
  `input: ${generated.areaRows.toLocaleString('en')} surface-area rows, ${generated.qualityRows.toLocaleString('en')} quality rows, ${(generated.bytes / 1e6).toFixed(0)} MB of CSV\n`,
);

// The build runs in a process of its own, so its peak memory is the build's alone.
const child = spawnSync(process.execPath, ['--import', 'tsx', join(import.meta.dirname, 'buildOnce.ts'), folder, site], {
  cwd: root,
  encoding: 'utf8',
  stdio: ['ignore', 'pipe', 'inherit'],
  maxBuffer: 1 << 24,
});
if (child.status !== 0) {
  process.stderr.write(child.stdout);
  process.exit(child.status ?? 1);
}
const result = JSON.parse(child.stdout.trim().split('\n').pop() as string) as {
  stats: { times: Record<string, number>; rows: number; series: number; pages: number; files: number; bytes: number };
  wallSeconds: number;
  peakRssBytes: number;
};
const { stats } = result;
const line = (label: string, value: string) => process.stdout.write(`${label.padEnd(26)} ${value}\n`);
for (const [stage, secondsSpent] of Object.entries(stats.times)) line(`stage ${stage}`, `${secondsSpent.toFixed(1)} s`);
line(
  'rows read',
  `${stats.rows.toLocaleString('en')} (${Math.round(stats.rows / (stats.times.inputs ?? 1)).toLocaleString('en')} rows/s over the inputs stage)`,
);
line(
  'trend series',
  `${stats.series.toLocaleString('en')} (${Math.round(stats.series / (stats.times.model ?? 1)).toLocaleString('en')} series/s over the model stage)`,
);
line(
  'pages written',
  `${stats.pages.toLocaleString('en')} pages, ${stats.files.toLocaleString('en')} files, ${(stats.bytes / 1e6).toFixed(0)} MB`,
);
line('whole build', `${result.wallSeconds.toFixed(1)} s (target ≤ 60 s: ${(result.wallSeconds / 60).toFixed(2)} × the target)`);
line(
  'peak RSS',
  `${(result.peakRssBytes / 2 ** 30).toFixed(2)} GiB (target ≤ 3 GB: ${(result.peakRssBytes / 3e9).toFixed(2)} × the target)`,
);
