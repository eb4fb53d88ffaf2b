/** Child of bench:build: one build with plain progress on stderr, then its figures as one JSON line on stdout. */
import { build } from '../../src/build.ts';
import { lineProgress } from '../../src/progress.ts';

const [folder, out] = process.argv.slice(2) as [string, string];
const start = performance.now();
// Each progress line carries the resident memory at that moment, to show where the peak falls.
const rss = () => `${(process.memoryUsage.rss() / 2 ** 30).toFixed(2)} GiB`;
const result = await build({ bulletinFolder: folder, outDir: out, progress: lineProgress((line) => process.stderr.write(`${line}  [rss ${rss()}]\n`)) });
const wallSeconds = (performance.now() - start) / 1000;
// maxRSS is in kilobytes and covers the worker threads, which share the process.
process.stdout.write(`${JSON.stringify({ stats: result.stats, wallSeconds, peakRssBytes: process.resourceUsage().maxRSS * 1024 })}\n`);
