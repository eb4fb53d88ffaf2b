/**
 * Problems found in the inputs are data, not exceptions: every reader adds to one list, the build
 * stops before writing anything when the list holds an error, and warnings travel on into the
 * data & methods page.
 */
export type Severity = 'error' | 'warning';

export interface Problem {
  severity: Severity;
  code: string;
  file: string;
  /** 1-based line in the file, counting the header as line 1; 0 when the problem is the whole file. */
  line: number;
  /** Column name (or JSON path) the problem sits in; empty when it concerns a whole row or file. */
  column: string;
  value: string;
  expected: string;
  message: string;
  /**
   * For warnings, which the site shows in every language: the figures of the message, to fill the
   * catalogue's `warning.<code>` sentence (the value found is always there as `value`).
   */
  params?: Record<string, string | number>;
}

/** Problems of one kind in one file kept in full; the rest are counted in one closing line. */
export const PROBLEMS_KEPT_PER_KIND = 50;

export class ProblemList {
  readonly items: Problem[] = [];
  private readonly perKind = new Map<string, number>();

  add(problem: Problem): void {
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
      more.push({ ...sample, line: Number.MAX_SAFE_INTEGER, column: '', value: '', expected: '', message: `${count - PROBLEMS_KEPT_PER_KIND} more problem(s) of this kind (${sample.code}) not listed` });
    }
    return [...this.items, ...more].sort(
      (a, b) => a.file.localeCompare(b.file) || a.line - b.line || (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1) || a.column.localeCompare(b.column) || a.code.localeCompare(b.code),
    );
  }
}

/** The bracket after a message: what was found and what was expected (or a suggestion). */
export function describeFound(problem: Problem): string {
  const expected = problem.expected === '' ? '' : problem.expected.startsWith('did you mean') ? problem.expected : `expected ${problem.expected}`;
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

/** Thrown by the build when the inputs hold errors; carries the whole list. */
export class InputError extends Error {
  constructor(readonly problems: Problem[]) {
    super(`${problems.filter((p) => p.severity === 'error').length} input error(s)`);
    this.name = 'InputError';
  }
}
