/**
 * Per-tenant job references: the tenant's prefix and a zero-padded sequence, e.g. `J-00042`.
 * The gapless counter lives in PostgreSQL; this only formats, parses and checks prefixes.
 */

/** Digits the sequence is padded to. Longer numbers simply grow (`J-100000`). */
export const REFERENCE_DIGITS = 5;

/** The longest prefix tenant settings accept. */
export const PREFIX_MAX_LENGTH = 12;

// Same rule as the tenant settings schema (libs/identity/server settings.endpoints.ts):
// letters, digits, "-" and "/" only; empty is allowed (references are then bare numbers).
const PREFIX_PATTERN = /^[A-Za-z0-9\-/]*$/;

/**
 * Why a prefix is not acceptable, or null when it is. Checks the prefix as stored, after
 * trimming — as the settings form trims before saving.
 */
export function prefixProblem(prefix: string): string | null {
  const trimmed = prefix.trim();
  if (trimmed.length > PREFIX_MAX_LENGTH) {
    return `A prefix can be at most ${PREFIX_MAX_LENGTH} characters (this one has ${trimmed.length}).`;
  }
  if (!PREFIX_PATTERN.test(trimmed)) return 'A prefix can hold letters, digits, "-" and "/" only.';
  return null;
}

/** True when `prefix` passes the tenant settings rule. */
export function isValidPrefix(prefix: string): boolean {
  return prefixProblem(prefix) === null;
}

/**
 * Formats a reference from the tenant's prefix and the sequence number the database handed
 * out. Throws RangeError for a number that is not a positive safe integer or a bad prefix:
 * both are programming errors, never user input.
 */
export function formatReference(
  prefix: string,
  sequence: number,
  digits: number = REFERENCE_DIGITS,
): string {
  const problem = prefixProblem(prefix);
  if (problem) throw new RangeError(problem);
  if (!Number.isSafeInteger(sequence) || sequence < 1) {
    throw new RangeError(`A reference number must be a whole number from 1 (got ${sequence}).`);
  }
  if (!Number.isInteger(digits) || digits < 1 || digits > 15) {
    throw new RangeError(`Padding must be 1–15 digits (got ${digits}).`);
  }
  return prefix.trim() + String(sequence).padStart(digits, '0');
}

/**
 * Reads the sequence number back from a reference, or null when it is not one of this
 * tenant's. Forgiving with what people type into a search box: any case, surrounding
 * spaces, and without the zero padding (`j-42` → 42). Never guesses a different prefix.
 */
export function parseReference(reference: string, prefix: string): number | null {
  const text = reference.trim();
  const p = prefix.trim();
  if (text.length <= p.length) return null;
  if (text.slice(0, p.length).toUpperCase() !== p.toUpperCase()) return null;
  const digits = text.slice(p.length);
  if (!/^[0-9]+$/.test(digits)) return null;
  const n = Number(digits);
  return Number.isSafeInteger(n) && n >= 1 ? n : null;
}

/** The reference as stored, from what someone typed (`j-42` → `J-00042`), or null. */
export function normaliseReference(
  reference: string,
  prefix: string,
  digits: number = REFERENCE_DIGITS,
): string | null {
  const n = parseReference(reference, prefix);
  return n === null ? null : formatReference(prefix, n, digits);
}
