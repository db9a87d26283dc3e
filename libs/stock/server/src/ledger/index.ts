/**
 * The stock ledger's posting API, for every feature that moves stock (goods in, counts,
 * issues to jobs): book movements with `postMovements`, undo one with `reverseMovement`,
 * and prove the summaries with `checkLedger`.
 */
export {
  postMovements,
  movementView,
  type PostOptions,
  type PostedMovement,
} from './post-movements';
export type { MovementRequest, PostingActor } from './movement-request';
export { reverseMovement } from './reverse-movement';
export {
  checkLedger,
  type BalanceDifference,
  type CostDifference,
  type LedgerCheck,
} from './check-ledger';
export { keyOf } from './locks';
