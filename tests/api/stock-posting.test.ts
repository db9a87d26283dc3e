import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, withTenant, type Tx } from '@latchwork/shared-db';
import {
  checkLedger,
  postMovements,
  reverseMovement,
  type MovementRequest,
  type PostingActor,
} from '@latchwork/stock-server';
import { demoIds } from './sessions';
import { makeStockJob, stockTestName } from './walker/stock';

// The posting service on its own, inside a firm's transaction (the API tests go through HTTP).
const deps = { db: createDb({ connectionString: process.env['DATABASE_URL'] ?? '', max: 4 }) };
afterAll(() => deps.db.destroy());

let tenantId = '';
let actor: PostingActor;
let jobId = '';
const inFirm = <T>(work: (tx: Tx) => Promise<T>) => withTenant(deps.db, { tenantId }, work);

async function newProduct(tx: Tx, packSize = 1) {
  return tx
    .insertInto('product')
    .values({
      tenantId,
      sku: stockTestName('KIT'),
      name: 'Test two-part adhesive kit',
      kind: 'adhesive',
      attributes: '{}',
      kitComponents: '[]',
      unitOne: 'kit',
      unitOther: 'kits',
      packOne: 'box',
      packOther: 'boxes',
      packSize,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

async function newLocation(tx: Tx, name = stockTestName('Shelf')) {
  return tx
    .insertInto('stockLocation')
    .values({ tenantId, name, kind: 'warehouse' })
    .returning('id')
    .executeTakeFirstOrThrow();
}

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  tenantId = ids.tenant('pennick-flooring').id;
  actor = { userId: ids.user('owner@pennick-flooring.test'), role: 'owner' };
  jobId = await makeStockJob(deps.db, tenantId);
});

describe('postMovements', () => {
  it("books issue 6's worked example at the weighted average (IAS 2.25, arithmetic from memory)", async () => {
    await inFirm(async (tx) => {
      const { id: productId } = await newProduct(tx);
      const { id: shelf } = await newLocation(tx);
      const receipt = (q: number, cost: number): MovementRequest => ({
        kind: 'receipt',
        productId,
        toLocationId: shelf,
        quantity: q,
        unitCostMinor: cost,
      });
      await postMovements(tx, { tenantId }, actor, [receipt(10, 4000), receipt(10, 4600)]);
      const [issued] = await postMovements(tx, { tenantId }, actor, [
        { kind: 'issue', productId, fromLocationId: shelf, quantity: 12, jobId },
      ]);
      expect(issued.valueMinor).toBe(-51600); // cost of issue 516.00
      expect(issued.unitCostMinor).toBe(4300); // 43.00 each
      const state = await tx
        .selectFrom('productCostState')
        .selectAll()
        .where('productId', '=', productId)
        .executeTakeFirstOrThrow();
      expect(state.quantity).toBe('8');
      expect(state.valueMinor).toBe('34400'); // closing 344.00

      // Reversing the issue puts back exactly what left: 20 kits worth 860.00 again.
      await reverseMovement(tx, { tenantId }, actor, issued.id, 'booked to the wrong job');
      const after = await tx
        .selectFrom('productCostState')
        .select(['quantity', 'valueMinor'])
        .where('productId', '=', productId)
        .executeTakeFirstOrThrow();
      expect(after).toEqual({ quantity: '20', valueMinor: '86000' });
      await expect(
        reverseMovement(tx, { tenantId }, actor, issued.id, 'again'),
      ).rejects.toMatchObject({ code: 'conflict' });
      expect(await checkLedger(tx, { tenantId })).toEqual({ balances: [], costs: [] });
    });
  });

  it('refuses to go below zero, naming the product, the place and what is there', async () => {
    await inFirm(async (tx) => {
      const { id: productId } = await newProduct(tx, 24);
      const { id: van } = await newLocation(tx, stockTestName('Van'));
      await postMovements(tx, { tenantId }, actor, [
        { kind: 'receipt', productId, toLocationId: van, quantity: 30, unitCostMinor: 150 },
      ]);
      const refused = postMovements(tx, { tenantId }, actor, [
        { kind: 'issue', productId, fromLocationId: van, quantity: 31, jobId },
      ]);
      await expect(refused).rejects.toMatchObject({
        code: 'conflict',
        message: expect.stringMatching(/1 box \+ 6 kits available, 1 box \+ 7 kits asked for/),
        details: { available: 30, requested: 31, locationId: van },
      });
    });
  });

  it('a transfer to the same place is a 400 naming toLocationId', async () => {
    await inFirm(async (tx) => {
      const { id: productId } = await newProduct(tx);
      const { id: shelf } = await newLocation(tx);
      await expect(
        postMovements(tx, { tenantId }, actor, [
          { kind: 'transfer', productId, fromLocationId: shelf, toLocationId: shelf, quantity: 1 },
        ]),
      ).rejects.toMatchObject({
        code: 'validation_failed',
        details: { problems: [expect.objectContaining({ path: 'movements.0.toLocationId' })] },
      });
    });
  });

  it('goes below zero only where the firm allows it, costed at the last average', async () => {
    await inFirm(async (tx) => {
      // Inside this transaction only: other tests of firm B never see the setting.
      await tx
        .insertInto('stockSetting')
        .values({ tenantId, allowNegativeStock: true })
        .onConflict((oc) => oc.column('tenantId').doUpdateSet({ allowNegativeStock: true }))
        .execute();
      const { id: productId } = await newProduct(tx);
      const { id: van } = await newLocation(tx, stockTestName('Van'));
      await postMovements(tx, { tenantId }, actor, [
        { kind: 'receipt', productId, toLocationId: van, quantity: 2, unitCostMinor: 4000 },
      ]);
      const [issued] = await postMovements(tx, { tenantId }, actor, [
        { kind: 'issue', productId, fromLocationId: van, quantity: 3, jobId },
      ]);
      // 2 at 40.00 plus 1 short at the last average 40.00 (arithmetic).
      expect(issued.valueMinor).toBe(-12000);
      const [balance] = await tx
        .selectFrom('stockBalance')
        .select('quantity')
        .where('productId', '=', productId)
        .execute();
      expect(balance.quantity).toBe('-1');
      // The receipt that fills the hole at 46.00 settles the 6.00 difference (arithmetic).
      const [receipt] = await postMovements(tx, { tenantId }, actor, [
        { kind: 'receipt', productId, toLocationId: van, quantity: 1, unitCostMinor: 4600 },
      ]);
      expect(receipt.settlementMinor).toBe(600);
      expect(await checkLedger(tx, { tenantId })).toEqual({ balances: [], costs: [] });
      // Back to the default before the transaction ends, so no other test sees it.
      await tx
        .updateTable('stockSetting')
        .set({ allowNegativeStock: false })
        .where('tenantId', '=', tenantId)
        .execute();
    });
  });
});
