/**
 * @latchwork/stock-domain — the stock computations: money and quantities, valuation,
 * reorder, batch choice and picking, count variances, input checks. Pure TypeScript with no
 * imports: runs in Node and in the browser.
 */
export { divRound, mulDivRound, MONEY_ROUNDING, scaleOf, type RoundingMode } from './rounding';
export {
  extendCost,
  formatDecimal,
  formatMoney,
  parseDecimal,
  parseMoney,
  type Minor,
} from './money';
export {
  formatPacks,
  formatQuantity,
  packsToCover,
  parseQuantity,
  type Noun,
  type UnitNames,
} from './quantity';
export { StockInputError, problem, type StockProblem, type StockProblemCode } from './problems';
export {
  signedQuantity,
  type CostLine,
  type MovementKind,
  type ValuationMovement,
  type ValuationOptions,
} from './valuation/movements';
export {
  EMPTY_STOCK,
  applyAverageCost,
  averageUnitCost,
  weightedAverageCost,
  type AverageCostResult,
  type AverageCostState,
} from './valuation/weighted-average';
export { fifoCost, type FifoLayer, type FifoResult } from './valuation/fifo';
export {
  dailyDemandSeries,
  dayNumber,
  daysBetween,
  demandStats,
  type DemandEvent,
  type DemandStats,
} from './reorder/demand';
export {
  economicOrderQuantity,
  inverseNormalCdf,
  reorderPoint,
  safetyStock,
  serviceLevelZ,
} from './reorder/formulas';
export {
  reorderSuggestion,
  type ReorderProduct,
  type ReorderReason,
  type ReorderSettings,
  type ReorderSuggestion,
  type StockPosition,
} from './reorder/suggestion';
export {
  chooseBatches,
  type BatchChoice,
  type BatchPick,
  type ChooseOptions,
} from './batches/reserve';
export {
  available,
  fefoOrder,
  fefoPickingList,
  isExpired,
  type BatchStock,
  type PickLine,
  type PickSource,
  type PickingList,
} from './batches/picking';
export {
  countVariance,
  type CountCorrection,
  type CountLineInput,
  type CountLineResult,
  type CountThresholds,
  type CountVariance,
} from './counts/variance';
export { validateMovement, type MovementContext, type MovementInput } from './validate';
export {
  ATTRIBUTE_FIELDS,
  EXPIRING_KINDS,
  PRODUCT_KINDS,
  attributeProblems,
  type AttributeField,
  type ProductKindId,
} from './catalogue/attributes';
export {
  estimateFromTakeoffs,
  materialKey,
  type EstimateLine,
  type TakeoffMaterialsSummary,
} from './materials/estimate';
