/**
 * The variance of a count, line by line. What should have been there when a line was counted
 * is the balance now minus what moved in or out of that product × batch × location after the
 * counter entered it — the same figure as the snapshot plus the movements booked between
 * the count's start and that moment, but read from the balance the ledger keeps, so a
 * movement committed while the snapshot was taken cannot slip between the two. A delivery or
 * an issue during the count is therefore not a variance. The value is at the product's
 * weighted-average cost; the domain's countVariance judges approval.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { countVariance, type CountVariance } from '@latchwork/stock-domain';
import { keyOf } from '../ledger';
import { lockBalances, lockCostStates } from '../ledger/locks';
import type { ControlSettings } from '../reorder/control-settings';
import type { CountHeader, CountLine } from './count.repository';

/** One line's figures, as review shows them and posting books them. */
export interface LineVariance {
  lineId: string;
  expectedAtStart: number;
  movementsDuring: number;
  expected: number;
  counted: number;
  variance: number;
  unitCostMinor: number;
  varianceValueMinor: number;
  overLineThreshold: boolean;
}

/** The whole count: every line, the net and gross values, and whether the owner must approve. */
export interface CountEvaluation {
  lines: LineVariance[];
  netValueMinor: number;
  grossValueMinor: number;
  needsApproval: boolean;
  thresholdMinor: number;
  lineThresholdMinor: number | null;
}

/** Net quantity moved in (+) or out (−) of each line's place after the line was counted. */
async function movedSinceCounted(
  tx: Tx,
  scope: TenantScope,
  countId: string,
): Promise<Map<string, number>> {
  const t = scope.tenantId;
  const { rows } = await sql<{ lineId: string; moved: string }>`
    select cl.id as line_id,
      coalesce(sum(case when m.to_location_id = c.location_id then m.quantity
                        else -m.quantity end), 0)::text as moved
    from stock_count_line cl
    join stock_count c on c.tenant_id = cl.tenant_id and c.id = cl.count_id
    left join stock_movement m on m.tenant_id = cl.tenant_id and m.product_id = cl.product_id
      and m.batch_id is not distinct from cl.batch_id
      and (m.to_location_id = c.location_id or m.from_location_id = c.location_id)
      and m.at > cl.counted_at
    where cl.tenant_id = ${t} and cl.count_id = ${countId}
    group by cl.id`.execute(tx);
  return new Map(rows.map((r) => [r.lineId, Number(r.moved)]));
}

/** Balances of the lines' places now; with `lock`, locked as a posting locks them. */
async function balancesNow(
  tx: Tx,
  scope: TenantScope,
  count: CountHeader,
  lines: readonly CountLine[],
  lock: boolean,
): Promise<Map<string, number>> {
  const places = lines.map((l) => ({
    kind: 'count_correction' as const,
    productId: l.productId,
    batchId: l.batchId,
    fromLocationId: count.locationId,
    quantity: 0,
  }));
  if (lock) {
    // Cost states first, then balances: the order postMovements takes them in.
    await lockCostStates(tx, scope, places);
    return lockBalances(tx, scope, places);
  }
  const rows = await tx
    .selectFrom('stockBalance')
    .select(['productId', 'batchId', 'quantity'])
    .where('tenantId', '=', scope.tenantId)
    .where('locationId', '=', count.locationId)
    .where(
      'productId',
      'in',
      lines.map((l) => l.productId),
    )
    .execute();
  return new Map(
    rows.map((r) => [keyOf(r.productId, r.batchId, count.locationId), Number(r.quantity)]),
  );
}

/** Evaluates a fully counted count; `lock` when posting follows in the same transaction. */
export async function evaluateCount(
  tx: Tx,
  scope: TenantScope,
  count: CountHeader,
  lines: readonly CountLine[],
  settings: ControlSettings,
  lock: boolean,
): Promise<CountEvaluation> {
  const counted = lines.filter((l) => l.counted !== null);
  const balances = await balancesNow(tx, scope, count, counted, lock);
  const moved = await movedSinceCounted(tx, scope, count.id);
  const inputs = counted.map((l) => {
    const now = balances.get(keyOf(l.productId, l.batchId, count.locationId)) ?? 0;
    const whenCounted = now - (moved.get(l.id) ?? 0);
    return {
      productId: l.productId,
      batchCode: l.batchCode,
      expectedAtStart: l.expectedAtStart,
      movementsDuring: whenCounted - l.expectedAtStart,
      counted: l.counted as number,
      unitCost: l.product.averageCostMinor,
      decimals: l.product.decimals,
    };
  });
  const result: CountVariance = countVariance(inputs, {
    gross: settings.countApprovalGrossMinor,
    perLine: settings.countApprovalLineMinor ?? undefined,
  });
  return {
    lines: result.lines.map((r, i) => ({
      lineId: counted[i].id,
      expectedAtStart: inputs[i].expectedAtStart,
      movementsDuring: inputs[i].movementsDuring,
      expected: r.expected,
      counted: r.counted,
      variance: r.variance,
      unitCostMinor: inputs[i].unitCost,
      varianceValueMinor: r.varianceValue,
      overLineThreshold: r.overLineThreshold,
    })),
    netValueMinor: result.netValue,
    grossValueMinor: result.grossValue,
    needsApproval: result.needsApproval,
    thresholdMinor: settings.countApprovalGrossMinor,
    lineThresholdMinor: settings.countApprovalLineMinor,
  };
}
