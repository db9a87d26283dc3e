/**
 * Takeoff engine benchmark (issue 4 §9). Prints figures and ratios; it is not a timed test.
 *
 *   npx tsx tests/bench/takeoff-bench.ts            # full run (~1–2 minutes, most of it the naive clipping)
 *   npx tsx tests/bench/takeoff-bench.ts --quick    # naive clipping on a sample of rows, extrapolated
 *
 * The hall: a 10,000 m² L (120 m × 100 m less 40 m × 50 m) with 200 columns of 400 × 400 mm
 * on a 6.8 m grid that does not line up with the tiles, 500 mm pitch, 5 mm gap, about 40,000
 * tiles. "Naive" clips every tile of the grid against the tiled region with polygon-clipping
 * (the region is built once with polygon-clipping's difference) and classifies it by the
 * same rules; its counts are checked against the engine's.
 */
import pc from 'polygon-clipping';
import {
  computeTakeoff,
  optimiseOrigin,
  type Point,
  type TakeoffInput,
} from '../../libs/takeoff/domain/src/index';

const quick = process.argv.includes('--quick');

function hall(scale = 1, columns = 200): TakeoffInput {
  const s = (v: number) => v * scale;
  const outline: Point[] = [
    [0, 0],
    [s(120_000), 0],
    [s(120_000), s(50_000)],
    [s(80_000), s(50_000)],
    [s(80_000), s(100_000)],
    [0, s(100_000)],
  ];
  const obstacles: Point[][] = [];
  const step = 6800 * Math.sqrt((scale * scale * 200) / Math.max(columns, 1));
  for (let x = step / 2 + 150; x < s(120_000) - 1000 && obstacles.length < columns; x += step) {
    for (let y = step / 2 + 130; y < s(100_000) - 1000 && obstacles.length < columns; y += step) {
      if (x > s(80_000) - 1000 && y > s(50_000) - 1000) continue;
      obstacles.push([
        [x - 200, y - 200],
        [x + 200, y - 200],
        [x + 200, y + 200],
        [x - 200, y + 200],
      ]);
    }
  }
  return { outline, obstacles, tile: { pitchMm: 500 }, gapMm: 5, suggestOrigin: false };
}

function median(f: () => void, runs: number, warm = 5): number {
  for (let k = 0; k < warm; k++) f();
  const t: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    f();
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  return t[runs >> 1];
}

const ringArea = (r: pc.Ring) => {
  let a = 0;
  for (let k = 0; k < r.length - 1; k++) a += r[k][0] * r[k + 1][1] - r[k + 1][0] * r[k][1];
  return Math.abs(a) / 2;
};
const mpArea = (mp: pc.MultiPolygon) =>
  mp.reduce((s, poly) => s + poly.reduce((t, ring, k) => t + (k ? -1 : 1) * ringArea(ring), 0), 0);

/** Per-tile clipping of every grid cell against the region. */
function naive(input: TakeoffInput, ox: number, oy: number, rowFraction = 1) {
  const p = input.tile.pitchMm;
  const g = input.gapMm ?? 5;
  // Offsets of this hall are axis-aligned rectangles and an L: mitres are plain shifts.
  const [, , [X1], , [X2, Y2]] = input.outline;
  const o: pc.Ring = [
    [g, g],
    [X1 - g, g],
    [X1 - g, input.outline[2][1] - g],
    [X2 - g, input.outline[2][1] - g],
    [X2 - g, Y2 - g],
    [g, Y2 - g],
  ];
  const holes = (input.obstacles ?? []).map(
    (ob): pc.Polygon => [
      [
        [ob[0][0] - g, ob[0][1] - g],
        [ob[1][0] + g, ob[1][1] - g],
        [ob[2][0] + g, ob[2][1] + g],
        [ob[3][0] - g, ob[3][1] + g],
      ],
    ],
  );
  const region = pc.difference([o], ...holes);
  const i0 = Math.floor((g - ox) / p);
  const i1 = Math.floor((X1 - g - ox) / p);
  const j0 = Math.floor((g - oy) / p);
  const j1 = Math.floor((Y2 - g - oy) / p);
  let full = 0;
  let cut = 0;
  let rows = 0;
  const every = Math.round(1 / rowFraction);
  const t0 = performance.now();
  for (let j = j0; j <= j1; j++) {
    if ((j - j0) % every !== 0) continue;
    rows++;
    for (let i = i0; i <= i1; i++) {
      const x = ox + i * p;
      const y = oy + j * p;
      const a = mpArea(
        pc.intersection(
          [
            [
              [x, y],
              [x + p, y],
              [x + p, y + p],
              [x, y + p],
            ],
          ],
          region,
        ),
      );
      if (a >= p * p - 1) full++;
      else if (a > 1) cut++;
    }
  }
  const ms = performance.now() - t0;
  const totalRows = j1 - j0 + 1;
  return { full, cut, ms, rows, totalRows, extrapolatedMs: (ms * totalRows) / rows };
}

const fmt = (x: number, d = 2) => x.toFixed(d);

const input = hall();
const first = computeTakeoff(input);
console.log(
  `Hall: ${fmt(first.netAreaM2, 0)} m² net, ${input.obstacles?.length} columns, pitch 500 mm, gap 5 mm`,
);
console.log(
  `  tiles: ${first.tiles.full} full + ${first.tiles.cut} cut = ${first.tiles.full + first.tiles.cut}, smallest cut ${fmt(first.cuts.smallestMm ?? 0, 1)} mm, ${first.cuts.slivers} slivers, ${first.tiles.offcutsReused} offcuts reused`,
);

const computeMs = median(() => computeTakeoff(input), 41);
console.log(
  `computeTakeoff (origin 'centre'), median of 41: ${fmt(computeMs)} ms   (target ≤ 20 ms)`,
);
const auto = optimiseOrigin(input);
const optMs = median(() => optimiseOrigin(input), 11, 1);
console.log(
  `'auto' origin optimisation, median of 11: ${fmt(optMs)} ms, ${auto.evaluated} layouts scored   (target ≤ 500 ms)`,
);
const autoTotal = median(() => computeTakeoff({ ...input, origin: 'auto' }), 11, 1);
console.log(`computeTakeoff (origin 'auto'), median of 11: ${fmt(autoTotal)} ms`);
console.log(
  `  centre: smallest ${fmt(auto.centre.score.smallestMm ?? 0, 1)} mm, ${auto.centre.score.cut} cut; auto: smallest ${fmt(auto.score.smallestMm ?? 0, 1)} mm, ${auto.score.cut} cut, origin (${fmt(auto.origin.x, 1)}, ${fmt(auto.origin.y, 1)})`,
);

const nv = naive(input, first.origin.x, first.origin.y, quick ? 1 / 10 : 1);
if (quick) {
  console.log(
    `naive per-tile clipping (polygon-clipping): ${nv.rows} of ${nv.totalRows} rows in ${fmt(nv.ms / 1000, 1)} s → whole hall ≈ ${fmt(nv.extrapolatedMs / 1000, 1)} s (extrapolated)`,
  );
} else {
  const same = nv.full === first.tiles.full && nv.cut === first.tiles.cut;
  console.log(
    `naive per-tile clipping (polygon-clipping): ${fmt(nv.ms / 1000, 1)} s, ${nv.full} full + ${nv.cut} cut — ${same ? 'same counts as the engine' : 'COUNTS DIFFER from the engine'}`,
  );
}
const ratio = nv.extrapolatedMs / computeMs;
console.log(`speed ratio engine/naive: ${fmt(ratio, 0)}× faster   (target ≥ 1,000×)`);

console.log(
  '\nScaling (same L shape and column density, columns capped at 1,200 so the floor stays under 5,000 vertices):',
);
console.log('   area m²   columns      tiles   compute ms   ns per tile   auto ms');
for (const area of [100, 1_000, 10_000, 50_000, 100_000]) {
  const scale = Math.sqrt(area / 10_000);
  const cols = Math.min(1200, Math.max(1, Math.round((200 * area) / 10_000)));
  const inp = hall(scale, cols);
  const r = computeTakeoff(inp);
  const tiles = r.tiles.full + r.tiles.cut;
  const runs = area >= 50_000 ? 7 : 21;
  const ms = median(() => computeTakeoff(inp), runs, area >= 50_000 ? 3 : 15);
  const am = median(() => optimiseOrigin(inp), area >= 50_000 ? 3 : 5, 1);
  console.log(
    `${String(area).padStart(10)} ${String(inp.obstacles?.length).padStart(9)} ${String(tiles).padStart(10)} ${fmt(ms).padStart(12)} ${fmt((ms * 1e6) / tiles, 0).padStart(13)} ${fmt(am, 1).padStart(9)}`,
  );
}
