/** `limnopress build`: check the inputs of a bulletin folder and publish its site. */
import { parseArgs } from 'node:util';
import { build } from '../build.ts';
import { barProgress, lineProgress, silentProgress } from '../progress.ts';
import { foldAcrossIssues, formatFolded } from '../ingest/problems.ts';
import { HELP, UsageError } from './usage.ts';

export async function runBuild(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      out: { type: 'string', short: 'o', default: '_site' },
      force: { type: 'boolean' },
      quiet: { type: 'boolean', short: 'q' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    process.stdout.write(HELP.build);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('build needs exactly one bulletin folder');
  // A bar on a terminal, plain lines in a log or pipe, nothing but errors with --quiet (all on stderr).
  const progress = values.quiet
    ? silentProgress
    : process.stderr.isTTY
      ? barProgress(process.stderr)
      : lineProgress((line) => process.stderr.write(`${line}\n`));
  const result = await build({
    bulletinFolder: positionals[0] as string,
    outDir: values.out as string,
    progress,
    handleSignals: true,
    ...(values.force ? { force: true } : {}),
  });
  // A warning found in the same place of several issues (a column every export carries) is named once.
  if (!values.quiet) for (const entry of foldAcrossIssues(result.warnings)) process.stderr.write(`${formatFolded(entry)}\n`);
  if (!values.quiet) process.stdout.write(`Bulletin written to ${result.outDir}/index.html\n`);
  return 0;
}
