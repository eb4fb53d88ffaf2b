/**
 * The `limnopress` command line. Exit codes: 0 success, 1 input errors or a failed build,
 * 2 a usage error.
 */
import { parseArgs } from 'node:util';
import { build, toolVersion } from '../build.ts';
import { formatProblem, InputError } from '../ingest/index.ts';

const HELP: Record<string, string> = {
  main: `limnopress: turns inland-water tables into a monthly water-status bulletin site

Usage: limnopress <command> [options]

Commands:
  build <bulletin-folder> --out <dir>   check the inputs and build the bulletin site
  help [command]                        show help for a command

Options:
  -h, --help       show help
  -v, --version    show the version
`,
  build: `Usage: limnopress build <bulletin-folder> --out <dir> [--quiet]

Checks every input of the bulletin folder, then builds the site into <dir>. The new site replaces
<dir> only when the whole build succeeded; on any error <dir> is left as it was.

Options:
  -o, --out <dir>   where the site goes (default: _site)
  -q, --quiet       print nothing but errors
  -h, --help        show this help
`,
};

class UsageError extends Error {}

async function runBuild(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { out: { type: 'string', short: 'o', default: '_site' }, quiet: { type: 'boolean', short: 'q' }, help: { type: 'boolean', short: 'h' } },
  });
  if (values.help) {
    process.stdout.write(HELP.build as string);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('build needs exactly one bulletin folder');
  const log = values.quiet ? undefined : (line: string) => process.stderr.write(`${line}\n`);
  const result = await build({ bulletinFolder: positionals[0] as string, outDir: values.out as string, log });
  for (const warning of result.warnings) if (!values.quiet) process.stderr.write(`${formatProblem(warning)}\n`);
  if (!values.quiet) process.stdout.write(`Bulletin written to ${result.outDir}/index.html\n`);
  return 0;
}

export async function main(argv: string[]): Promise<number> {
  const [command, ...rest] = argv;
  try {
    if (command === undefined || command === '-h' || command === '--help') {
      process.stdout.write(HELP.main as string);
      return command === undefined ? 2 : 0;
    }
    if (command === '-v' || command === '--version') {
      process.stdout.write(`${toolVersion()}\n`);
      return 0;
    }
    if (command === 'help') {
      process.stdout.write(HELP[rest[0] ?? 'main'] ?? (HELP.main as string));
      return 0;
    }
    if (command === 'build') return await runBuild(rest);
    throw new UsageError(`unknown command "${command}"`);
  } catch (error) {
    if (error instanceof UsageError || (error instanceof TypeError && 'code' in error && String(error.code).startsWith('ERR_PARSE_ARGS'))) {
      process.stderr.write(`limnopress: ${error.message}\nRun "limnopress --help" for usage.\n`);
      return 2;
    }
    if (error instanceof InputError) {
      for (const problem of error.problems) process.stderr.write(`${formatProblem(problem)}\n`);
      process.stderr.write(`limnopress: ${error.message}; nothing was written\n`);
      return 1;
    }
    process.stderr.write(`limnopress: build failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return 1;
  }
}

const invokedDirectly = process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].replace(/\\/g, '/').split('/').pop() ?? '');
if (invokedDirectly) process.exitCode = await main(process.argv.slice(2));
