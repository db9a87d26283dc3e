// @ts-check
// Password hashing and the password rules of the identity-provider fake.
//
// argon2id at OWASP's minimum: "Use Argon2id with a minimum configuration of 19 MiB of memory,
// an iteration count of 2, and 1 degree of parallelism" (OWASP Password Storage Cheat Sheet,
// section "Argon2id"). The `argon2` package writes the PHC string
// `$argon2id$v=19$m=19456,t=2,p=1$<salt>$<hash>` (parameter order as the library emits it),
// so the parameters of every stored hash can be read back and checked.
import { randomBytes } from 'node:crypto';
import argon2 from 'argon2';

/** OWASP Password Storage Cheat Sheet, Argon2id minimum: m = 19 MiB, t = 2, p = 1. */
export const ARGON2_OPTIONS = Object.freeze({
  type: argon2.argon2id,
  memoryCost: 19 * 1024, // KiB, i.e. 19 MiB
  timeCost: 2,
  parallelism: 1,
});

/**
 * Length rules for a new password, counted in Unicode code points. At least 12: the length
 * this product asks for (NIST SP 800-63B allows 8 as a floor; longer is the common advice when
 * nothing else is enforced). At most 128 so that nobody can make the server hash megabytes.
 */
export const PASSWORD_RULES = Object.freeze({ minLength: 12, maxLength: 128 });

/**
 * Unicode passwords are normalised (NFKC) before hashing so that the same characters typed on
 * two keyboards give the same hash (NIST SP 800-63B, 5.1.1.2).
 * @param {string} password
 */
const normalise = (password) => password.normalize('NFKC');

/**
 * Hashes a password with argon2id at the parameters above.
 * @param {string} password
 * @returns {Promise<string>} a PHC string starting `$argon2id$v=19$`
 */
export function hashPassword(password) {
  return argon2.hash(normalise(password), ARGON2_OPTIONS);
}

/**
 * Checks a password against a stored hash. Anything that is not an argon2id hash (such as the
 * scrypt hashes of the fake's first version) never matches.
 * @param {string} password
 * @param {string} stored
 * @returns {Promise<boolean>}
 */
export async function verifyPassword(password, stored) {
  if (!isCurrentHash(stored)) return false;
  try {
    return await argon2.verify(stored, normalise(password));
  } catch {
    return false;
  }
}

/**
 * True for a hash this version can check: argon2id. Accounts with an older hash count as
 * having no password (they are set again by the seed or an invitation).
 * @param {string | undefined} stored
 */
export function isCurrentHash(stored) {
  return typeof stored === 'string' && stored.startsWith('$argon2id$');
}

/**
 * What is wrong with a new password and its repetition, in words for the person; undefined
 * when it is fine.
 * @param {string} password
 * @param {string} [repeat] checked only when given
 * @returns {string | undefined}
 */
export function newPasswordProblem(password, repeat) {
  const length = [...String(password ?? '')].length;
  if (length < PASSWORD_RULES.minLength) {
    return `Use at least ${PASSWORD_RULES.minLength} characters.`;
  }
  if (length > PASSWORD_RULES.maxLength) {
    return `Use at most ${PASSWORD_RULES.maxLength} characters.`;
  }
  if (repeat !== undefined && repeat !== password) return 'The two passwords are not the same.';
  return undefined;
}

/** A hash of a random password, checked against when an e-mail is unknown so that an unknown
 * e-mail and a wrong password take the same time. */
let dummyHash = /** @type {Promise<string> | undefined} */ (undefined);
export function dummyHashOnce() {
  dummyHash ??= hashPassword(randomBytes(16).toString('hex'));
  return dummyHash;
}
