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
}

export class ProblemList {
  readonly items: Problem[] = [];

  add(problem: Problem): void {
    this.items.push(problem);
  }

  error(fields: Omit<Problem, 'severity'>): void {
    this.add({ severity: 'error', ...fields });
  }

  warning(fields: Omit<Problem, 'severity'>): void {
    this.add({ severity: 'warning', ...fields });
  }

  get errors(): Problem[] {
    return this.items.filter((problem) => problem.severity === 'error');
  }

  get warnings(): Problem[] {
    return this.items.filter((problem) => problem.severity === 'warning');
  }

  /** Problems sorted by file, then line, then column, so a person can work down the list. */
  sorted(): Problem[] {
    return [...this.items].sort(
      (a, b) => a.file.localeCompare(b.file) || a.line - b.line || a.column.localeCompare(b.column) || a.code.localeCompare(b.code),
    );
  }
}

/** One line a problem: `file:line column: message (found "x", expected y)`. */
export function formatProblem(problem: Problem): string {
  const where = problem.line > 0 ? `${problem.file}:${problem.line}` : problem.file;
  const column = problem.column ? ` [${problem.column}]` : '';
  const found = problem.value !== '' ? ` (found "${problem.value}"; expected ${problem.expected})` : problem.expected ? ` (expected ${problem.expected})` : '';
  return `${problem.severity} ${where}${column}: ${problem.message}${found}`;
}

/** Thrown by the build when the inputs hold errors; carries the whole list. */
export class InputError extends Error {
  constructor(readonly problems: Problem[]) {
    super(`${problems.filter((p) => p.severity === 'error').length} input error(s)`);
    this.name = 'InputError';
  }
}
