/**
 * The `limnopress` command line. Exit codes: 0 success, 1 input errors or a failed run,
 * 2 a usage error.
 */
import { StageError, toolVersion } from '../common/tool.ts';
import { PublishError } from '../site/publish.ts';
import { InputError } from '../ingest/problems.ts';
import { HELP, UsageError } from './usage.ts';

/**
 * Each command's module is loaded only when it runs, so `--version` and `--help` answer without
 * loading the stages (Eleventy, Vega, sharp).
 */
const COMMANDS: Record<string, (args: string[]) => Promise<number>> = {
  build: async (args) => (await import('./build.ts')).runBuild(args),
  check: async (args) => (await import('./check.ts')).runCheck(args),
  init: async (args) => (await import('./init.ts')).runInit(args),
  'new-issue': async (args) => (await import('./init.ts')).runNewIssue(args),
  preview: async (args) => (await import('./preview.ts')).runPreview(args),
  storage: async (args) => (await import('./storage.ts')).runStorage(args),
  trend: async (args) => (await import('./trend.ts')).runTrend(args),
  verify: async (args) => (await import('./verify.ts')).runVerify(args),
};

const isParseArgsError = (error: unknown) =>
  error instanceof TypeError && 'code' in error && String(error.code).startsWith('ERR_PARSE_ARGS');

/** One line for a person: what failed and why; the stack only with --debug. */
function describeFailure(error: unknown, debug: boolean): string {
  const stack = debug && error instanceof Error ? `\n${(error.cause instanceof Error ? error.cause : error).stack ?? ''}` : '';
  if (error instanceof PublishError) return `limnopress: ${error.message}${stack}`;
  if (error instanceof StageError) return `limnopress: failed while ${error.stage}: ${oneLine(error.reason)}${stack}`;
  return `limnopress: failed: ${oneLine(error instanceof Error ? error.message : String(error))}${stack}`;
}

/** A message on one line, at most 300 characters (a value echoed from an input can be megabytes). */
const oneLine = (text: string) => {
  const flat = text.replace(/\s+/g, ' ').trim();
  return flat.length > 300 ? `${flat.slice(0, 300)}…` : flat;
};

export async function main(argv: string[]): Promise<number> {
  const debug = argv.includes('--debug');
  const [command, ...rest] = argv.filter((arg) => arg !== '--debug');
  try {
    if (command === undefined || command === '-h' || command === '--help') {
      process.stdout.write(HELP.main);
      return command === undefined ? 2 : 0;
    }
    if (command === '-v' || command === '--version') {
      process.stdout.write(`${toolVersion()}\n`);
      return 0;
    }
    if (command === 'help') {
      const topic = rest[0] ?? 'main';
      process.stdout.write(topic in HELP ? HELP[topic as keyof typeof HELP] : HELP.main);
      return 0;
    }
    const run = COMMANDS[command];
    if (!run) throw new UsageError(`unknown command "${command}"`);
    return await run(rest);
  } catch (error) {
    if (error instanceof UsageError || isParseArgsError(error)) {
      process.stderr.write(`limnopress: ${(error as Error).message}\nRun "limnopress --help" for usage.\n`);
      return 2;
    }
    if (error instanceof InputError) {
      const errors = error.problems.filter((problem) => problem.severity === 'error').length;
      const { formatReport } = await import('./check.ts');
      process.stderr.write(formatReport(error.problems, { errors, warnings: error.problems.length - errors }));
      process.stderr.write(`limnopress: ${error.message}; nothing was written\n`);
      return 1;
    }
    process.stderr.write(`${describeFailure(error, debug)}\n`);
    return 1;
  }
}

const invokedDirectly =
  process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].replace(/\\/g, '/').split('/').pop() ?? '');
if (invokedDirectly) process.exitCode = await main(process.argv.slice(2));
