// @ts-check
// Accounts of the identity-provider fake, and the single-use tickets with which an invited
// person sets a password, behind one small interface (AccountStore below).
//
// Two stores: PostgreSQL (schema `idp`, accounts-postgres.mjs) when a database URL is given —
// that is how the demo and `npm test` run — and JSON files under the data folder otherwise
// (accounts-file.mjs: tests of the fake itself, or a quick run without a database).
import { fileAccounts } from './accounts-file.mjs';
import { postgresAccounts } from './accounts-postgres.mjs';

export { normaliseEmail } from './account-rules.mjs';

/**
 * @typedef {{ id: string, email: string, name: string }} Account
 * @typedef {{ email: string, name: string, returnTo: string, expiresAt: Date }} PasswordTicket
 * @typedef {PasswordTicket & { tokenHash: string }} NewPasswordTicket
 *   tokenHash is the SHA-256 of the ticket (hex): the ticket itself is never stored.
 * @typedef {{
 *   findByEmail(email: string): Promise<Account | undefined>,
 *   findById(id: string): Promise<Account | undefined>,
 *   verifyPassword(account: Account | undefined, password: string): Promise<boolean>,
 *   setPassword(email: string, password: string, name?: string): Promise<Account>,
 *   createPasswordTicket(ticket: NewPasswordTicket): Promise<void>,
 *   findPasswordTicket(tokenHash: string, now: Date): Promise<PasswordTicket | undefined>,
 *   redeemPasswordTicket(tokenHash: string, password: string, now: Date):
 *     Promise<{ account: Account, returnTo: string } | undefined>,
 *   close(): Promise<void>,
 * }} AccountStore
 *   findByEmail only finds accounts with a usable (argon2id) password: an account left with an
 *   old scrypt hash counts as having none, so the seed and invitations set it again.
 *   findPasswordTicket and redeemPasswordTicket see only unused, unexpired tickets; redeeming
 *   marks the ticket used and sets the password in one step, so a ticket works once even when
 *   two submissions race.
 * @typedef {{ databaseUrl?: string, dataDir?: string }} AccountStoreOptions
 *   dataDir is the root data folder (LW_DATA_DIR); the JSON files live in its
 *   `identity-provider/` subfolder.
 */

/**
 * Opens the account store the options point at.
 * @param {AccountStoreOptions} options
 * @returns {AccountStore}
 */
export function openAccounts({ databaseUrl, dataDir } = {}) {
  if (databaseUrl) return postgresAccounts(databaseUrl);
  if (!dataDir) throw new Error('accounts: give databaseUrl or dataDir');
  return fileAccounts(dataDir);
}

/**
 * Sets (or creates the account with) a password. For the seed script: it opens the store from
 * the options or from IDP_DATABASE_URL / LW_DATA_DIR, writes, and closes.
 * @param {string} email
 * @param {string} password
 * @param {string} [name]
 * @param {AccountStoreOptions} [options]
 * @returns {Promise<Account>}
 */
export async function setPassword(email, password, name, options) {
  const store = openAccounts(
    options ?? {
      databaseUrl: process.env['IDP_DATABASE_URL'],
      dataDir: process.env['LW_DATA_DIR'],
    },
  );
  try {
    return await store.setPassword(email, password, name);
  } finally {
    await store.close();
  }
}
