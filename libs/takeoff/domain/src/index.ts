/**
 * @latchwork/takeoff — takeoff and layout engine for tiled floors. Pure TypeScript, no I/O:
 * runs in Node and in the browser. Lengths in millimetres.
 */
export { computeTakeoff } from './compute';
export { optimiseOrigin, layoutStats, type LayoutScore, type OptimiseResult } from './optimise';
export { validateTakeoffInput, TakeoffInputError, LIMITS } from './validate';
export { DEFAULT_RATES, resolveRates, type TakeoffRates } from './rates';
export { cellCorners, forEachFullTile, ringPath } from './plan';
export {
  M2_PER_FT2,
  MM_PER_FOOT,
  MM_PER_INCH,
  feetInchesFromMm,
  ft2FromM2,
  m2FromFt2,
  mmFromFeetInches,
  mmFromInches,
  mmFromM,
} from './units';
export type * from './types';
