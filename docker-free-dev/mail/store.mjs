// @ts-check
// Where the mail fake keeps what it receives: one JSON file per message (and the raw .eml
// beside it) in <dataDir>/mail/, with an in-memory index loaded at start.
import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';

/**
 * @typedef {{ address: string, name: string }} Address
 * @typedef {{ filename: string | null, contentType: string, size: number,
 *   contentId: string | null, checksum: string | null }} AttachmentInfo
 * @typedef {object} StoredMessage
 * @property {string} id
 * @property {string} receivedAt ISO time the fake received it (sort key)
 * @property {string | null} date the message's own Date header, ISO
 * @property {string | null} messageId
 * @property {Address | null} from
 * @property {Address[]} to
 * @property {Address[]} cc
 * @property {Address[]} bcc envelope recipients that appear in no header
 * @property {{ from: string | null, to: string[] }} envelope SMTP MAIL FROM / RCPT TO
 * @property {string} subject
 * @property {string | null} text
 * @property {string | null} html
 * @property {AttachmentInfo[]} attachments metadata only
 * @property {number} size raw size in bytes
 */

let lastTime = 0;
/** Time-ordered ids: sortable text, strictly increasing within a run. */
export function newId() {
  lastTime = Math.max(Date.now(), lastTime + 1);
  return `${lastTime.toString(36).padStart(9, '0')}-${randomBytes(5).toString('hex')}`;
}

/** @param {string} dir */
export async function openMailStore(dir) {
  await mkdir(dir, { recursive: true });
  /** @type {Map<string, StoredMessage>} */
  const messages = new Map();
  for (const name of await readdir(dir)) {
    if (!name.endsWith('.json')) continue;
    try {
      const message = JSON.parse(await readFile(join(dir, name), 'utf8'));
      messages.set(message.id, message);
    } catch {
      // a half-written file from a crash: skip it
    }
  }

  const isId = (/** @type {string} */ id) => /^[0-9a-z]+-[0-9a-f]+$/.test(id);

  return {
    /** @param {StoredMessage} message @param {Buffer} raw */
    async add(message, raw) {
      await writeFile(join(dir, `${message.id}.eml`), raw);
      const temp = join(dir, `${message.id}.json.tmp`);
      await writeFile(temp, JSON.stringify(message, null, 2));
      await rename(temp, join(dir, `${message.id}.json`));
      messages.set(message.id, message);
    },
    /**
     * Newest first; `to` matches any recipient (To, Cc, or envelope), case-insensitively.
     * @param {{ to?: string }} [filter]
     */
    list({ to } = {}) {
      const wanted = to?.trim().toLowerCase();
      const all = [...messages.values()].sort((a, b) =>
        a.receivedAt === b.receivedAt
          ? a.id < b.id
            ? 1
            : -1
          : a.receivedAt < b.receivedAt
            ? 1
            : -1,
      );
      if (!wanted) return all;
      return all.filter((m) =>
        [...m.to, ...m.cc, ...m.bcc]
          .map((a) => a.address)
          .concat(m.envelope.to)
          .some((address) => address.toLowerCase() === wanted),
      );
    },
    /** @param {string} id */
    get(id) {
      return messages.get(id);
    },
    /** @param {string} id */
    async raw(id) {
      if (!isId(id) || !messages.has(id)) return undefined;
      return readFile(join(dir, `${id}.eml`));
    },
    /** @param {string} id */
    async remove(id) {
      if (!isId(id) || !messages.delete(id)) return false;
      await rm(join(dir, `${id}.json`), { force: true });
      await rm(join(dir, `${id}.eml`), { force: true });
      return true;
    },
    async clear() {
      const count = messages.size;
      messages.clear();
      for (const name of await readdir(dir)) {
        if (/\.(json|eml|tmp)$/.test(name)) await rm(join(dir, name), { force: true });
      }
      return count;
    },
  };
}

/** @typedef {Awaited<ReturnType<typeof openMailStore>>} MailStore */
