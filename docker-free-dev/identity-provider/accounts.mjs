// @ts-check
// Accounts of the identity-provider fake, behind one small interface:
//   { findByEmail(email), verifyPassword(account, password), findById(id) }
// plus setPassword(email, password, name) for the seed script.
//
// Two stores: PostgreSQL (schema `idp`, table `account`) when a database URL is given — that is
// how the demo and the identity issue run — and a JSON file under the data folder otherwise
// (tests of the fake itself, or a quick run without a database).
import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import pg from 'pg';
import { dummyHashOnce, hashPassword, verifyPassword as checkHash } from './password.mjs';

/**
 * @typedef {{ id: string, email: string, name: string }} Account
 * @typedef {{
 *   findByEmail(email: string): Promise<Account | undefined>,
 *   findById(id: string): Promise<Account | undefined>,
 *   verifyPassword(account: Account | undefined, password: string): Promise<boolean>,
 *   setPassword(email: string, password: string, name?: string): Promise<Account>,
 *   close(): Promise<void>,
 * }} AccountStore
 * @typedef {{ databaseUrl?: string, dataDir?: string }} AccountStoreOptions
 *   dataDir is the root data folder (LW_DATA_DIR); the JSON file lives in its
 *   `identity-provider/` subfolder.
 */

/** @param {string} email */
export function normaliseEmail(email) {
  return String(email ?? '')
    .trim()
    .toLowerCase();
}

/**
 * Opens the account store the options point at.
 * @param {AccountStoreOptions} options
 * @returns {AccountStore}
 */
export function openAccounts({ databaseUrl, dataDir } = {}) {
  if (databaseUrl) return postgresAccounts(databaseUrl);
  if (!dataDir) throw new Error('accounts: give databaseUrl or dataDir');
  return fileAccounts(join(dataDir, 'identity-provider', 'accounts.json'));
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

/**
 * Checks a password; with no account it still spends the time of one check, so that an
 * unknown e-mail cannot be told from a wrong password by timing.
 * @param {string | undefined} hash
 * @param {string} password
 */
async function checkOrBurn(hash, password) {
  if (!hash) {
    await checkHash(password, await dummyHashOnce());
    return false;
  }
  return checkHash(password, hash);
}

/** @param {string} email @param {string} password */
function assertInput(email, password) {
  if (!/^[^\s@]+@[^\s@]+$/.test(email))
    throw new Error(`accounts: not an e-mail address: ${email}`);
  if (typeof password !== 'string' || password.length < 8) {
    throw new Error('accounts: a password needs at least 8 characters');
  }
}

// ---------------------------------------------------------------- PostgreSQL

/** @param {string} connectionString @returns {AccountStore} */
function postgresAccounts(connectionString) {
  const pool = new pg.Pool({ connectionString, max: 4 });
  /** @type {Promise<void> | undefined} */
  let ready;

  async function ensureSchema() {
    const client = await pool.connect();
    try {
      await client.query('begin');
      // Several processes (the fake, the seed script) may race to create the table.
      await client.query("select pg_advisory_xact_lock(hashtext('latchwork.idp.schema'))");
      await client.query('create schema if not exists idp');
      await client.query(`
        create table if not exists idp.account (
          id uuid primary key,
          email text not null unique check (email = lower(email)),
          password_hash text not null,
          name text not null default '',
          created_at timestamptz not null default now(),
          updated_at timestamptz not null default now()
        )`);
      await client.query('commit');
    } catch (error) {
      await client.query('rollback').catch(() => undefined);
      throw error;
    } finally {
      client.release();
    }
  }

  /** @template T @param {(q: pg.Pool) => Promise<T>} fn */
  async function withSchema(fn) {
    ready ??= ensureSchema().catch((error) => {
      ready = undefined;
      throw error;
    });
    await ready;
    return fn(pool);
  }

  return {
    async findByEmail(email) {
      const { rows } = await withSchema((q) =>
        q.query('select id, email, name from idp.account where email = $1', [
          normaliseEmail(email),
        ]),
      );
      return rows[0];
    },
    async findById(id) {
      if (!/^[0-9a-f-]{36}$/i.test(id)) return undefined;
      const { rows } = await withSchema((q) =>
        q.query('select id, email, name from idp.account where id = $1', [id]),
      );
      return rows[0];
    },
    async verifyPassword(account, password) {
      let hash;
      if (account) {
        const { rows } = await withSchema((q) =>
          q.query('select password_hash from idp.account where id = $1', [account.id]),
        );
        hash = rows[0]?.password_hash;
      }
      return checkOrBurn(hash, password);
    },
    async setPassword(email, password, name) {
      const normalised = normaliseEmail(email);
      assertInput(normalised, password);
      const hash = await hashPassword(password);
      const { rows } = await withSchema((q) =>
        q.query(
          `insert into idp.account (id, email, password_hash, name) values ($1, $2, $3, coalesce($4, ''))
           on conflict (email) do update
             set password_hash = excluded.password_hash,
                 name = coalesce($4, idp.account.name),
                 updated_at = now()
           returning id, email, name`,
          [randomUUID(), normalised, hash, name ?? null],
        ),
      );
      return rows[0];
    },
    async close() {
      await pool.end();
    },
  };
}

// ---------------------------------------------------------------- JSON file

/**
 * @typedef {Account & { passwordHash: string }} StoredAccount
 * @param {string} file
 * @returns {AccountStore}
 */
function fileAccounts(file) {
  // Read on every call: the seed script writes this file from another process.
  /** @returns {Promise<StoredAccount[]>} */
  async function load() {
    try {
      return JSON.parse(await readFile(file, 'utf8')).accounts ?? [];
    } catch (error) {
      if (/** @type {NodeJS.ErrnoException} */ (error).code === 'ENOENT') return [];
      throw error;
    }
  }
  /** @param {StoredAccount[]} accounts */
  async function save(accounts) {
    await mkdir(dirname(file), { recursive: true });
    const temp = `${file}.${process.pid}.tmp`;
    await writeFile(temp, JSON.stringify({ accounts }, null, 2) + '\n', { mode: 0o600 });
    await rename(temp, file);
  }
  /** @param {StoredAccount | undefined} stored @returns {Account | undefined} */
  const publicPart = (stored) =>
    stored && { id: stored.id, email: stored.email, name: stored.name };
  // Serialise writers inside this process.
  let queue = Promise.resolve();

  return {
    async findByEmail(email) {
      const normalised = normaliseEmail(email);
      return publicPart((await load()).find((a) => a.email === normalised));
    },
    async findById(id) {
      return publicPart((await load()).find((a) => a.id === id));
    },
    async verifyPassword(account, password) {
      const stored = account && (await load()).find((a) => a.id === account.id);
      return checkOrBurn(stored?.passwordHash, password);
    },
    async setPassword(email, password, name) {
      const normalised = normaliseEmail(email);
      assertInput(normalised, password);
      const passwordHash = await hashPassword(password);
      /** @type {Account | undefined} */
      let result;
      const run = queue.then(async () => {
        const accounts = await load();
        let stored = accounts.find((a) => a.email === normalised);
        if (stored) {
          stored.passwordHash = passwordHash;
          if (name !== undefined) stored.name = name;
        } else {
          stored = { id: randomUUID(), email: normalised, name: name ?? '', passwordHash };
          accounts.push(stored);
        }
        await save(accounts);
        result = publicPart(stored);
      });
      queue = run.catch(() => undefined);
      await run;
      return /** @type {Account} */ (result);
    },
    async close() {
      await queue;
    },
  };
}
