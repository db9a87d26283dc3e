// @ts-check
// Password hashing for the identity-provider fake.
//
// TEMPORARY: scrypt from node:crypto (N = 2^15, r = 8, p = 1, 64-byte key), because argon2 is
// not installed yet. The identity issue moves this to argon2id (m = 19 MiB, t = 2, p = 1 or
// stronger, per the OWASP Password Storage Cheat Sheet). The stored format names its algorithm
// and parameters, so `verifyPassword` can keep accepting old scrypt hashes after the switch and
// `needsRehash` can tell the caller to upgrade them at the next successful sign-in.
import { randomBytes, scrypt, timingSafeEqual } from 'node:crypto';

const N = 2 ** 15;
const r = 8;
const p = 1;
const KEY_LENGTH = 64;
// scrypt needs 128 * N * r bytes (32 MiB here); Node's default ceiling is exactly 32 MiB.
const MAX_MEM = 64 * 1024 * 1024;

/**
 * @param {string} password
 * @param {Buffer} salt
 * @param {{ N: number, r: number, p: number }} params
 * @param {number} keyLength
 * @returns {Promise<Buffer>}
 */
function derive(password, salt, params, keyLength) {
  return new Promise((resolve, reject) => {
    scrypt(
      password.normalize('NFKC'),
      salt,
      keyLength,
      { ...params, maxmem: MAX_MEM },
      (err, key) => (err ? reject(err) : resolve(key)),
    );
  });
}

/**
 * Hashes a password as `scrypt$N=32768,r=8,p=1$<salt base64url>$<key base64url>`.
 * @param {string} password
 * @returns {Promise<string>}
 */
export async function hashPassword(password) {
  const salt = randomBytes(16);
  const key = await derive(password, salt, { N, r, p }, KEY_LENGTH);
  return `scrypt$N=${N},r=${r},p=${p}$${salt.toString('base64url')}$${key.toString('base64url')}`;
}

/**
 * @param {string} password
 * @param {string} stored a string made by `hashPassword`
 * @returns {Promise<boolean>}
 */
export async function verifyPassword(password, stored) {
  const [algorithm, paramText, saltText, keyText] = stored.split('$');
  if (algorithm !== 'scrypt' || !paramText || !saltText || !keyText) return false;
  const params = Object.fromEntries(
    paramText.split(',').map((pair) => {
      const [name, value] = pair.split('=');
      return [name, Number(value)];
    }),
  );
  const expected = Buffer.from(keyText, 'base64url');
  const actual = await derive(
    password,
    Buffer.from(saltText, 'base64url'),
    { N: params['N'], r: params['r'], p: params['p'] },
    expected.length,
  );
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

/**
 * True when a stored hash was made with weaker or other settings than today's.
 * @param {string} stored
 */
export function needsRehash(stored) {
  return !stored.startsWith(`scrypt$N=${N},r=${r},p=${p}$`);
}

/** A hash of a random password, checked against when an e-mail is unknown so that an unknown
 * e-mail and a wrong password take the same time. */
let dummyHash = /** @type {Promise<string> | undefined} */ (undefined);
export function dummyHashOnce() {
  dummyHash ??= hashPassword(randomBytes(16).toString('hex'));
  return dummyHash;
}
