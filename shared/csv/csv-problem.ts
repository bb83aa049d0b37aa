import type { CsvProblem, ProblemCode, ProblemSeverity } from './csv-types';

/**
 * The only error the CSV code throws: for files that cannot be previewed at all (binary, empty,
 * no date column...). Row-level trouble is returned as problems instead, so one bad cell does not
 * hide the rest of the report.
 */
export class CsvError extends Error {
  override readonly name = 'CsvError';

  constructor(
    readonly code: ProblemCode,
    message: string,
    readonly problems: CsvProblem[] = [],
  ) {
    super(message);
  }
}

export function createProblem(
  code: ProblemCode,
  row: number,
  column: string | null,
  message: string,
  severity: ProblemSeverity = 'error',
): CsvProblem {
  return { row, column, code, message, severity };
}

export function failWith(
  code: ProblemCode,
  row: number,
  column: string | null,
  message: string,
): never {
  throw new CsvError(code, message, [createProblem(code, row, column, message)]);
}

/**
 * Collects problems up to a cap, so a million-row file full of errors cannot exhaust memory; the
 * total is still counted and one closing problem says how many were left out.
 */
export class ProblemList {
  private readonly kept: CsvProblem[] = [];
  private total = 0;
  private errors = 0;

  constructor(private readonly limit = 500) {}

  add(problem: CsvProblem): void {
    this.total++;
    if (problem.severity === 'error') this.errors++;
    if (this.kept.length < this.limit) this.kept.push(problem);
  }

  get count(): number {
    return this.total;
  }

  get hasErrors(): boolean {
    return this.errors > 0;
  }

  list(): CsvProblem[] {
    const left = this.total - this.kept.length;
    if (left <= 0) return [...this.kept];
    const last = this.kept[this.kept.length - 1];
    const note = `${left} more problems were not listed; fix the ones above and check again`;
    return [...this.kept, createProblem('too-many-problems', last.row, null, note, 'warning')];
  }
}
