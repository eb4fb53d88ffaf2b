/** `limnopress check`: every problem in a bulletin folder's inputs, grouped by file. */
import { parseArgs } from 'node:util';
import { describeFound, type Problem } from '../ingest/index.ts';
import { loadIssues } from '../ingest/issues.ts';
import { HELP, UsageError } from './usage.ts';

/** Problems of one kind shown in full before the rest are folded into one line. */
export const FOLD_AFTER = 3;

/**
 * Problems grouped under their file, in line order, then a summary line. Repeats of one kind in a
 * file (same severity, code, column and message) show the first FOLD_AFTER in full and fold the
 * rest into one line with their count and first lines: thousands of identical lines help nobody.
 */
export function formatReport(problems: Problem[], totals: { errors: number; warnings: number }): string {
  const lines: string[] = [];
  const byFile = new Map<string, Problem[]>();
  for (const problem of problems) byFile.set(problem.file, [...(byFile.get(problem.file) ?? []), problem]);
  for (const [file, own] of byFile) {
    lines.push(file);
    const kinds = new Map<string, Problem[]>();
    for (const problem of own) {
      const kind = `${problem.severity}\u0000${problem.code}\u0000${problem.column}\u0000${problem.message}`;
      kinds.set(kind, [...(kinds.get(kind) ?? []), problem]);
    }
    for (const group of kinds.values()) {
      for (const problem of group.slice(0, FOLD_AFTER)) {
        const where = problem.line > 0 && problem.line < Number.MAX_SAFE_INTEGER ? `line ${problem.line}` : 'file';
        const column = problem.column ? ` [${problem.column}]` : '';
        lines.push(`  ${problem.severity} ${where}${column}: ${problem.message}${describeFound(problem)}`);
      }
      const rest = group.slice(FOLD_AFTER).filter((problem) => problem.line > 0 && problem.line < Number.MAX_SAFE_INTEGER);
      const others = group.length - FOLD_AFTER;
      if (others > 0) {
        const shown = rest.slice(0, 5).map((problem) => problem.line);
        const place = shown.length > 0 ? ` (lines ${shown.join(', ')}${rest.length > shown.length ? ', …' : ''})` : '';
        lines.push(`  … and ${others} more like this${place}`);
      }
    }
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
