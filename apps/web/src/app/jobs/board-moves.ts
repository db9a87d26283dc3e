import { addMinor, checkMove, type Stage } from '@latchwork/jobs-domain';
import type { BoardColumn, JobRow } from './jobs-api';

/** What the board does with a card dropped on a column (or picked from a card's move menu). */
export type DropPlan =
  | { readonly kind: 'stay' }
  | { readonly kind: 'move' }
  /** Allowed once the person says why; `prompt` is the domain's sentence asking for it. */
  | { readonly kind: 'ask-reason'; readonly prompt: string }
  /** Refused: the card snaps back and the board shows `message`. */
  | { readonly kind: 'refuse'; readonly message: string };

/**
 * Checks a drop with the same stage table the API uses (`checkMove`), so a refused move snaps
 * back at once with the API's sentence, and a move that needs a reason asks for it before
 * anything is sent. The API checks again: it has the last word.
 */
export function planDrop(card: Pick<JobRow, 'stage' | 'heldFrom'>, to: Stage): DropPlan {
  if (card.stage === to) return { kind: 'stay' };
  const check = checkMove(card.stage, to, { heldFrom: card.heldFrom });
  if (check.ok) return { kind: 'move' };
  if (check.code === 'reason-required') return { kind: 'ask-reason', prompt: check.message };
  return { kind: 'refuse', message: check.message };
}

/**
 * The board with one card moved to another column, counts and values carried with it, the
 * card on top of its new column (it is now the newest move there). Columns are new objects;
 * the given ones are left as they were, so a refused move is undone by keeping them.
 */
export function withCardMoved(
  columns: readonly BoardColumn[],
  cardId: string,
  to: Stage,
): BoardColumn[] {
  const from = columns.find((c) => c.cards.some((card) => card.id === cardId));
  const card = from?.cards.find((c) => c.id === cardId);
  if (!from || !card || from.stage === to) return [...columns];
  const value = card.valueEstimateMinor;
  const moved: JobRow = { ...card, stage: to, heldFrom: to === 'on_hold' ? card.stage : null };
  return columns.map((column) => {
    if (column.stage === from.stage)
      return {
        ...column,
        count: column.count - 1,
        valueMinor: value === null ? column.valueMinor : addMinor(column.valueMinor, -value),
        unvalued: column.unvalued - (value === null ? 1 : 0),
        cards: column.cards.filter((c) => c.id !== cardId),
      };
    if (column.stage === to)
      return {
        ...column,
        count: column.count + 1,
        valueMinor: value === null ? column.valueMinor : addMinor(column.valueMinor, value),
        unvalued: column.unvalued + (value === null ? 1 : 0),
        cards: [moved, ...column.cards],
      };
    return column;
  });
}
