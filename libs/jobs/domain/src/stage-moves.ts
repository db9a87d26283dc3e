/**
 * Checking a stage move against the table, with a message a person can act on. The board
 * shows the message when a dragged card snaps back; the API returns it in its error.
 */
import { moveRule, type MoveKind } from './stage-table';
import { STAGES, STAGE_LABELS, type Stage } from './stages';

/** What the move needs beyond from and to. */
export interface MoveContext {
  /** Why: required for lost, cancelled, on hold and every move backwards. */
  readonly reason?: string | null;
  /** For a job on hold: the stage it was held from (see `heldFromOf`). */
  readonly heldFrom?: Stage | null;
}

export type MoveRefusalCode =
  | 'same-stage'
  | 'not-allowed'
  | 'reason-required'
  | 'resume-elsewhere'
  | 'held-from-unknown';

/** A refused move: `message` is a whole sentence for the person who tried it. */
export interface MoveRefusal {
  readonly ok: false;
  readonly code: MoveRefusalCode;
  readonly from: Stage;
  readonly to: Stage;
  readonly message: string;
}

/** An allowed move, with the trimmed reason (null when none was given). */
export interface MoveAllowed {
  readonly ok: true;
  readonly from: Stage;
  readonly to: Stage;
  readonly kind: MoveKind;
  readonly reason: string | null;
}

export type MoveCheck = MoveAllowed | MoveRefusal;

const q = (s: Stage) => `“${STAGE_LABELS[s]}”`;

/** "A, B or C" in board order. */
function listStages(stages: readonly Stage[]): string {
  const names = stages.map((s) => STAGE_LABELS[s]);
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} or ${names.at(-1)}`;
}

function notAllowedMessage(from: Stage, to: Stage, heldFrom?: Stage | null): string {
  if (from === 'cancelled') {
    return 'A cancelled job stays closed. If the work comes back, open a new job for it.';
  }
  if ((from === 'invoiced' || from === 'paid') && (to === 'on_hold' || to === 'cancelled')) {
    return `An invoiced or paid job can't be put on hold or cancelled: withdraw the invoice with a credit note first (back to ${q('completed')}).`;
  }
  if (from === 'lost' && (to === 'on_hold' || to === 'cancelled')) {
    return `A lost job is already closed. Reopen it to ${q('quoted')} or ${q('enquiry')} if the customer comes back.`;
  }
  if (to === 'lost') {
    return `Only a job that is not yet won can be lost. Once won, a customer who backs out is ${q('cancelled')}.`;
  }
  const next = nextStages(from, heldFrom);
  return `A job can't go from ${q(from)} to ${q(to)}. From ${q(from)} it can go to ${listStages(next)}.`;
}

function reasonMessage(kind: MoveKind, to: Stage): string {
  switch (kind) {
    case 'lose':
      return 'Say why the job was lost (price, timing, went elsewhere…).';
    case 'cancel':
      return 'Say why the job is cancelled.';
    case 'hold':
      return 'Say why the job is on hold.';
    case 'reopen':
      return 'Say why the job is reopened.';
    case 'reverse':
      return 'Say why the payment was reversed.';
    default:
      return `Say why the job is going back to ${q(to)}.`;
  }
}

/**
 * Checks a move against the table: same stage, allowed at all, back to the stage it was
 * held from, and a reason where the table asks for one.
 */
export function checkMove(from: Stage, to: Stage, context: MoveContext = {}): MoveCheck {
  const refuse = (code: MoveRefusalCode, message: string): MoveRefusal => ({
    ok: false,
    code,
    from,
    to,
    message,
  });
  if (from === to) return refuse('same-stage', `The job is already at ${q(to)}.`);
  const rule = moveRule(from, to);
  if (!rule) return refuse('not-allowed', notAllowedMessage(from, to, context.heldFrom));
  if (rule.kind === 'resume') {
    if (!context.heldFrom) {
      return refuse(
        'held-from-unknown',
        'This job can only go back to the stage it was held from, and that stage is not known.',
      );
    }
    if (context.heldFrom !== to) {
      return refuse(
        'resume-elsewhere',
        `This job was put on hold at ${q(context.heldFrom)}: take it off hold back to ${q(context.heldFrom)}, then move it on from there.`,
      );
    }
  }
  const reason = context.reason?.trim() || null;
  if (rule.reasonRequired && !reason)
    return refuse('reason-required', reasonMessage(rule.kind, to));
  return { ok: true, from, to, kind: rule.kind, reason };
}

/**
 * True when the table allows the move, leaving the reason aside (the board asks for the
 * reason after the drop). A job on hold can move only back to `heldFrom`, or be cancelled.
 */
export function canMove(from: Stage, to: Stage, heldFrom?: Stage | null): boolean {
  const rule = from === to ? undefined : moveRule(from, to);
  if (!rule) return false;
  return rule.kind !== 'resume' || heldFrom === to;
}

/** The stages a job at `from` can move to, in board order (reason aside). */
export function nextStages(from: Stage, heldFrom?: Stage | null): Stage[] {
  return STAGES.filter((to) => canMove(from, to, heldFrom));
}

/** True when moving from → to needs a reason. False for moves the table does not allow. */
export function reasonRequired(from: Stage, to: Stage): boolean {
  return moveRule(from, to)?.reasonRequired ?? false;
}

/** One line of a job's stage history (oldest first); `from` is null on the first line. */
export interface StageHistoryEntry {
  readonly from: Stage | null;
  readonly to: Stage;
}

/**
 * The stage a job on hold was held from: the `from` of the latest line, when that line put it
 * on hold. Undefined when the job is not on hold.
 */
export function heldFromOf(history: readonly StageHistoryEntry[]): Stage | undefined {
  const last = history.at(-1);
  if (!last || last.to !== 'on_hold' || last.from === null) return undefined;
  return last.from;
}
