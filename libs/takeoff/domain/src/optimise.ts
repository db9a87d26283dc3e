/**
 * The layout optimiser on its own: where to start the grid, without the rest of the
 * takeoff. A page can show "best origin" next to the plan, or run it on demand.
 */
import { cleanRing, toCcw } from './geometry/polygon';
import { autoOrigin, centreOrigin, scoreOrigin, type GridScore } from './layout/origin';
import { buildRegion, toGrid, toWorld } from './layout/region';
import { resolveRates } from './rates';
import type { TakeoffInput } from './types';
import { TakeoffInputError, validateTakeoffInput } from './validate';

export interface LayoutScore {
  /** Smallest cut piece (mm), null when nothing is cut. */
  smallestMm: number | null;
  cut: number;
  full: number;
  /** Tiles out of boxes (full + cut − offcuts reused). */
  tiles: number;
}

export interface OptimiseResult {
  origin: { x: number; y: number };
  score: LayoutScore;
  centre: { origin: { x: number; y: number }; score: LayoutScore };
  /** Layouts scored during the search. */
  evaluated: number;
}

const toScore = (s: GridScore): LayoutScore => ({
  smallestMm: Number.isFinite(s.smallest) ? s.smallest : null,
  cut: s.cut,
  full: s.full,
  tiles: s.tiles,
});

function prepare(input: TakeoffInput) {
  const problems = validateTakeoffInput(input);
  if (problems.length) throw new TakeoffInputError(problems);
  const rates = resolveRates(input.rates);
  const angle = input.layoutAngleDeg ?? 0;
  const region = buildRegion(
    toCcw(cleanRing(input.outline)),
    (input.obstacles ?? []).map((o) => toCcw(cleanRing(o))),
    input.gapMm ?? rates.gapMm,
    angle,
  );
  return { region, angle, p: input.tile.pitchMm, rings: [region.outline, ...region.holes] };
}

/**
 * Searches grid origins for the largest smallest cut, then fewest cuts, then fewest tiles
 * (what `origin: 'auto'` does), and reports the centred layout beside it. Never worse than
 * centred. Offcut pairing here ignores colours.
 */
export function optimiseOrigin(input: TakeoffInput): OptimiseResult {
  const { region, angle, p, rings } = prepare(input);
  const c = centreOrigin(rings, p);
  const centreScore = scoreOrigin(region.edges, c.x, c.y, p);
  const best = autoOrigin(region.edges, rings, p, c);
  const w = toWorld(best.x, best.y, angle);
  const cw = toWorld(c.x, c.y, angle);
  return {
    origin: { x: w[0], y: w[1] },
    score: toScore(best.score),
    centre: { origin: { x: cw[0], y: cw[1] }, score: toScore(centreScore) },
    evaluated: best.evaluated,
  };
}

/** Counts for one origin (world mm) without building the plan: cheap enough to drag. */
export function layoutStats(input: TakeoffInput, origin: { x: number; y: number }): LayoutScore {
  const { region, angle, p } = prepare(input);
  const g = toGrid(origin.x, origin.y, angle);
  return toScore(scoreOrigin(region.edges, g[0], g[1], p));
}
