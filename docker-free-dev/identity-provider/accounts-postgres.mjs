// @ts-check
// The PostgreSQL account store (schema `idp`): what the demo and `npm test` use. The schema is
// created on first use, under an advisory lock because the fake and the seed script may race.
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { assertInput, checkOrBurn, normaliseEmail } from './account-rules.mjs';
import { hashPassword, newPasswordProblem } from './password.mjs';

/** @typedef {import('./accounts.mjs').AccountStore} AccountStore */

const SCHEMA = [
  'create schema if not exists idp',
  `create table if not exists idp.account (
     id uuid primary key,
     email text not null unique check (email = lower(email)),
     password_hash text not null,
     name text not null default '',
     created_at timestamptz not null default now(),
     updated_at timestamptz not null default now()
   )`,
  // Only the SHA-256 of a ticket is kept: a copy of the table gives nobody a working link.
  `create table if not exists idp.password_ticket (
     token_hash text primary key check (token_hash ~ '^[0-9a-f]{64}$'),
     email text not null check (email = lower(email)),
     name text not null default '',
     return_to text not null,
     expires_at timestamptz not null,
     used_at timestamptz,
     created_at timestamptz not null default now()
   )`,
];

// An account with an old (scrypt) hash has no usable password: see AccountStore.
const USABLE = "password_hash like '$argon2id$%'";

/** @param {string} connectionString @returns {AccountStore} */
export function postgresAccounts(connectionString) {
  const pool = new pg.Pool({ connectionString, max: 4 });
  /** @type {Promise<void> | undefined} */
  let ready;

  /** @template T @param {(client: pg.PoolClient) => Promise<T>} fn */
  async function transaction(fn) {
    const client = await pool.connect();
    try {
      await client.query('begin');
      const result = await fn(client);
      await client.query('commit');
      return result;
    } catch (error) {
      await client.query('rollback').catch(() => undefined);
      throw error;
    } finally {
      client.release();
    }
  }

  async function ensureSchema() {
    await transaction(async (client) => {
      await client.query("select pg_advisory_xact_lock(hashtext('latchwork.idp.schema'))");
      for (const statement of SCHEMA) await client.query(statement);
    });
  }

  /** @returns {Promise<pg.Pool>} */
  async function db() {
    ready ??= ensureSchema().catch((error) => {
      ready = undefined;
      throw error;
    });
    await ready;
    return pool;
  }

  /**
   * Creates the account or replaces its password. `name` replaces the stored name when given;
   * `nameIfNew` only names a new account (or one without a name).
   * @param {pg.Pool | pg.PoolClient} q
   * @param {{ email: string, hash: string, name?: string | null, nameIfNew?: string }} row
   */
  async function upsert(q, { email, hash, name = null, nameIfNew = '' }) {
    const { rows } = await q.query(
      `insert into idp.account (id, email, password_hash, name) values ($1, $2, $3, coalesce($4, $5))
       on conflict (email) do update
         set password_hash = excluded.password_hash,
             name = coalesce($4, nullif(idp.account.name, ''), $5),
             updated_at = now()
       returning id, email, name`,
      [randomUUID(), email, hash, name, nameIfNew],
    );
    return rows[0];
  }

  return {
    async findByEmail(email) {
      const { rows } = await (
        await db()
      ).query(`select id, email, name from idp.account where email = $1 and ${USABLE}`, [
        normaliseEmail(email),
      ]);
      return rows[0];
    },
    async findById(id) {
      if (!/^[0-9a-f-]{36}$/i.test(id)) return undefined;
      const { rows } = await (
        await db()
      ).query('select id, email, name from idp.account where id = $1', [id]);
      return rows[0];
    },
    async verifyPassword(account, password) {
      let hash;
      if (account) {
        const { rows } = await (
          await db()
        ).query('select password_hash from idp.account where id = $1', [account.id]);
        hash = rows[0]?.password_hash;
      }
      return checkOrBurn(hash, password);
    },
    async setPassword(email, password, name) {
      const normalised = normaliseEmail(email);
      assertInput(normalised, password);
      const hash = await hashPassword(password);
      return upsert(await db(), { email: normalised, hash, name: name ?? null });
    },
    async createPasswordTicket({ tokenHash, email, name, returnTo, expiresAt }) {
      const q = await db();
      // Tickets a day past their end are of no use to anyone: sweep them as new ones come.
      await q.query("delete from idp.password_ticket where expires_at < now() - interval '1 day'");
      await q.query(
        `insert into idp.password_ticket (token_hash, email, name, return_to, expires_at)
         values ($1, $2, $3, $4, $5)`,
        [tokenHash, normaliseEmail(email), name, returnTo, expiresAt],
      );
    },
    async findPasswordTicket(tokenHash, now) {
      const { rows } = await (
        await db()
      ).query(
        `select email, name, return_to, expires_at from idp.password_ticket
         where token_hash = $1 and used_at is null and expires_at > $2`,
        [tokenHash, now],
      );
      const row = rows[0];
      return (
        row && {
          email: row.email,
          name: row.name,
          returnTo: row.return_to,
          expiresAt: row.expires_at,
        }
      );
    },
    async redeemPasswordTicket(tokenHash, password, now) {
      // Hash first (slow), outside the transaction, so the row lock below is held briefly.
      const problem = newPasswordProblem(password);
      if (problem) throw new Error(`accounts: ${problem}`);
      const hash = await hashPassword(password);
      await db();
      return transaction(async (client) => {
        // The conditional update is the single-use guard: of two racing redeems, the second
        // waits for the first's row lock, then finds used_at set and updates nothing.
        const { rows } = await client.query(
          `update idp.password_ticket set used_at = $2
           where token_hash = $1 and used_at is null and expires_at > $2
           returning email, name, return_to`,
          [tokenHash, now],
        );
        const ticket = rows[0];
        if (!ticket) return undefined;
        const account = await upsert(client, { email: ticket.email, hash, nameIfNew: ticket.name });
        return { account, returnTo: ticket.return_to };
      });
    },
    async close() {
      await pool.end();
    },
  };
}
