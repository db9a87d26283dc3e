// Gives every demo person a password at the identity provider, once: a password someone
// changed in the demo is left alone on the next start.
import { openAccounts } from '../identity-provider/accounts.mjs';
import scenario from './demo-scenario.json' with { type: 'json' };

/** @param {{ env: Record<string, string> }} cfg */
export async function ensureDemoAccounts(cfg) {
  const store = openAccounts({
    databaseUrl: cfg.env.IDP_DATABASE_URL,
    dataDir: cfg.env.LW_DATA_DIR,
  });
  let created = 0;
  try {
    for (const person of scenario.people) {
      if (await store.findByEmail(person.email)) continue;
      await store.setPassword(person.email, scenario.password, person.name);
      created++;
    }
  } finally {
    await store.close();
  }
  return created;
}
