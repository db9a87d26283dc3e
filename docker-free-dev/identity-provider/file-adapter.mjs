// @ts-check
// A storage adapter for oidc-provider that keeps its artefacts (sessions, grants, codes,
// tokens, interactions) in memory and mirrors them to one JSON file, so that stopping and
// starting the demo does not sign everybody out of the identity provider.
//
// One process owns the file (the fake); look-ups by uid, user code and grant scan the map,
// which is fine at a fake's scale.
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

/**
 * @typedef {{ payload: Record<string, any>, expiresAt: number | null }} Entry
 * @typedef {{ adapter: (model: string) => object, flush(): void }} FileStore
 */

/**
 * @param {string} file
 * @returns {FileStore}
 */
export function createFileStore(file) {
  /** @type {Map<string, Entry>} */
  const entries = new Map();
  try {
    const saved = JSON.parse(readFileSync(file, 'utf8'));
    for (const [key, entry] of Object.entries(saved)) entries.set(key, entry);
  } catch {
    // no file yet, or a damaged one: start empty
  }

  /** @type {NodeJS.Timeout | undefined} */
  let timer;
  function flush() {
    if (timer) clearTimeout(timer);
    timer = undefined;
    const now = Date.now();
    for (const [key, entry] of entries) {
      if (entry.expiresAt !== null && entry.expiresAt <= now) entries.delete(key);
    }
    mkdirSync(dirname(file), { recursive: true });
    const temp = `${file}.tmp`;
    writeFileSync(temp, JSON.stringify(Object.fromEntries(entries)), { mode: 0o600 });
    renameSync(temp, file);
  }
  function scheduleFlush() {
    timer ??= setTimeout(flush, 100);
    timer.unref?.();
  }

  /** @param {string} key */
  function live(key) {
    const entry = entries.get(key);
    if (!entry) return undefined;
    if (entry.expiresAt !== null && entry.expiresAt <= Date.now()) {
      entries.delete(key);
      return undefined;
    }
    return entry;
  }
  /** @param {(entry: Entry) => boolean} predicate */
  function findWhere(predicate) {
    for (const [key] of entries) {
      const entry = live(key);
      if (entry && predicate(entry)) return entry.payload;
    }
    return undefined;
  }

  /** @param {string} model */
  function adapter(model) {
    /** @param {string} id */
    const key = (id) => `${model}:${id}`;
    return {
      /** @param {string} id @param {Record<string, any>} payload @param {number} [expiresIn] */
      async upsert(id, payload, expiresIn) {
        const expiresAt = typeof expiresIn === 'number' ? Date.now() + expiresIn * 1000 : null;
        entries.set(key(id), { payload, expiresAt });
        scheduleFlush();
      },
      /** @param {string} id */
      async find(id) {
        return live(key(id))?.payload;
      },
      /** @param {string} uid */
      async findByUid(uid) {
        const prefix = `${model}:`;
        for (const [k] of entries) {
          if (!k.startsWith(prefix)) continue;
          const entry = live(k);
          if (entry?.payload['uid'] === uid) return entry.payload;
        }
        return undefined;
      },
      /** @param {string} userCode */
      async findByUserCode(userCode) {
        return findWhere(
          (entry) => entry.payload['kind'] === model && entry.payload['userCode'] === userCode,
        );
      },
      /** @param {string} id */
      async consume(id) {
        const entry = live(key(id));
        if (entry) {
          entry.payload['consumed'] = Math.floor(Date.now() / 1000);
          scheduleFlush();
        }
      },
      /** @param {string} id */
      async destroy(id) {
        entries.delete(key(id));
        scheduleFlush();
      },
      /** @param {string} grantId */
      async revokeByGrantId(grantId) {
        for (const [k, entry] of entries) {
          if (entry.payload['grantId'] === grantId && !k.startsWith('Grant:')) entries.delete(k);
        }
        scheduleFlush();
      },
    };
  }

  return { adapter, flush };
}
