/**
 * Picking list, first expiry first out (FEFO): for anything with an expiry date the stores
 * person takes the batch that expires first, ties by the one received first. Expired batches
 * are skipped unless the owner overrides (each such line is flagged `expired`), so expired
 * adhesive never leaves the shelf by accident.
 */

/** A batch of one product at the place being reserved or picked from. */
export interface BatchStock {
  code: string;
  onHand: number;
  /** Already promised to other jobs. */
  reserved: number;
  received: string;
  expiry?: string | null;
}

/** On hand − reserved, never below zero. */
export const available = (b: BatchStock): number => Math.max(0, b.onHand - b.reserved);

/** Whether the batch has expired on `today` (an expiry date is the last good day). */
export const isExpired = (b: Pick<BatchStock, 'expiry'>, today: string): boolean =>
  !!b.expiry && b.expiry < today;

const cmp = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/** First expiry first (undated last), then first received, then code for a stable order. */
export function fefoOrder(a: Omit<BatchStock, 'onHand' | 'reserved'>, b: typeof a): number {
  const ea = a.expiry ?? '\uffff';
  const eb = b.expiry ?? '\uffff';
  return cmp(ea, eb) || cmp(a.received, b.received) || cmp(a.code, b.code);
}

/** A batch the pick may draw on, with the quantity it may take from it. */
export interface PickSource {
  code: string;
  quantity: number;
  received: string;
  expiry?: string | null;
  location?: string;
}

/** One line of the picking list. */
export interface PickLine {
  code: string;
  quantity: number;
  expiry: string | null;
  expired: boolean;
  location?: string;
}

/** The list, what could not be picked, and the expired batches that were skipped. */
export interface PickingList {
  lines: PickLine[];
  short: number;
  skippedExpired: string[];
}

/** Builds the FEFO picking list for `quantity` (stock steps) from `sources`. */
export function fefoPickingList(
  sources: readonly PickSource[],
  quantity: number,
  options: { today: string; allowExpired?: boolean },
): PickingList {
  const lines: PickLine[] = [];
  const skippedExpired: string[] = [];
  let left = quantity;
  for (const s of [...sources].sort(fefoOrder)) {
    if (left <= 0) break;
    if (s.quantity <= 0) continue;
    const expired = isExpired(s, options.today);
    if (expired && !options.allowExpired) {
      skippedExpired.push(s.code);
      continue;
    }
    const take = Math.min(s.quantity, left);
    left -= take;
    lines.push({
      code: s.code,
      quantity: take,
      expiry: s.expiry ?? null,
      expired,
      ...(s.location !== undefined && { location: s.location }),
    });
  }
  return { lines, short: left, skippedExpired };
}
