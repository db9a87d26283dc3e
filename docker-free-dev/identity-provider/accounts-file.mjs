// @ts-check
// The JSON-file account store: `accounts.json` and `password-tickets.json` in the data
// folder's `identity-provider/` subfolder. For tests of the fake and runs without a database.
// Files are read on every call (the seed script writes them from another process); writes in
// this process go through one queue, which also makes redeeming a ticket single-use.
import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { assertInput, checkOrBurn, normaliseEmail } from './account-rules.mjs';
import { hashPassword, isCurrentHash, newPasswordProblem } from './password.mjs';

/**
 * @typedef {import('./accounts.mjs').AccountStore} AccountStore
 * @typedef {import('./accounts.mjs').Account} Account
 * @typedef {Account & { passwordHash: string }} StoredAccount
 * @typedef {{ tokenHash: string, email: string, name: string, returnTo: string,
 *   expiresAt: string, usedAt: string | null }} StoredTicket
 */

/**
 * @param {string} file
 * @param {string} key the top-level property holding the list
 */
function jsonList(file, key) {
  return {
    /** @returns {Promise<any[]>} */
    async load() {
      try {
        return JSON.parse(await readFile(file, 'utf8'))[key] ?? [];
      } catch (error) {
        if (/** @type {NodeJS.ErrnoException} */ (error).code === 'ENOENT') return [];
        throw error;
      }
    },
    /** @param {any[]} items */
    async save(items) {
      await mkdir(dirname(file), { recursive: true });
      const temp = `${file}.${process.pid}.tmp`;
      await writeFile(temp, JSON.stringify({ [key]: items }, null, 2) + '\n', { mode: 0o600 });
      await rename(temp, file);
    },
  };
}

/** @param {StoredAccount | undefined} stored @returns {Account | undefined} */
const publicPart = (stored) => stored && { id: stored.id, email: stored.email, name: stored.name };

/** @param {StoredTicket} ticket @param {Date} now */
const live = (ticket, now) => ticket.usedAt === null && new Date(ticket.expiresAt) > now;

/**
 * @param {string} dataDir root data folder (LW_DATA_DIR)
 * @returns {AccountStore}
 */
export function fileAccounts(dataDir) {
  const folder = join(dataDir, 'identity-provider');
  const accountFile = jsonList(join(folder, 'accounts.json'), 'accounts');
  const ticketFile = jsonList(join(folder, 'password-tickets.json'), 'tickets');
  /** @type {() => Promise<StoredAccount[]>} */
  const loadAccounts = accountFile.load;
  /** @type {() => Promise<StoredTicket[]>} */
  const loadTickets = ticketFile.load;

  let queue = Promise.resolve();
  /** @template T @param {() => Promise<T>} fn @returns {Promise<T>} */
  function serially(fn) {
    const run = queue.then(fn);
    queue = run.then(
      () => undefined,
      () => undefined,
    );
    return run;
  }

  /**
   * Creates the account or replaces its password (inside `serially`).
   * @param {{ email: string, passwordHash: string, name?: string, nameIfNew?: string }} row
   */
  async function upsert({ email, passwordHash, name, nameIfNew = '' }) {
    const accounts = await loadAccounts();
    let stored = accounts.find((a) => a.email === email);
    if (stored) {
      stored.passwordHash = passwordHash;
      if (name !== undefined) stored.name = name;
      else if (!stored.name) stored.name = nameIfNew;
    } else {
      stored = { id: randomUUID(), email, name: name ?? nameIfNew, passwordHash };
      accounts.push(stored);
    }
    await accountFile.save(accounts);
    return /** @type {Account} */ (publicPart(stored));
  }

  return {
    async findByEmail(email) {
      const normalised = normaliseEmail(email);
      const stored = (await loadAccounts()).find((a) => a.email === normalised);
      return isCurrentHash(stored?.passwordHash) ? publicPart(stored) : undefined;
    },
    async findById(id) {
      return publicPart((await loadAccounts()).find((a) => a.id === id));
    },
    async verifyPassword(account, password) {
      const stored = account && (await loadAccounts()).find((a) => a.id === account.id);
      return checkOrBurn(stored?.passwordHash, password);
    },
    async setPassword(email, password, name) {
      const normalised = normaliseEmail(email);
      assertInput(normalised, password);
      const passwordHash = await hashPassword(password);
      return serially(() => upsert({ email: normalised, passwordHash, name }));
    },
    async createPasswordTicket({ tokenHash, email, name, returnTo, expiresAt }) {
      await serially(async () => {
        const dayAgo = Date.now() - 24 * 3600 * 1000;
        const tickets = (await loadTickets()).filter((t) => Date.parse(t.expiresAt) >= dayAgo);
        tickets.push({
          tokenHash,
          email: normaliseEmail(email),
          name,
          returnTo,
          expiresAt: expiresAt.toISOString(),
          usedAt: null,
        });
        await ticketFile.save(tickets);
      });
    },
    async findPasswordTicket(tokenHash, now) {
      const ticket = (await loadTickets()).find((t) => t.tokenHash === tokenHash);
      if (!ticket || !live(ticket, now)) return undefined;
      const { email, name, returnTo } = ticket;
      return { email, name, returnTo, expiresAt: new Date(ticket.expiresAt) };
    },
    async redeemPasswordTicket(tokenHash, password, now) {
      const problem = newPasswordProblem(password);
      if (problem) throw new Error(`accounts: ${problem}`);
      const passwordHash = await hashPassword(password);
      return serially(async () => {
        const tickets = await loadTickets();
        const ticket = tickets.find((t) => t.tokenHash === tokenHash);
        if (!ticket || !live(ticket, now)) return undefined;
        ticket.usedAt = now.toISOString();
        await ticketFile.save(tickets);
        const account = await upsert({ email: ticket.email, passwordHash, nameIfNew: ticket.name });
        return { account, returnTo: ticket.returnTo };
      });
    },
    async close() {
      await queue;
    },
  };
}
