/**
 * `npm run bench:ingest`: reads a generated surface-area CSV of 10 million rows (100,000 invented
 * water bodies × 100 months) through the same reader the build uses, and prints rows per second
 * and peak resident memory. Measured, never asserted. Targets: at least 1 million rows per second,
 * peak RSS under 1.5 GB.
 *
 * The data are generated once into .bench/ (not committed) from a fixed seed.
 * Usage: npm run bench:ingest [-- --rows 10000000]
 */
import { createWriteStream, existsSync, mkdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { once } from 'node:events';
import { ProblemList } from '../../src/ingest/problems.ts';
import { readSurfaceArea } from '../../src/ingest/tables.ts';
import type { WaterBody } from '../../src/ingest/tableTypes.ts';

const rowsArg = process.argv.indexOf('--rows');
const ROWS = rowsArg > 0 ? Number(process.argv[rowsArg + 1]) : 10_000_000;
const MONTHS = 100;
const BODIES = Math.ceil(ROWS / MONTHS);
const FIRST_MONTH = 2018 * 12;
const folder = join(import.meta.dirname, '..', '..', '.bench');
const path = join(folder, `surface-area-${ROWS}.csv`);

const label = (month: number) => `${Math.floor(month / 12)}-${String((month % 12) + 1).padStart(2, '0')}`;
const id = (k: number) => `B${String(k).padStart(6, '0')}`;

async function generate(): Promise<void> {
  mkdirSync(folder, { recursive: true });
  const out = createWriteStream(path);
  out.write('body_id,month,water_area_ha,observed_share,scenes\n');
  let state = 12345;
  const random = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 4294967296;
  let chunk = '';
  let written = 0;
  for (let month = FIRST_MONTH; month < FIRST_MONTH + MONTHS && written < ROWS; month++) {
    const text = label(month);
    for (let body = 0; body < BODIES && written < ROWS; body++, written++) {
      chunk += `${id(body)},${text},${(random() * 90 + 5).toFixed(2)},${random().toFixed(3)},${1 + Math.floor(random() * 5)}\n`;
      if (chunk.length > 1 << 20) {
        if (!out.write(chunk)) await once(out, 'drain');
        chunk = '';
      }
    }
    if (process.stderr.isTTY) process.stderr.write(`\rgenerating ${path}: ${Math.round((100 * written) / ROWS)} %`);
  }
  out.end(chunk);
  await once(out, 'finish');
  process.stderr.write(`${process.stderr.isTTY ? '\r' : ''}generated ${path}\n`);
}

if (!existsSync(path)) await generate();
const bodies: WaterBody[] = Array.from({ length: BODIES }, (_, k) => ({
  id: id(k),
  name: id(k),
  subRegionId: 'R',
  lon: 0,
  lat: 0,
  referenceHa: 100,
  kind: 'lake',
  ownPage: false,
  line: k + 2,
}));
const problems = new ProblemList();
const before = process.memoryUsage().rss;
const start = process.hrtime.bigint();
const table = await readSurfaceArea(path, 'surface-area.csv', bodies, {
  problems,
  bulletinMonth: FIRST_MONTH + MONTHS - 1,
  decimal: 'auto',
});
const seconds = Number(process.hrtime.bigint() - start) / 1e9;
const peakMb = process.resourceUsage().maxRSS / 1024;
const { errors, warnings } = problems.total;
process.stdout.write(
  [
    `bench:ingest: ${table.length.toLocaleString('en')} rows (${(statSync(path).size / 1e6).toFixed(0)} MB) read in ${seconds.toFixed(2)} s`,
    `  ${(table.length / seconds / 1e6).toFixed(2)} million rows/s (target ≥ 1)`,
    `  peak RSS ${peakMb.toFixed(0)} MB (target < 1536 MB); RSS before reading ${(before / 1e6).toFixed(0)} MB`,
    `  ${errors} errors, ${warnings} warnings`,
  ].join('\n') + '\n',
);
