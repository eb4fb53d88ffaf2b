/**
 * Problems found in the inputs are data, not exceptions: every reader adds to one list, the build
 * stops before writing anything when the list holds an error, and warnings travel on into the
 * data & methods page.
 */
import type { ProblemCode } from '../common/problemCodes.ts';
import { say, type ProblemText } from '../common/problemMessages.ts';

export type Severity = 'error' | 'warning';

export interface Problem {
  severity: Severity;
  code: ProblemCode;
  file: string;
  /** 1-based line in the file, counting the header as line 1; 0 when the problem is the whole file. */
  line: number;
  /** Column name (or JSON path) the problem sits in; empty when it concerns a whole row or file. */
  column: string;
  value: string;
  expected: string;
  /** The catalogue's words (src/common/problemMessages.ts). */
  message: ProblemText;
  /**
   * For warnings, which the site shows in every language: the figures of the message, to fill the
   * catalogue's `warning.<code>` sentence (the value found is always there as `value`).
   */
  params?: Record<string, string | number>;
}

/** Problems of one kind in one file kept in full; the rest are counted in one closing line. */
export const PROBLEMS_KEPT_PER_KIND = 50;

/** Characters of a found value repeated in a problem; the rest is cut. */
export const MAX_ECHOED = 200;

export class ProblemList {
  readonly items: Problem[] = [];
  private readonly perKind = new Map<string, number>();

  add(found: Problem): void {
    // A value echoed from an input can be megabytes: keep its first characters only.
    const problem = found.value.length > MAX_ECHOED ? { ...found, value: `${found.value.slice(0, MAX_ECHOED)}…` } : found;
    const kind = `${problem.severity} ${problem.file} ${problem.code}`;
    const count = (this.perKind.get(kind) ?? 0) + 1;
    this.perKind.set(kind, count);
    if (count <= PROBLEMS_KEPT_PER_KIND) this.items.push(problem);
  }

  error(fields: Omit<Problem, 'severity'>): void {
    this.add({ severity: 'error', ...fields });
  }

  warning(fields: Omit<Problem, 'severity'>): void {
    this.add({ severity: 'warning', ...fields });
  }

  /** How many problems were found in all, those not kept in full included. */
  get total(): { errors: number; warnings: number } {
    let errors = 0;
    let warnings = 0;
    for (const [kind, count] of this.perKind) {
      if (kind.startsWith('error ')) errors += count;
      else warnings += count;
    }
    return { errors, warnings };
  }

  get errors(): Problem[] {
    return this.items.filter((problem) => problem.severity === 'error');
  }

  get warnings(): Problem[] {
    return this.items.filter((problem) => problem.severity === 'warning');
  }

  /**
   * Problems sorted by file, then line (errors before warnings), then column, so a person can work
   * down the list; where a
   * kind was cut short, a closing line per file says how many more there were.
   */
  sorted(): Problem[] {
    const more: Problem[] = [];
    for (const [kind, count] of this.perKind) {
      if (count <= PROBLEMS_KEPT_PER_KIND) continue;
      const sample = this.items.find((problem) => `${problem.severity} ${problem.file} ${problem.code}` === kind) as Problem;
      more.push({
        ...sample,
        line: Number.MAX_SAFE_INTEGER,
        column: '',
        value: '',
        expected: '',
        message: say('more-problems', { count: count - PROBLEMS_KEPT_PER_KIND, code: sample.code }),
      });
    }
    return [...this.items, ...more].sort(
      (a, b) =>
        rankOf(a.file) - rankOf(b.file) ||
        a.file.localeCompare(b.file) ||
        a.line - b.line ||
        (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1) ||
        a.column.localeCompare(b.column) ||
        a.code.localeCompare(b.code),
    );
  }
}

/**
 * Files others depend on come first, so a root cause stands above the problems it causes (an
 * unreadable inventory row above the "not in the inventory" lines of every table): the
 * configuration, then the boundaries, then the inventory, then the rest.
 */
const ROOT_FILES: Array<[RegExp, number]> = [
  [/bulletin\.json$/, 0],
  [/\.geojson$/i, 1],
  [/water-bodies|inventory/i, 2],
];
function rankOf(file: string): number {
  return ROOT_FILES.find(([pattern]) => pattern.test(file))?.[1] ?? 3;
}

/** The bracket after a message: what was found and what was expected (or a suggestion). */
export function describeFound(problem: Problem): string {
  const expected =
    problem.expected === '' ? '' : problem.expected.startsWith('did you mean') ? problem.expected : `expected ${problem.expected}`;
  if (problem.value !== '') return ` (found "${problem.value}"${expected ? `; ${expected}` : ''})`;
  return expected ? ` (${expected})` : '';
}

/** Where a problem is: `file:line`, or the file alone when the problem concerns the whole file. */
export function problemPlace(problem: Problem): string {
  return problem.line > 0 && problem.line < Number.MAX_SAFE_INTEGER ? `${problem.file}:${problem.line}` : problem.file;
}

/** One line a problem: `file:line column: message (found "x", expected y)`. */
export function formatProblem(problem: Problem): string {
  const where = problemPlace(problem);
  const column = problem.column ? ` [${problem.column}]` : '';
  const found = describeFound(problem);
  return `${problem.severity} ${where}${column}: ${problem.message}${found}`;
}

/** The folder of an archived issue a problem's file lies in (`archive/2026-10`), or '' for the current issue. */
const ISSUE_PREFIX = /^(archive\/[^/]+)\//;

/**
 * The same problem at the same place of several issues' inputs (an archived issue keeps a copy of
 * a table with the same extra column) folded into one entry: the problem as the latest issue has it
 * (or the first found), with the issue folders it occurs in ('' for the current issue), in order.
 */
export function foldAcrossIssues(problems: Problem[]): Array<{ problem: Problem; issues: string[] }> {
  const folded = new Map<string, { problem: Problem; issues: string[] }>();
  for (const problem of problems) {
    const issue = ISSUE_PREFIX.exec(problem.file)?.[1] ?? '';
    const file = problem.file.slice(issue === '' ? 0 : issue.length + 1);
    const key = [problem.severity, problem.code, file, problem.line, problem.column, problem.value, problem.message].join('\u0000');
    const entry = folded.get(key);
    if (!entry) folded.set(key, { problem, issues: [issue] });
    else {
      entry.issues.push(issue);
      if (issue === '') entry.problem = problem;
    }
  }
  return [...folded.values()];
}

/** One line for a problem found in one or more issues: formatProblem, and where else it occurs. */
export function formatFolded({ problem, issues }: { problem: Problem; issues: string[] }): string {
  if (issues.length < 2) return formatProblem(problem);
  const names = issues.map((issue) => (issue === '' ? 'the current issue' : issue));
  return `${formatProblem(problem)} (the same in ${issues.length} issues: ${names.join(', ')})`;
}

/** Thrown by the build when the inputs hold errors; carries the whole list. */
export class InputError extends Error {
  constructor(readonly problems: Problem[]) {
    super(`${problems.filter((p) => p.severity === 'error').length} input error(s)`);
    this.name = 'InputError';
  }
}
