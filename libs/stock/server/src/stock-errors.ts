/**
 * The stock domain's named problems in the API's error shape: `invalid` problems are a 400
 * (ValidationError), problems that clash with the stock as it stands a 409 (ConflictError);
 * both carry `{ path, code, message }` per problem so the page can mark the field.
 */
import { ConflictError, ValidationError } from '@latchwork/shared-server-kit';
import type { StockProblem } from '@latchwork/stock-domain';

/** A problem with its field path as the request named it (`lines.2.quantity`). */
export interface ApiProblem {
  path: string;
  code: string;
  message: string;
}

const asApi = (p: StockProblem, prefix: string): ApiProblem => ({
  path: prefix + p.field,
  code: p.code,
  message: p.message,
});

/** Throws the 400 (any invalid problem) or 409 (only conflicts) for `problems`, if any. */
export function throwProblems(problems: readonly StockProblem[], prefix = ''): void {
  if (problems.length === 0) return;
  const invalid = problems.filter((p) => p.kind === 'invalid');
  const shown = (invalid.length > 0 ? invalid : problems).map((p) => asApi(p, prefix));
  const first = shown[0];
  const message = `${first.path}: ${first.message}`;
  if (invalid.length > 0) throw new ValidationError(message, shown);
  throw new ConflictError(message, { problems: shown });
}

/** One 400 naming one field. */
export function invalidField(path: string, message: string, code = 'invalid'): never {
  const problem: ApiProblem = { path, code, message };
  throw new ValidationError(`${path}: ${message}`, [problem]);
}

/** One 409 naming one field, with extra facts for the page (what is available, where). */
export function conflictField(
  path: string,
  code: string,
  message: string,
  facts: Record<string, unknown> = {},
): never {
  throw new ConflictError(message, { problems: [{ path, code, message }], ...facts });
}
