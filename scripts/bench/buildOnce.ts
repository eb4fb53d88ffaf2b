/** Child of bench:build: one build with plain progress on stderr, then its figures as one JSON line on stdout. */
import { build } from '../../src/build.ts';
import { lineProgress } from '../../src/progress.ts';

const [folder, out] = process.argv.slice(2) as [string, string];
const start = performance.now();
const result = await build({ bulletinFolder: folder, outDir: out, progress: lineProgress((line) => process.stderr.write(`${line}\n`)) });
const wallSeconds = (performance.now() - start) / 1000;
// maxRSS is in kilobytes and covers the worker threads, which share the process.
process.stdout.write(`${JSON.stringify({ stats: result.stats, wallSeconds, peakRssBytes: process.resourceUsage().maxRSS * 1024 })}\n`);
