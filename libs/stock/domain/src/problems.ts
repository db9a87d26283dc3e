/**
 * Named problems with the input, so the API can answer with the field at fault. `kind`
 * separates malformed input (`invalid`: the API's 400) from input that is well formed but
 * clashes with the stock as it stands (`conflict`: the API's 409); the domain knows no HTTP.
 */

/** Every problem code this library reports. */
export type StockProblemCode =
  | 'not-a-number'
  | 'negative-quantity'
  | 'zero-quantity'
  | 'fractional-quantity'
  | 'invalid-money'
  | 'missing'
  | 'invalid-date'
  | 'expiry-before-receipt'
  | 'same-location'
  | 'unknown-batch'
  | 'expired-batch'
  | 'insufficient-stock'
  | 'no-cost-known'
  | 'invalid-setting';

/** One problem with one field (`field` is a path such as `lines[2].quantity`). */
export interface StockProblem {
  field: string;
  code: StockProblemCode;
  kind: 'invalid' | 'conflict';
  message: string;
}

const CONFLICTS: ReadonlySet<StockProblemCode> = new Set([
  'expired-batch',
  'insufficient-stock',
  'no-cost-known',
]);

/** Builds a problem; the kind follows from the code. */
export function problem(field: string, code: StockProblemCode, message: string): StockProblem {
  return { field, code, kind: CONFLICTS.has(code) ? 'conflict' : 'invalid', message };
}

/** Thrown by computations given input they cannot work with; carries every problem. */
export class StockInputError extends Error {
  constructor(readonly problems: StockProblem[]) {
    super(problems.map((p) => `${p.field}: ${p.message}`).join('; '));
    this.name = 'StockInputError';
  }

  /** `conflict` when every problem is one (the API's 409), else `invalid` (400). */
  get kind(): 'invalid' | 'conflict' {
    return this.problems.every((p) => p.kind === 'conflict') ? 'conflict' : 'invalid';
  }
}

/** Throws a StockInputError with one problem. */
export function fail(field: string, code: StockProblemCode, message: string): never {
  throw new StockInputError([problem(field, code, message)]);
}
