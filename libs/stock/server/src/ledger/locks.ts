/**
 * Row locks of a posting, always taken in the same order — cost states by product id, then
 * balances by (product, batch, location) — so two postings touching the same rows queue
 * instead of deadlocking. A missing row is first inserted (`on conflict do nothing`) so that
 * there is always a row to lock: two postings creating the same balance still serialise.
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import type { AverageCostState } from '@latchwork/stock-domain';
import type { MovementRequest } from './movement-request';

const NO_BATCH = '-';

/** The balance key of a product, batch (or none) and location. */
export const keyOf = (productId: string, batchId: string | null | undefined, locationId: string) =>
  `${productId}|${batchId ?? NO_BATCH}|${locationId}`;

function parseKey(key: string) {
  const [productId, batch, locationId] = key.split('|');
  return { productId, batchId: batch === NO_BATCH ? null : batch, locationId };
}

/** Locks (creating when missing) each product's cost state; returns them by product id. */
export async function lockCostStates(
  tx: Tx,
  scope: TenantScope,
  movements: readonly Pick<MovementRequest, 'productId'>[],
): Promise<Map<string, AverageCostState>> {
  const productIds = [...new Set(movements.map((m) => m.productId))].sort();
  const states = new Map<string, AverageCostState>();
  for (const productId of productIds) {
    await tx
      .insertInto('productCostState')
      .values({ tenantId: scope.tenantId, productId })
      .onConflict((oc) => oc.columns(['tenantId', 'productId']).doNothing())
      .execute();
    const row = await tx
      .selectFrom('productCostState')
      .select(['quantity', 'valueMinor', 'lastUnitCostMinor'])
      .where('tenantId', '=', scope.tenantId)
      .where('productId', '=', productId)
      .forUpdate()
      .executeTakeFirstOrThrow();
    states.set(productId, {
      quantity: Number(row.quantity),
      value: Number(row.valueMinor),
      lastUnitCost: row.lastUnitCostMinor === null ? null : Number(row.lastUnitCostMinor),
    });
  }
  return states;
}

/** Locks (creating when missing) every balance the movements touch; quantities by key. */
export async function lockBalances(
  tx: Tx,
  scope: TenantScope,
  movements: readonly MovementRequest[],
): Promise<Map<string, number>> {
  const keys = new Set<string>();
  for (const m of movements)
    for (const location of [m.fromLocationId, m.toLocationId])
      if (location) keys.add(keyOf(m.productId, m.batchId, location));
  const balances = new Map<string, number>();
  for (const key of [...keys].sort()) {
    const k = parseKey(key);
    await tx
      .insertInto('stockBalance')
      .values({ tenantId: scope.tenantId, ...k })
      .onConflict((oc) =>
        oc.columns(['tenantId', 'productId', 'batchId', 'locationId']).doNothing(),
      )
      .execute();
    const row = await tx
      .selectFrom('stockBalance')
      .select('quantity')
      .where('tenantId', '=', scope.tenantId)
      .where('productId', '=', k.productId)
      .where((eb) =>
        k.batchId === null ? eb('batchId', 'is', null) : eb('batchId', '=', k.batchId),
      )
      .where('locationId', '=', k.locationId)
      .forUpdate()
      .executeTakeFirstOrThrow();
    balances.set(key, Number(row.quantity));
  }
  return balances;
}

/** Writes the locked balances back. */
export async function writeBalances(
  tx: Tx,
  scope: TenantScope,
  balances: ReadonlyMap<string, number>,
): Promise<void> {
  for (const [key, quantity] of balances) {
    const k = parseKey(key);
    await tx
      .updateTable('stockBalance')
      .set({ quantity, updatedAt: new Date() })
      .where('tenantId', '=', scope.tenantId)
      .where('productId', '=', k.productId)
      .where((eb) =>
        k.batchId === null ? eb('batchId', 'is', null) : eb('batchId', '=', k.batchId),
      )
      .where('locationId', '=', k.locationId)
      .execute();
  }
}

/** Writes the locked cost states back. */
export async function writeCostStates(
  tx: Tx,
  scope: TenantScope,
  states: ReadonlyMap<string, AverageCostState>,
): Promise<void> {
  for (const [productId, s] of states)
    await tx
      .updateTable('productCostState')
      .set({
        quantity: s.quantity,
        valueMinor: s.value,
        lastUnitCostMinor: s.lastUnitCost,
        updatedAt: new Date(),
      })
      .where('tenantId', '=', scope.tenantId)
      .where('productId', '=', productId)
      .execute();
}
