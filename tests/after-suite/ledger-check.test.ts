// Runs after every other test of `npm test` (tests/run-all.mjs): whatever the API, worker and
// browser tests did to stock in any firm, each firm's balance summary and cost state must
// still equal what its ledger adds up to.
import { afterAll, describe, expect, it } from 'vitest';
import { createDb, withTenant } from '@latchwork/shared-db';
import { checkLedger } from '@latchwork/stock-server';
import { stackEnv } from '../support/stack';

const db = createDb({ connectionString: stackEnv('DATABASE_URL'), max: 2 });
afterAll(() => db.destroy());

describe('after the whole suite', () => {
  it('finds no difference between any firm’s stock summaries and its ledger', async () => {
    const firms = await db.selectFrom('tenant').select(['id', 'slug']).execute();
    const movements: number[] = [];
    const differences: string[] = [];
    for (const firm of firms) {
      await withTenant(db, { tenantId: firm.id }, async (tx) => {
        const count = await tx
          .selectFrom('stockMovement')
          .select((eb) => eb.fn.countAll<string>().as('n'))
          .executeTakeFirstOrThrow();
        movements.push(Number(count.n));
        const check = await checkLedger(tx, { tenantId: firm.id });
        for (const d of [...check.balances, ...check.costs])
          differences.push(`${firm.slug}: ${JSON.stringify(d)}`);
      });
    }
    console.log(
      `ledger check: ${firms.length} firms, ${movements.reduce((a, b) => a + b, 0)} movements, ${differences.length} differences`,
    );
    // The suite must actually have booked stock, or this check proves nothing.
    expect(movements.reduce((a, b) => a + b, 0)).toBeGreaterThan(100);
    expect(differences).toEqual([]);
  });
});
