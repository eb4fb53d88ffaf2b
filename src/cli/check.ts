/** `limnopress check`: every problem in a bulletin folder's inputs, grouped by file. */
import { parseArgs } from 'node:util';
import { describeFound, type Problem } from '../ingest/index.ts';
import { loadIssues } from '../ingest/issues.ts';
import { HELP, UsageError } from './usage.ts';

/** Problems grouped under their file, in line order, then a summary line. */
export function formatReport(problems: Problem[], totals: { errors: number; warnings: number }): string {
  const lines: string[] = [];
  let file: string | null = null;
  for (const problem of problems) {
    if (problem.file !== file) {
      file = problem.file;
      lines.push(file);
    }
    const where = problem.line > 0 && problem.line < Number.MAX_SAFE_INTEGER ? `line ${problem.line}` : 'file';
    const column = problem.column ? ` [${problem.column}]` : '';
    lines.push(`  ${problem.severity} ${where}${column}: ${problem.message}${describeFound(problem)}`);
  }
  const files = new Set(problems.map((problem) => problem.file)).size;
  const plural = (count: number, word: string) => `${count} ${word}${count === 1 ? '' : 's'}`;
  lines.push(
    problems.length === 0
      ? 'No problems found.'
      : `${plural(totals.errors, 'error')}, ${plural(totals.warnings, 'warning')} in ${plural(files, 'file')}.`,
  );
  return `${lines.join('\n')}\n`;
}

export async function runCheck(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { help: { type: 'boolean', short: 'h' } } });
  if (values.help) {
    process.stdout.write(HELP.check);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('check needs exactly one bulletin folder');
  // Every issue of the folder, archived ones included, exactly as build reads them.
  const { problems, errors, warnings } = await loadIssues(positionals[0] as string);
  process.stdout.write(formatReport(problems, { errors, warnings }));
  return errors > 0 ? 1 : 0;
}
