/**
 * `npm run bench:cli`: how long the command line takes to answer, compiled (bin/limnopress.js
 * running dist/, as installed) against the TypeScript sources through tsx (scripts/limnopress-src.js,
 * what the tests run). Each command runs 5 times in a child process; the median wall time is printed
 * with its ratio to the target. Measured, never asserted. Targets: `--version` and `--help` under
 * 0.3 s, `check example-bulletin` under 2 s.
 *
 * It compiles dist/ first (`npm run build:dist`), so the compiled figures are of the current sources.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';

const root = join(import.meta.dirname, '..', '..');
const RUNS = 5;
const compiled = join(root, 'bin', 'limnopress.js');
const sources = join(root, 'scripts', 'limnopress-src.js');
const commands: Array<{ args: string[]; target: number }> = [
  { args: ['--version'], target: 0.3 },
  { args: ['--help'], target: 0.3 },
  { args: ['check', join(root, 'example-bulletin')], target: 2 },
];

const built = spawnSync(process.execPath, [join(root, 'scripts', 'build-dist.js')], { stdio: 'inherit' });
if (built.status !== 0) process.exit(1);

function median(entry: string, args: string[]): number {
  const times: number[] = [];
  for (let run = 0; run < RUNS; run++) {
    const start = process.hrtime.bigint();
    const result = spawnSync(process.execPath, [entry, ...args], { encoding: 'utf8' });
    times.push(Number(process.hrtime.bigint() - start) / 1e9);
    if (result.status !== 0) throw new Error(`${args.join(' ')} exited ${result.status}: ${result.stderr}`);
    if (entry === compiled && result.stderr.includes('sources run')) throw new Error('dist/ is not current');
  }
  return times.sort((a, b) => a - b)[Math.floor(RUNS / 2)]!;
}

process.stdout.write(`median of ${RUNS} runs, wall time in seconds\n`);
process.stdout.write('command                         compiled  target  ratio   sources (tsx)  sources/compiled\n');
for (const { args, target } of commands) {
  const fast = median(compiled, args);
  const slow = median(sources, args);
  const name = args.map((arg) => (arg.startsWith(root) ? arg.slice(root.length + 1) : arg)).join(' ');
  process.stdout.write(
    `${name.padEnd(32)}${fast.toFixed(3).padStart(8)}  ${target.toFixed(1).padStart(6)}  ${(fast / target).toFixed(2).padStart(5)}×  ${slow.toFixed(3).padStart(13)}  ${(slow / fast).toFixed(1).padStart(15)}×\n`,
  );
}
