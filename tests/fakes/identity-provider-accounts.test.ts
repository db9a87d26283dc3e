// The identity-provider fake's account stores (JSON file, and PostgreSQL when
// LW_TEST_IDP_DATABASE_URL is set, as `npm test` does), and the argon2id hashes they keep.
import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openAccounts, setPassword } from '../../docker-free-dev/identity-provider/accounts.mjs';
import { must, tempDataDir } from './support';

const EMAIL = 'owner@harbourfloors.test';
const PASSWORD = 'tiles-and-trims-42';

/**
 * Reads the parameters of a PHC-format argon2 string, whatever their order:
 * `$argon2id$v=19$m=19456,t=2,p=1$<salt>$<hash>` (PHC string format, as written by the
 * reference argon2 implementation).
 */
function argon2Parameters(hash: string) {
  const [, algorithm, version, params, salt, key] = hash.split('$');
  const values = Object.fromEntries(
    (params ?? '').split(',').map((pair) => {
      const [name, value] = pair.split('=');
      return [name, Number(value)];
    }),
  );
  return { algorithm, version, m: values['m'], t: values['t'], p: values['p'], salt, key };
}

/** OWASP Password Storage Cheat Sheet, Argon2id: at least m = 19 MiB (19456 KiB), t = 2, p = 1. */
function expectOwaspMinimum(hash: string) {
  const found = argon2Parameters(hash);
  expect(found.algorithm).toBe('argon2id');
  expect(found.version).toBe('v=19');
  expect(found.m).toBeGreaterThanOrEqual(19 * 1024);
  expect(found.t).toBeGreaterThanOrEqual(2);
  expect(found.p).toBeGreaterThanOrEqual(1);
  // 16-byte salt and 32-byte key (the library's defaults), base64 without padding
  expect(Buffer.from(must(found.salt, 'a salt'), 'base64').length).toBeGreaterThanOrEqual(16);
  expect(Buffer.from(must(found.key, 'a key'), 'base64').length).toBeGreaterThanOrEqual(32);
}

describe('argon2 parameter reader', () => {
  it('refuses hashes below the OWASP minimum (the check can fail)', () => {
    const weak = '$argon2id$v=19$m=4096,t=3,p=1$c2FsdHNhbHRzYWx0c2FsdA$' + 'a'.repeat(43);
    expect(() => expectOwaspMinimum(weak)).toThrow();
    const notArgon = '$argon2i$v=19$m=19456,t=2,p=1$c2FsdHNhbHRzYWx0c2FsdA$' + 'a'.repeat(43);
    expect(() => expectOwaspMinimum(notArgon)).toThrow();
  });
});

describe('identity-provider accounts (JSON file)', () => {
  let data: Awaited<ReturnType<typeof tempDataDir>>;
  beforeAll(async () => {
    data = await tempDataDir('idp-accounts');
    await setPassword(EMAIL, PASSWORD, 'Hana Harbour', { dataDir: data.dir });
  });
  afterAll(() => data?.remove());

  it('finds by e-mail and id, checks passwords, and updates on setPassword', async () => {
    const accounts = openAccounts({ dataDir: data.dir });
    try {
      const account = must(await accounts.findByEmail(` ${EMAIL.toUpperCase()} `), 'the account');
      expect(account).toMatchObject({ email: EMAIL, name: 'Hana Harbour' });
      expect(account).not.toHaveProperty('passwordHash');
      expect(await accounts.findById(account.id)).toEqual(account);
      expect(await accounts.verifyPassword(account, PASSWORD)).toBe(true);
      expect(await accounts.verifyPassword(account, 'nope-nope-nope')).toBe(false);
      expect(await accounts.verifyPassword(undefined, PASSWORD)).toBe(false);

      const updated = await accounts.setPassword(EMAIL, 'a-new-password-1');
      expect(updated.id).toBe(account.id);
      expect(updated.name).toBe('Hana Harbour');
      expect(await accounts.verifyPassword(updated, 'a-new-password-1')).toBe(true);
      await accounts.setPassword(EMAIL, PASSWORD);
      await expect(accounts.setPassword('not-an-email', 'long-enough-1')).rejects.toThrow();
      await expect(accounts.setPassword(EMAIL, 'eleven-char')).rejects.toThrow(/12/);
    } finally {
      await accounts.close();
    }
  });

  it('stores argon2id at no less than the OWASP minimum, with a fresh salt each time', async () => {
    const file = join(data.dir, 'identity-provider', 'accounts.json');
    const read = async () =>
      must(
        JSON.parse(await readFile(file, 'utf8')).accounts.find(
          (a: { email: string }) => a.email === EMAIL,
        ),
        'the stored account',
      ).passwordHash as string;
    const first = await read();
    expectOwaspMinimum(first);
    await setPassword(EMAIL, PASSWORD, undefined, { dataDir: data.dir });
    const second = await read();
    expectOwaspMinimum(second);
    expect(argon2Parameters(second).salt).not.toBe(argon2Parameters(first).salt);
  });

  it('treats an account left with an old scrypt hash as having no password', async () => {
    const file = join(data.dir, 'identity-provider', 'accounts.json');
    const saved = JSON.parse(await readFile(file, 'utf8'));
    const legacy = 'old@harbourfloors.test';
    saved.accounts.push({
      id: '5f0c7c1e-7d1a-4a56-9f55-0d1c2b3a4e5f',
      email: legacy,
      name: 'Olly Old',
      passwordHash: 'scrypt$N=32768,r=8,p=1$c2FsdA$a2V5',
    });
    await writeFile(file, JSON.stringify(saved));
    const accounts = openAccounts({ dataDir: data.dir });
    try {
      expect(await accounts.findByEmail(legacy)).toBeUndefined();
      // setting it again keeps the account (same id, same subject at the app)
      const reset = await accounts.setPassword(legacy, 'a-fresh-password-9');
      expect(reset).toMatchObject({ id: '5f0c7c1e-7d1a-4a56-9f55-0d1c2b3a4e5f', name: 'Olly Old' });
      expect(await accounts.verifyPassword(reset, 'a-fresh-password-9')).toBe(true);
    } finally {
      await accounts.close();
    }
  });
});

// The PostgreSQL store is what the demo uses. `npm test` points this at its database with
// LW_TEST_IDP_DATABASE_URL (a role that may create the `idp` schema); without it, it is skipped.
const databaseUrl = process.env['LW_TEST_IDP_DATABASE_URL'];
describe.runIf(databaseUrl)('identity-provider accounts (PostgreSQL)', () => {
  const email = `pg-${Date.now().toString(36)}@accounts.test`;

  const legacy = `old-${Date.now().toString(36)}@accounts.test`;

  afterAll(async () => {
    const pool = new pg.Pool({ connectionString: databaseUrl });
    await pool.query('delete from idp.account where email = any($1)', [[email, legacy]]);
    await pool.end();
  });

  it('creates the schema if missing, stores an argon2id hash and checks passwords', async () => {
    const created = await setPassword(email.toUpperCase(), 'pg-password-1', 'Pat Postgres', {
      databaseUrl,
    });
    expect(created).toMatchObject({ email, name: 'Pat Postgres' });
    const accounts = openAccounts({ databaseUrl });
    try {
      const account = must(await accounts.findByEmail(email), 'the account');
      expect(await accounts.findById(account.id)).toEqual(account);
      expect(await accounts.verifyPassword(account, 'pg-password-1')).toBe(true);
      expect(await accounts.verifyPassword(account, 'wrong-password')).toBe(false);
      const updated = await accounts.setPassword(email, 'pg-password-2');
      expect(updated).toEqual(account);
      expect(await accounts.verifyPassword(account, 'pg-password-2')).toBe(true);
    } finally {
      await accounts.close();
    }
    const pool = new pg.Pool({ connectionString: databaseUrl });
    const { rows } = await pool.query('select password_hash from idp.account where email = $1', [
      email,
    ]);
    await pool.end();
    expectOwaspMinimum(rows[0].password_hash);
  });

  it('treats an account left with an old scrypt hash as having no password', async () => {
    const pool = new pg.Pool({ connectionString: databaseUrl });
    const id = '8d2f4b6a-1c3e-4f5a-9b7c-2e4d6f8a0b1c';
    await pool.query(
      `insert into idp.account (id, email, password_hash, name) values ($1, $2, $3, 'Olly Old')`,
      [id, legacy, 'scrypt$N=32768,r=8,p=1$c2FsdA$a2V5'],
    );
    await pool.end();
    const accounts = openAccounts({ databaseUrl });
    try {
      expect(await accounts.findByEmail(legacy)).toBeUndefined();
      expect(await accounts.findById(id)).toMatchObject({ email: legacy });
      const reset = await accounts.setPassword(legacy, 'a-fresh-password-9');
      expect(reset).toEqual({ id, email: legacy, name: 'Olly Old' });
      expect(await accounts.findByEmail(legacy)).toEqual(reset);
    } finally {
      await accounts.close();
    }
  });
});
