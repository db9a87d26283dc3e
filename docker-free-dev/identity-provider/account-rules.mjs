// @ts-check
// Rules shared by both account stores: e-mail normalisation and shape, password input checks,
// and a password check that takes the same time whether or not the account exists.
import { dummyHashOnce, newPasswordProblem, verifyPassword as checkHash } from './password.mjs';

/** @param {string} email */
export function normaliseEmail(email) {
  return String(email ?? '')
    .trim()
    .toLowerCase();
}

/**
 * Checks a password; with no account it still spends the time of one check, so that an
 * unknown e-mail cannot be told from a wrong password by timing.
 * @param {string | undefined} hash
 * @param {string} password
 */
export async function checkOrBurn(hash, password) {
  if (!hash) {
    await checkHash(password, await dummyHashOnce());
    return false;
  }
  return checkHash(password, hash);
}

const EMAIL_SHAPE = /^[^\s@]+@[^\s@]+$/;

/** @param {string} email */
export function looksLikeEmail(email) {
  return EMAIL_SHAPE.test(email) && email.length <= 320;
}

/**
 * Refuses what no store should keep: a malformed e-mail or a password outside the rules.
 * @param {string} email normalised
 * @param {string} password
 */
export function assertInput(email, password) {
  if (!looksLikeEmail(email)) throw new Error(`accounts: not an e-mail address: ${email}`);
  const problem = typeof password === 'string' ? newPasswordProblem(password) : 'no password';
  if (problem) throw new Error(`accounts: ${problem}`);
}
