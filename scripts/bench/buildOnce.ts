/** Child of bench:build: one build with plain progress on stderr, then its figures as one JSON line on stdout. */
import { build } from '../../src/build.ts';
import { lineProgress } from '../../src/progress.ts';

const [folder, out] = process.argv.slice(2) as [string, string];
const start = performance.now();
// Each progress line carries the resident memory at that moment, to show where the peak falls.
const rss = () => `${(process.memoryUsage.rss() / 2 ** 30).toFixed(2)} GiB`;
// And the stage in which the peak fell, sampled every 200 ms.
let stage = 'start';
let peak = { bytes: 0, stage };
const sampler = setInterval(() => {
  const now = process.memoryUsage.rss();
  if (now > peak.bytes) peak = { bytes: now, stage };
}, 200);
sampler.unref();
const result = await build({
  bulletinFolder: folder,
  outDir: out,
  progress: lineProgress((line) => {
    if (/^\d\/5 /.test(line)) stage = line;
    process.stderr.write(`${line}  [rss ${rss()}]\n`);
  }),
});
clearInterval(sampler);
process.stderr.write(`highest sampled RSS ${(peak.bytes / 2 ** 30).toFixed(2)} GiB, during "${peak.stage}"\n`);
const wallSeconds = (performance.now() - start) / 1000;
// maxRSS is in kilobytes and covers the worker threads, which share the process.
process.stdout.write(`${JSON.stringify({ stats: result.stats, wallSeconds, peakRssBytes: process.resourceUsage().maxRSS * 1024 })}\n`);
