/**
 * Which batches to reserve for a job. Tiles from different production batches differ in
 * shade, so a floor should come from one batch:
 * - **One batch covers it**: among the batches with enough available stock, the one that
 *   leaves the *least* behind (best fit). A large batch stays whole for a large job, and a
 *   small remnant is used up before it is stranded as too little for any floor. Ties go
 *   FEFO (first expiry, then first received). For goods that expire (any batch has an
 *   expiry date — adhesives, primers), FEFO comes first and fit breaks ties instead: letting
 *   a kit expire costs more than a remnant.
 * - **No single batch covers it**: the fewest batches that do, and among those the FEFO-first
 *   set; warned as `mixed-batches` so the estimator can lay each batch in its own area.
 * - **Not enough at all**: everything available, FEFO, warned as `short` with the shortfall.
 * Expired batches are left out unless `allowExpired` (the owner's override); any expired
 * batch used is flagged.
 */
import { available, fefoOrder, isExpired, type BatchStock } from './picking';

/** One batch and the quantity to take from it. */
export interface BatchPick {
  code: string;
  quantity: number;
  expiry: string | null;
  expired: boolean;
}

/** The choice, with a warning whenever it is not a single batch. */
export interface BatchChoice {
  picks: BatchPick[];
  warning: null | 'mixed-batches' | 'short';
  /** How much could not be covered (0 unless `short`). */
  shortBy: number;
}

/** Options of chooseBatches. */
export interface ChooseOptions {
  today: string;
  allowExpired?: boolean;
}

const pick = (b: BatchStock, quantity: number, today: string): BatchPick => ({
  code: b.code,
  quantity,
  expiry: b.expiry ?? null,
  expired: isExpired(b, today),
});

/** The FEFO-first set of exactly `k` batches covering `need` (lexicographically earliest). */
function fefoSetOf(sorted: BatchStock[], k: number, need: number): BatchStock[] {
  const chosen: BatchStock[] = [];
  let left = need;
  for (let i = 0; i < sorted.length && chosen.length < k; i++) {
    const slots = k - chosen.length - 1;
    // Take this batch if the remaining need can still be met by the largest batches after it.
    const rest = sorted
      .slice(i + 1)
      .map(available)
      .sort((a, b) => b - a)
      .slice(0, slots);
    if (available(sorted[i]) + rest.reduce((s, x) => s + x, 0) >= left) {
      chosen.push(sorted[i]);
      left -= available(sorted[i]);
    }
  }
  return chosen;
}

/**
 * Chooses the batches to reserve `needed` (> 0, in stock steps) from, as documented above.
 */
export function chooseBatches(
  batches: readonly BatchStock[],
  needed: number,
  options: ChooseOptions,
): BatchChoice {
  const usable = batches
    .filter((b) => available(b) > 0 && (options.allowExpired || !isExpired(b, options.today)))
    .sort(fefoOrder);
  const expiring = batches.some((b) => !!b.expiry);
  const leftover = (b: BatchStock) => available(b) - needed;
  const covering = usable.filter((b) => leftover(b) >= 0);
  if (covering.length > 0) {
    // `usable` is already FEFO-sorted and the sort is stable, so FEFO breaks fit ties.
    const best = expiring
      ? covering[0]
      : [...covering].sort((a, b) => leftover(a) - leftover(b))[0];
    return { picks: [pick(best, needed, options.today)], warning: null, shortBy: 0 };
  }
  const total = usable.reduce((s, b) => s + available(b), 0);
  if (total < needed) {
    const picks = usable.map((b) => pick(b, available(b), options.today));
    return { picks, warning: 'short', shortBy: needed - total };
  }
  // Fewest batches: the largest first reach the need soonest.
  const bySize = usable.map(available).sort((a, b) => b - a);
  let k = 0;
  for (let sum = 0; sum < needed; k++) sum += bySize[k];
  const set = fefoSetOf(usable, k, needed);
  let left = needed;
  const picks = set.map((b) => {
    const q = Math.min(available(b), left);
    left -= q;
    return pick(b, q, options.today);
  });
  return { picks, warning: 'mixed-batches', shortBy: 0 };
}
