/**
 * The reorder run: the stock domain's reorderSuggestion for every product, fed from the
 * ledger, reservations and open orders (reorder-data.ts), then one draft purchase order per
 * preferred supplier for the products at or below their reorder point. A product already on
 * an open order (draft, sent or part received) is left alone, so running twice — the nightly
 * job and the button — never orders the same thing twice; runs of one firm queue behind a
 * transaction-level advisory lock.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import {
  dailyDemandSeries,
  packsToCover,
  reorderSuggestion,
  type ReorderSuggestion,
} from '@latchwork/stock-domain';
import { createPurchaseOrder } from '../purchasing/po.repository';
import { controlSettings, type ControlSettings } from './control-settings';
import { loadReorderFacts, type ReorderCandidate, type ReorderFacts } from './reorder-data';

/** One product's suggestion, and whether the run may order it. */
export interface ProductSuggestion extends ReorderSuggestion {
  productId: string;
  sku: string;
  name: string;
  supplierId: string | null;
  supplierName: string | null;
  onHand: number;
  onOrder: number;
  reserved: number;
  unitCostMinor: number;
  /** Why the run does not order it even though `order` says so. */
  blocked: 'no-supplier' | 'on-open-order' | 'no-cost' | null;
}

/** The firm's stock settings the run uses (defaults as the ledger's migration sets them). */
async function stockPolicy(tx: Tx, scope: TenantScope) {
  const row = await tx
    .selectFrom('stockSetting')
    .select(['defaultServiceLevelBp', 'holdingCostRateBp'])
    .where('tenantId', '=', scope.tenantId)
    .executeTakeFirst();
  return row ?? { defaultServiceLevelBp: 9500, holdingCostRateBp: 2500 };
}

const shiftDays = (iso: string, days: number) =>
  new Date(Date.parse(`${iso}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

/** Raises an order to the product's minimum order quantity, in whole packs. */
function withMinimum(c: ReorderCandidate, s: ReorderSuggestion, pack: number): ReorderSuggestion {
  if (!s.order || c.minOrderQuantity === null || s.quantity >= c.minOrderQuantity) return s;
  const packs = packsToCover(c.minOrderQuantity, pack);
  return {
    ...s,
    packs,
    quantity: packs * pack,
    reasons: [
      ...s.reasons,
      {
        code: 'rounded-up-to-packs',
        message: `Raised to the supplier's minimum order of ${c.minOrderQuantity}.`,
      },
    ],
  };
}

/** Every product's suggestion for `today` (ISO date). */
export function suggestAll(
  facts: ReorderFacts,
  control: ControlSettings,
  policy: { defaultServiceLevelBp: number; holdingCostRateBp: number },
  from: string,
  to: string,
): ProductSuggestion[] {
  return facts.candidates.map((c) => {
    const pack = c.roundToPacks ? c.packSize : 1;
    const holding = (c.unitCostMinor * policy.holdingCostRateBp) / 10000;
    const position = {
      onHand: facts.onHand.get(c.id) ?? 0,
      onOrder: facts.onOrder.get(c.id) ?? 0,
      reservedWithinLeadTime: facts.reserved.get(c.id) ?? 0,
    };
    const history = dailyDemandSeries(facts.demand.get(c.id) ?? [], from, to);
    const raw = reorderSuggestion(
      {
        packSize: pack,
        decimals: c.decimals,
        leadTimeDays: c.leadTimeDays,
        shelfLifeDays: c.shelfLifeDays,
        orderCost: c.supplierOrderCostMinor ?? control.defaultOrderCostMinor,
        // A product without any cost cannot be weighed by EOQ; it is listed, not ordered.
        holdingCostPerUnitYear: holding > 0 ? holding : 1,
      },
      position,
      history,
      { serviceLevel: (c.serviceLevelBp ?? policy.defaultServiceLevelBp) / 10000 },
    );
    const s = withMinimum(c, raw, pack);
    const blocked = !s.order
      ? null
      : facts.onOpenOrder.has(c.id)
        ? 'on-open-order'
        : !c.supplierId
          ? 'no-supplier'
          : c.unitCostMinor <= 0
            ? 'no-cost'
            : null;
    return {
      ...s,
      productId: c.id,
      sku: c.sku,
      name: c.name,
      supplierId: c.supplierId,
      supplierName: c.supplierName,
      onHand: position.onHand,
      onOrder: position.onOrder,
      reserved: position.reservedWithinLeadTime,
      unitCostMinor: c.unitCostMinor,
      blocked,
    };
  });
}

/** Options of a run. */
export interface ReorderOptions {
  /** ISO date the run is for; the database's current date when left out. */
  today?: string;
  /** Only compute: create no orders. */
  dryRun?: boolean;
}

/** The run's outcome: every suggestion and the draft orders it created. */
export interface ReorderResult {
  today: string;
  window: { from: string; to: string };
  suggestions: ProductSuggestion[];
  created: { id: string; reference: string; supplierId: string; lines: number }[];
}

/** The delivery place of the run's orders: the setting, else the first warehouse by name. */
async function deliveryPlace(tx: Tx, scope: TenantScope, control: ControlSettings) {
  if (control.deliveryLocationId) return control.deliveryLocationId;
  const first = await tx
    .selectFrom('stockLocation')
    .select('id')
    .where('tenantId', '=', scope.tenantId)
    .where('kind', '=', 'warehouse')
    .where('active', '=', true)
    .orderBy(sql`lower(name)`)
    .executeTakeFirst();
  return first?.id ?? null;
}

/** Runs the reorder for the firm inside the caller's transaction. */
export async function runReorder(
  tx: Tx,
  scope: TenantScope,
  userId: string | null,
  options: ReorderOptions = {},
): Promise<ReorderResult> {
  await sql`select pg_advisory_xact_lock(hashtext(${`reorder:${scope.tenantId}`}))`.execute(tx);
  const today =
    options.today ??
    (await sql<{ d: string }>`select current_date::text as d`.execute(tx)).rows[0].d;
  const control = await controlSettings(tx, scope);
  // The window ends yesterday: today's issues are not all booked yet.
  const to = shiftDays(today, -1);
  const from = shiftDays(today, -control.demandWindowDays);
  const facts = await loadReorderFacts(tx, scope, today, from, to);
  const suggestions = suggestAll(facts, control, await stockPolicy(tx, scope), from, to);
  const created: ReorderResult['created'] = [];
  if (!options.dryRun) {
    const bySupplier = new Map<string, ProductSuggestion[]>();
    for (const s of suggestions.filter((x) => x.order && !x.blocked && x.supplierId))
      bySupplier.set(s.supplierId as string, [
        ...(bySupplier.get(s.supplierId as string) ?? []),
        s,
      ]);
    const deliveryLocationId = bySupplier.size > 0 ? await deliveryPlace(tx, scope, control) : null;
    for (const [supplierId, lines] of bySupplier) {
      const lead = Math.max(
        ...facts.candidates
          .filter((c) => lines.some((l) => l.productId === c.id))
          .map((c) => c.leadTimeDays),
      );
      const id = await createPurchaseOrder(tx, scope, userId, {
        supplierId,
        deliveryLocationId,
        expectedOn: shiftDays(today, lead),
        notes: '',
        source: 'reorder',
        lines: lines.map((l) => ({
          productId: l.productId,
          quantity: l.quantity,
          unitCostMinor: l.unitCostMinor,
          note: l.reasons.map((r) => r.message).join(' '),
        })),
      });
      const row = await tx
        .selectFrom('purchaseOrder')
        .select('reference')
        .where('tenantId', '=', scope.tenantId)
        .where('id', '=', id)
        .executeTakeFirstOrThrow();
      created.push({ id, reference: row.reference, supplierId, lines: lines.length });
    }
  }
  return { today, window: { from, to }, suggestions, created };
}
