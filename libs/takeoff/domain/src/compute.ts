/**
 * computeTakeoff: from a measured floor to tiles, cuts, materials, hours and a plan.
 * Pure and synchronous, so a page can call it on every edit.
 */
import { cleanRing, perimeter, signedArea, toCcw } from './geometry/polygon';
import { pairOffcuts } from './layout/offcuts';
import { autoOrigin, centreOrigin } from './layout/origin';
import { makeColourer } from './layout/pattern';
import { rasterize, type RasterResult } from './layout/raster';
import { buildRegion, toGrid, toWorld, type TiledRegion } from './layout/region';
import { labour, materials, ceilUnits } from './quantities/materials';
import { perimeterQuantities } from './quantities/perimeter';
import {
  acclimatisationWarning,
  batchWarnings,
  obstacleNearWallWarnings,
} from './quantities/warnings';
import { zonesInFloorMm2, zonesOutsideWarnings } from './quantities/zones';
import { resolveRates } from './rates';
import type {
  ColourCount,
  CutTile,
  Point,
  TakeoffInput,
  TakeoffResult,
  TakeoffWarning,
} from './types';
import { TakeoffInputError, validateTakeoffInput } from './validate';

/**
 * Computes the takeoff. Throws {@link TakeoffInputError} (with the same problems
 * {@link validateTakeoffInput} lists) for bad input; never throws otherwise.
 */
export function computeTakeoff(input: TakeoffInput): TakeoffResult {
  const problems = validateTakeoffInput(input);
  if (problems.length) throw new TakeoffInputError(problems);

  const rates = resolveRates(input.rates);
  const p = input.tile.pitchMm;
  const gap = input.gapMm ?? rates.gapMm;
  const angle = input.layoutAngleDeg ?? 0;
  const minCut = input.minCutMm ?? p / 5;
  const overage = input.overagePct ?? rates.overagePct;
  const packSize = input.packSize ?? rates.packSize;
  const outline = toCcw(cleanRing(input.outline));
  const obstacles = (input.obstacles ?? []).map((o) => toCcw(cleanRing(o)));
  const region = buildRegion(outline, obstacles, gap, angle);
  const rings = [region.outline, ...region.holes];

  // Origin, in the grid frame.
  const mode =
    input.origin === 'auto' ? 'auto' : typeof input.origin === 'object' ? 'given' : 'centre';
  let o: { x: number; y: number };
  if (typeof input.origin === 'object') {
    const g = toGrid(input.origin.x, input.origin.y, angle);
    o = { x: g[0], y: g[1] };
  } else {
    o = centreOrigin(rings, p);
    if (mode === 'auto') o = autoOrigin(region.edges, rings, p, o);
  }

  const grid = rasterize(region.edges, { ox: o.x, oy: o.y, pitch: p, geometry: true });
  const colourer = makeColourer(
    input.pattern,
    { ox: o.x, oy: o.y, pitch: p, angleDeg: angle },
    region.outline,
  );
  const { fullRuns, fullByColour, cutColour } = colourTiles(grid, colourer);

  const candidates = grid.cutCells.map((c, k) => ({
    i: c.i,
    j: c.j,
    kind: c.kind,
    keptMm: c.keptMm,
    colour: cutColour[k],
  }));
  const fromOffcut = new Set(pairOffcuts(candidates, p));
  const cutTiles: CutTile[] = grid.cutCells.map((c, k) => ({
    i: c.i,
    j: c.j,
    colour: colourer.colours[cutColour[k]],
    areaMm2: c.area,
    sizeMm: c.size,
    sliver: c.size < minCut,
    kind: c.kind,
    fromOffcut: fromOffcut.has(k),
    rings: c.rings.map((ring) => ringToWorld(ring, angle)),
  }));
  const slivers = cutTiles.filter((c) => c.sliver).length;

  const byColour: ColourCount[] = colourer.colours.map((colour, ci) => {
    const cut = cutColour.filter((c) => c === ci).length;
    const reused = [...fromOffcut].filter((k) => cutColour[k] === ci).length;
    const full = fullByColour[ci];
    const needed = full + cut - reused;
    const withOverage = ceilUnits(needed * (1 + overage / 100));
    const packs = ceilUnits(withOverage / packSize);
    return {
      colour,
      full,
      cut,
      offcutsReused: reused,
      needed,
      toOrder: packs * packSize,
      packs,
      areaM2: (needed * p * p) / 1e6,
    };
  });
  const sum = (f: (c: ColourCount) => number) => byColour.reduce((s, c) => s + f(c), 0);

  const doorways = input.doorways ?? [];
  const per = perimeterQuantities(
    outline,
    obstacles,
    doorways,
    input.skirtObstacles ?? true,
    rates.cornerMinTurnDeg,
    rates.rampStockMm,
  );
  const perimeterMm = perimeter(outline) + obstacles.reduce((s, ob) => s + perimeter(ob), 0);
  const netAreaMm2 =
    Math.abs(signedArea(outline)) - obstacles.reduce((s, ob) => s + Math.abs(signedArea(ob)), 0);

  const adhesiveZones = input.zones?.adhesive ?? [];
  const levellingZones = input.zones?.levelling ?? [];
  const tiledOutlineWorld = region.outline.map((pt) => toWorld(pt[0], pt[1], angle));
  const tiledHolesWorld = region.holes.map((h) => h.map((pt) => toWorld(pt[0], pt[1], angle)));
  const adhesiveAreaM2 = zonesInFloorMm2(adhesiveZones, tiledOutlineWorld, tiledHolesWorld) / 1e6;
  const levelling = levellingZones.map((z) => ({
    areaM2: zonesInFloorMm2([z.polygon], outline, obstacles) / 1e6,
    depthMm: z.depthMm,
  }));
  const mats = materials(
    {
      skirtingMm: per.skirtingMm,
      internalCorners: per.internal,
      externalCorners: per.external,
      rampMm: per.rampMm,
      rampPieces: per.rampPieces,
      adhesiveAreaM2,
      levelling,
      anchorLengthMm: perimeterMm,
    },
    rates,
  );
  const tiledAreaM2 = grid.area / 1e6;
  const hours = labour(
    {
      tiledAreaM2,
      cutTiles: grid.cut,
      adhesiveAreaM2,
      levellingAreaM2: levelling.reduce((s, z) => s + z.areaM2, 0),
      skirtingMm: per.skirtingMm,
      rampMm: per.rampMm,
    },
    rates,
  );

  const warnings: TakeoffWarning[] = [];
  if (grid.full + grid.cut === 0) {
    warnings.push({
      code: 'empty-layout',
      severity: 'warning',
      message: 'No tile fits: the floor is narrower than twice the gap',
    });
  }
  if (slivers > 0)
    warnings.push(sliverWarning(input, region, rings, p, o, grid, slivers, minCut, angle, mode));
  warnings.push(...obstacleNearWallWarnings(outline, obstacles, p));
  warnings.push(
    ...zonesOutsideWarnings(
      [
        ...adhesiveZones.map((ring, k) => ({ field: `zones.adhesive[${k}]`, ring })),
        ...levellingZones.map((z, k) => ({ field: `zones.levelling[${k}]`, ring: z.polygon })),
      ],
      outline,
    ),
  );
  warnings.push(...batchWarnings(byColour, p, rates));
  warnings.push(acclimatisationWarning(rates));

  const originWorld = toWorld(o.x, o.y, angle);
  return {
    netAreaM2: netAreaMm2 / 1e6,
    perimeterMm,
    tiledAreaM2,
    tiles: {
      full: grid.full,
      cut: grid.cut,
      offcutsReused: fromOffcut.size,
      needed: sum((c) => c.needed),
      toOrder: sum((c) => c.toOrder),
      packs: sum((c) => c.packs),
      byColour,
      perM2: 1e6 / (p * p),
    },
    cuts: {
      smallestMm: Number.isFinite(grid.smallest) ? grid.smallest : null,
      slivers,
      minCutMm: minCut,
    },
    origin: { x: originWorld[0], y: originWorld[1], mode },
    skirtingMm: per.skirtingMm,
    corners: { internal: per.internal, external: per.external },
    rampMm: per.rampMm,
    materials: mats,
    labour: hours,
    warnings,
    plan: {
      origin: { x: originWorld[0], y: originWorld[1] },
      pitchMm: p,
      angleDeg: angle,
      colours: colourer.colours,
      fullRuns,
      cutTiles,
      regionOutline: tiledOutlineWorld,
      regionHoles: tiledHolesWorld,
    },
  };
}

/** Splits full runs by colour and counts tiles per colour. */
function colourTiles(grid: RasterResult, colourer: ReturnType<typeof makeColourer>) {
  const fullByColour = new Array<number>(colourer.colours.length).fill(0);
  const fullRuns: number[] = [];
  const cutColour: number[] = [];
  const runs = grid.fullRuns;
  if (colourer.uniform) {
    for (let r = 0; r < runs.length; r += 3) fullRuns.push(runs[r], runs[r + 1], runs[r + 2], 0);
    fullByColour[0] = grid.full;
    for (let k = 0; k < grid.cutCells.length; k++) cutColour.push(0);
    return { fullRuns, fullByColour, cutColour };
  }
  // Runs and cut cells both come row by row in increasing j.
  let lastRow = NaN;
  const begin = (j: number) => {
    if (j !== lastRow) colourer.beginRow(j);
    lastRow = j;
  };
  let c = 0;
  const cells = grid.cutCells;
  for (let r = 0; r < runs.length; r += 3) {
    const j = runs[r + 2];
    while (c < cells.length && cells[c].j < j) {
      begin(cells[c].j);
      cutColour.push(colourer.colourAt(cells[c].i, cells[c].j));
      c++;
    }
    begin(j);
    let start = runs[r];
    let colour = colourer.colourAt(start, j);
    for (let i = start + 1; i <= runs[r + 1]; i++) {
      const next = i < runs[r + 1] ? colourer.colourAt(i, j) : -1;
      if (next !== colour) {
        fullRuns.push(start, i, j, colour);
        fullByColour[colour] += i - start;
        start = i;
        colour = next;
      }
    }
  }
  for (; c < cells.length; c++) {
    begin(cells[c].j);
    cutColour.push(colourer.colourAt(cells[c].i, cells[c].j));
  }
  return { fullRuns, fullByColour, cutColour };
}

function ringToWorld(ring: number[], angle: number): number[] {
  if (angle === 0) return ring;
  const out: number[] = [];
  for (let q = 0; q < ring.length; q += 2) {
    const w = toWorld(ring[q], ring[q + 1], angle);
    out.push(w[0], w[1]);
  }
  return out;
}

function sliverWarning(
  input: TakeoffInput,
  region: TiledRegion,
  rings: Point[][],
  p: number,
  o: { x: number; y: number },
  grid: RasterResult,
  slivers: number,
  minCut: number,
  angle: number,
  mode: string,
): TakeoffWarning {
  const thinnest = grid.cutCells.reduce((a, b) => (b.size < a.size ? b : a));
  const at = toWorld(o.x + (thinnest.i + 0.5) * p, o.y + (thinnest.j + 0.5) * p, angle);
  let message = `${slivers} cut tile(s) thinner than ${Math.round(minCut)} mm (thinnest ${thinnest.size.toFixed(1)} mm): they break off or lift`;
  const data: Record<string, unknown> = { slivers, smallestMm: thinnest.size, minCutMm: minCut };
  if (mode !== 'auto' && input.suggestOrigin !== false) {
    const best = autoOrigin(region.edges, rings, p, o);
    if (best.score.smallest > grid.smallest + 1e-6) {
      const w = toWorld(best.x, best.y, angle);
      data['suggestedOrigin'] = { x: w[0], y: w[1] };
      const suggested = { x: w[0].toFixed(1), y: w[1].toFixed(1) };
      data['suggestedSmallestMm'] = best.score.smallest;
      message +=
        best.score.smallest >= minCut
          ? `; origin (${suggested.x}, ${suggested.y}) removes them`
          : `; origin (${suggested.x}, ${suggested.y}) raises the thinnest cut to ${best.score.smallest.toFixed(1)} mm`;
    }
  }
  return { code: 'slivers', severity: 'warning', message, point: at, data };
}
