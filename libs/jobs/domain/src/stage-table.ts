/**
 * The allowed stage moves, as data. A move not in this table is refused. README.md shows the
 * same table as a grid; the exhaustive test checks every pair against that grid.
 */
import type { Stage } from './stages';

/**
 * What kind of move it is. The kind picks the wording of the history line and of refusals.
 * - `forward`: the normal next step.
 * - `shortcut`: skips steps a real firm skips (quote from a drawing, survey on first visit,
 *   accepted and booked in one call).
 * - `back`: a correction one step (or a few) back, e.g. dates fell through, snagging.
 * - `lose`: the customer went elsewhere or decided against it.
 * - `reopen`: a lost job comes back.
 * - `hold` / `resume`: pause, and back to the stage it was held from (only that one).
 * - `cancel`: the work will not happen.
 * - `reverse`: a payment was reversed (bounced transfer, card dispute).
 */
export type MoveKind =
  | 'forward'
  | 'shortcut'
  | 'back'
  | 'lose'
  | 'reopen'
  | 'hold'
  | 'resume'
  | 'cancel'
  | 'reverse';

/** One allowed move. `reasonRequired`: the history must say why (lost, cancelled, etc.). */
export interface MoveRule {
  readonly kind: MoveKind;
  readonly reasonRequired: boolean;
}

const FORWARD: MoveRule = { kind: 'forward', reasonRequired: false };
const SHORTCUT: MoveRule = { kind: 'shortcut', reasonRequired: false };
// Going back undoes something the customer or the crew was told: say why in the history.
const BACK: MoveRule = { kind: 'back', reasonRequired: true };
const LOSE: MoveRule = { kind: 'lose', reasonRequired: true };
const REOPEN: MoveRule = { kind: 'reopen', reasonRequired: true };
// "Why is it on hold?" is the first question anyone asks about a held job.
const HOLD: MoveRule = { kind: 'hold', reasonRequired: true };
const RESUME: MoveRule = { kind: 'resume', reasonRequired: false };
const CANCEL: MoveRule = { kind: 'cancel', reasonRequired: true };
const REVERSE: MoveRule = { kind: 'reverse', reasonRequired: true };

/**
 * From → to → rule. Decisions worth knowing:
 * - Lost is possible up to the quote; after "won" the customer backing out is a cancellation.
 * - Cancelled is final (a returning customer gets a new job and reference); lost reopens to
 *   quoted (the quote still stands) or to enquiry (lost before it was quoted).
 * - Hold and cancel are open to every open stage (enquiry … fitted), cancel also from on hold.
 *   Invoiced and paid cannot be held or cancelled: the invoice is withdrawn by a credit note
 *   (invoiced → fitted) in the invoicing issue.
 * - Every paid job passes through invoiced: a tax invoice is always issued.
 */
export const STAGE_MOVES: Readonly<Record<Stage, Readonly<Partial<Record<Stage, MoveRule>>>>> = {
  enquiry: {
    survey_booked: FORWARD,
    surveyed: SHORTCUT,
    quoted: SHORTCUT,
    lost: LOSE,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  survey_booked: {
    enquiry: BACK,
    surveyed: FORWARD,
    quoted: SHORTCUT,
    lost: LOSE,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  surveyed: {
    survey_booked: BACK,
    quoted: FORWARD,
    lost: LOSE,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  quoted: {
    surveyed: BACK,
    won: FORWARD,
    lost: LOSE,
    scheduled: SHORTCUT,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  won: {
    quoted: BACK,
    scheduled: FORWARD,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  lost: {
    enquiry: REOPEN,
    quoted: REOPEN,
  },
  scheduled: {
    won: BACK,
    installing: FORWARD,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  installing: {
    scheduled: BACK,
    completed: FORWARD,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  completed: {
    installing: BACK,
    invoiced: FORWARD,
    on_hold: HOLD,
    cancelled: CANCEL,
  },
  invoiced: {
    completed: BACK,
    paid: FORWARD,
  },
  paid: {
    invoiced: REVERSE,
  },
  on_hold: {
    enquiry: RESUME,
    survey_booked: RESUME,
    surveyed: RESUME,
    quoted: RESUME,
    won: RESUME,
    scheduled: RESUME,
    installing: RESUME,
    completed: RESUME,
    cancelled: CANCEL,
  },
  cancelled: {},
};

/** The rule for a move, or undefined when the table does not allow it. */
export function moveRule(from: Stage, to: Stage): MoveRule | undefined {
  return STAGE_MOVES[from][to];
}
