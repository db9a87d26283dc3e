import { HttpErrorResponse, HttpStatusCode } from '@angular/common/http';
import { AbstractControl } from '@angular/forms';
import { apiErrorMessage } from '../shell/api-error-interceptor';

/** One field the API refused, as its 400 answers list them in `details.problems`. */
export interface FieldProblem {
  /** Dotted path into the body, e.g. `numberPrefixes.job` or `addressLines.2`. */
  readonly path: string;
  readonly message: string;
}

/** The field problems of a 400 answer; empty for any other failure. */
export function fieldProblemsOf(err: unknown): FieldProblem[] {
  if (!(err instanceof HttpErrorResponse) || err.status !== HttpStatusCode.BadRequest) return [];
  const problems: unknown = (err.error as { error?: { details?: { problems?: unknown } } } | null)
    ?.error?.details?.problems;
  if (!Array.isArray(problems)) return [];
  return problems.filter(
    (p): p is FieldProblem =>
      typeof p === 'object' &&
      p !== null &&
      typeof (p as FieldProblem).path === 'string' &&
      typeof (p as FieldProblem).message === 'string',
  );
}

/**
 * Puts each problem of a 400 answer on the form control it names, as a `server` error the
 * template shows under the field. `rename` maps body paths to control paths where they differ.
 * Returns the message for the form as a whole: what no field could show, or null.
 */
export function showProblems(
  form: AbstractControl,
  err: unknown,
  rename: Readonly<Record<string, string>> = {},
): string | null {
  const problems = fieldProblemsOf(err);
  const unplaced: string[] = [];
  for (const problem of problems) {
    const control = form.get(rename[problem.path] ?? problem.path);
    if (control && problem.path) {
      control.setErrors({ ...control.errors, server: problem.message });
      control.markAsTouched();
    } else {
      unplaced.push(problem.message);
    }
  }
  if (problems.length && !unplaced.length) return null;
  return unplaced.length ? unplaced.join(' ') : errorText(err);
}

/** The sentence to show for a failed call (the API's own message when it sent one). */
export function errorText(err: unknown): string {
  return err instanceof HttpErrorResponse ? apiErrorMessage(err) : 'Something went wrong.';
}
