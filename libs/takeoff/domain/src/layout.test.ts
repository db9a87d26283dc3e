import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeTakeoff } from './compute';
import { optimiseOrigin, layoutStats } from './optimise';
import { cellCorners, forEachFullTile } from './plan';
import type { Point } from './types';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

describe("origin 'centre'", () => {
  it('gives opposite walls equal cuts, choosing tile edge or tile middle on the centre line for the wider cut', () => {
    // 5990 mm across at 500: edge on centre → 495 per side... 2995 mod 500 = 495; middle → 245. Edge wins.
    // 6490 mm along: 3245 mod 500 = 245 (edge) vs 495 (middle). Middle wins.
    const r = computeTakeoff({ outline: rect(0, 0, 6000, 6500), tile: { pitchMm: 500 }, gapMm: 5 });
    expect(r.origin.mode).toBe('centre');
    expect(r.origin.x).toBe(3000);
    expect(r.origin.y).toBe(3000);
    expect(r.cuts.smallestMm).toBeCloseTo(495, 9);
    const sizes = r.plan.cutTiles.map((c) => c.sizeMm);
    expect(Math.min(...sizes)).toBeCloseTo(495, 9);
  });
});

describe("origin 'auto'", () => {
  it('removes slivers that a wall-start grid leaves, and is never worse than centre (random rooms)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2000, max: 9000 }),
        fc.integer({ min: 2000, max: 9000 }),
        fc.integer({ min: 300, max: 800 }),
        fc.array(fc.tuple(fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 0, max: 1000 })), {
          maxLength: 4,
        }),
        (W, H, pitch, cols) => {
          const obstacles = cols
            .map(([a, b]) =>
              rect(
                500 + (a / 1000) * (W - 1400),
                500 + (b / 1000) * (H - 1400),
                900 + (a / 1000) * (W - 1400),
                900 + (b / 1000) * (H - 1400),
              ),
            )
            .filter((o, k, all) =>
              all
                .slice(0, k)
                .every(
                  (q) => Math.abs(q[0][0] - o[0][0]) >= 400 || Math.abs(q[0][1] - o[0][1]) >= 400,
                ),
            );
          const input = {
            outline: rect(0, 0, W, H),
            obstacles,
            tile: { pitchMm: pitch },
            suggestOrigin: false,
          };
          const centre = computeTakeoff(input);
          const auto = computeTakeoff({ ...input, origin: 'auto' as const });
          const c = centre.cuts.smallestMm ?? Infinity;
          const a = auto.cuts.smallestMm ?? Infinity;
          expect(a).toBeGreaterThanOrEqual(c - 1e-9);
          const opt = optimiseOrigin(input);
          expect(opt.score.smallestMm ?? Infinity).toBeCloseTo(a === Infinity ? Infinity : a, 6);
          expect(layoutStats(input, opt.origin).smallestMm ?? Infinity).toBeCloseTo(
            a === Infinity ? Infinity : a,
            6,
          );
        },
      ),
      { numRuns: 40 },
    );
  });

  it('matches or beats a 16 × 16 scan of offsets on rectilinear rooms (its per-axis optimum is exact there)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2000, max: 9000 }),
        fc.integer({ min: 2000, max: 9000 }),
        fc.integer({ min: 300, max: 800 }),
        fc.integer({ min: 20, max: 80 }),
        (W, H, pitch, notch) => {
          const outline: Point[] = [
            [0, 0],
            [W, 0],
            [W, (H * notch) / 100],
            [(W * notch) / 100, (H * notch) / 100],
            [(W * notch) / 100, H],
            [0, H],
          ];
          const input = { outline, tile: { pitchMm: pitch }, suggestOrigin: false };
          const auto = optimiseOrigin(input).score.smallestMm ?? Infinity;
          let scan = -Infinity;
          for (let a = 0; a < 16; a++)
            for (let b = 0; b < 16; b++)
              scan = Math.max(
                scan,
                layoutStats(input, { x: (a / 16) * pitch, y: (b / 16) * pitch }).smallestMm ??
                  Infinity,
              );
          expect(auto).toBeGreaterThanOrEqual(scan - 0.01);
        },
      ),
      { numRuns: 25 },
    );
  });

  it('finds a better origin than a wall start that leaves a 30 mm sliver', () => {
    // 5040 mm room, 5 mm gaps: 5030 mm to tile = 10 tiles + a 30 mm sliver from a wall start.
    const room = rect(0, 0, 5040, 3000);
    const wall = computeTakeoff({
      outline: room,
      tile: { pitchMm: 500 },
      gapMm: 5,
      origin: { x: 5, y: 5 },
    });
    expect(wall.cuts.slivers).toBeGreaterThan(0);
    const slivers = wall.warnings.find((w) => w.code === 'slivers');
    expect(slivers?.data?.['suggestedOrigin']).toBeDefined();
    expect(slivers?.message).toMatch(/removes them/);
    const auto = computeTakeoff({
      outline: room,
      tile: { pitchMm: 500 },
      gapMm: 5,
      origin: 'auto',
    });
    expect(auto.cuts.slivers).toBe(0);
    expect(auto.cuts.smallestMm).toBeGreaterThan(100);
    // 0° and 90° are the same grid for square tiles: rotating the whole layout by 90° changes nothing.
    const turned = computeTakeoff({
      outline: room,
      tile: { pitchMm: 500 },
      gapMm: 5,
      origin: 'auto',
      layoutAngleDeg: 90,
    });
    expect(turned.tiles.full + turned.tiles.cut).toBe(auto.tiles.full + auto.tiles.cut);
    expect(turned.cuts.smallestMm).toBeCloseTo(auto.cuts.smallestMm ?? 0, 6);
  });
});

describe('offcut reuse', () => {
  it('pairs a 100 mm left-wall cut with a 100 mm right-wall cut in the same row (saves one tile per row)', () => {
    // 5200 mm wide, no gap, grid lines at −400 + 500k: pieces of 100 at both walls, 10 rows.
    const r = computeTakeoff({
      outline: rect(0, 0, 5200, 5000),
      tile: { pitchMm: 500 },
      gapMm: 0,
      origin: { x: -400, y: 0 },
    });
    expect(r.tiles.full).toBe(100);
    expect(r.tiles.cut).toBe(20);
    expect(r.tiles.offcutsReused).toBe(10);
    expect(r.tiles.needed).toBe(110);
    expect(r.plan.cutTiles.filter((c) => c.fromOffcut)).toHaveLength(10);
  });

  it('does not pair cuts whose widths add up to more than a tile', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 5700, 5000),
      tile: { pitchMm: 500 },
      gapMm: 0,
      origin: { x: -150, y: 0 },
    });
    // Pieces 350 and 350: the offcut of one (150) cannot fill the other.
    expect(r.tiles.cut).toBe(20);
    expect(r.tiles.offcutsReused).toBe(0);
  });

  it('pairs top and bottom cuts in the same column', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 5000, 5200),
      tile: { pitchMm: 500 },
      gapMm: 0,
      origin: { x: 0, y: -400 },
    });
    expect(r.tiles.offcutsReused).toBe(10);
  });
});

describe('patterns', () => {
  const room = rect(0, 0, 4000, 4000);
  const base = { outline: room, tile: { pitchMm: 500 }, gapMm: 0, origin: { x: 0, y: 0 } };
  it('chequer: 64 tiles split 32 / 32', () => {
    const r = computeTakeoff({
      ...base,
      pattern: { kind: 'chequer', colours: ['black', 'yellow'] },
    });
    expect(r.tiles.byColour.map((c) => [c.colour, c.full])).toEqual([
      ['black', 32],
      ['yellow', 32],
    ]);
    let seen = 0;
    forEachFullTile(r.plan, (i, j, colour) => {
      expect(colour).toBe((i + j) % 2 === 0 ? 'black' : 'yellow');
      seen++;
    });
    expect(seen).toBe(64);
  });

  it('stripes of two tiles along rows', () => {
    const r = computeTakeoff({
      ...base,
      pattern: { kind: 'stripes', colours: ['grey', 'blue'], widthTiles: 2 },
    });
    expect(r.tiles.byColour.map((c) => c.full)).toEqual([32, 32]);
  });

  it('a border of 1 row around an 8 × 8 floor is 28 tiles; 2 rows is 48', () => {
    const one = computeTakeoff({
      ...base,
      pattern: { kind: 'border', rows: 1, borderColour: 'red', fieldColour: 'grey' },
    });
    expect(one.tiles.byColour.find((c) => c.colour === 'red')?.full).toBe(28);
    const two = computeTakeoff({
      ...base,
      pattern: { kind: 'border', rows: 2, borderColour: 'red', fieldColour: 'grey' },
    });
    expect(two.tiles.byColour.find((c) => c.colour === 'red')?.full).toBe(48);
    expect(two.tiles.byColour.find((c) => c.colour === 'grey')?.full).toBe(16);
  });

  it('painted bays take the colour of tiles whose centre is inside', () => {
    const r = computeTakeoff({
      ...base,
      pattern: {
        kind: 'bays',
        baseColour: 'grey',
        bays: [{ polygon: rect(0, 0, 2000, 1000), colour: 'yellow' }],
      },
    });
    expect(r.tiles.byColour.map((c) => [c.colour, c.full])).toEqual([
      ['grey', 56],
      ['yellow', 8],
    ]);
  });

  it('orders per colour with overage and whole packs', () => {
    const r = computeTakeoff({
      ...base,
      packSize: 10,
      overagePct: 5,
      pattern: { kind: 'chequer', colours: ['black', 'yellow'] },
    });
    // 32 needed + 5 % = 33.6 → 34 → 4 packs of 10 = 40 per colour.
    expect(r.tiles.byColour.map((c) => [c.toOrder, c.packs])).toEqual([
      [40, 4],
      [40, 4],
    ]);
    expect(r.tiles.toOrder).toBe(80);
    expect(Number.isInteger(r.tiles.toOrder)).toBe(true);
  });
});

describe('angled layouts and plan geometry', () => {
  it('a diagonal (45°) layout covers the same area and its cut pieces lie in the room', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 4000, 3000),
      tile: { pitchMm: 500 },
      gapMm: 5,
      layoutAngleDeg: 45,
    });
    expect(r.tiledAreaM2).toBeCloseTo((3990 * 2990) / 1e6, 9);
    const full = r.tiles.full * 0.25;
    const cutArea = r.plan.cutTiles.reduce((s, c) => s + c.areaMm2, 0) / 1e6;
    expect(full + cutArea).toBeCloseTo(r.tiledAreaM2, 6);
    for (const c of r.plan.cutTiles) {
      for (const ring of c.rings) {
        for (let q = 0; q < ring.length; q += 2) {
          expect(ring[q]).toBeGreaterThan(5 - 1e-6);
          expect(ring[q]).toBeLessThan(3995 + 1e-6);
        }
      }
    }
    const corners = cellCorners(r.plan, 0, 0);
    expect(Math.hypot(corners[1][0] - corners[0][0], corners[1][1] - corners[0][1])).toBeCloseTo(
      500,
      9,
    );
  });

  it('a round room given as a polyline works, corners of facets are not counted', () => {
    const n = 64;
    const circle: Point[] = Array.from({ length: n }, (_, k) => [
      3000 * Math.cos((2 * Math.PI * k) / n),
      3000 * Math.sin((2 * Math.PI * k) / n),
    ]);
    const r = computeTakeoff({
      outline: circle,
      tile: { pitchMm: 500 },
      rates: { cornerMinTurnDeg: 10 },
    });
    expect(r.corners).toEqual({ internal: 0, external: 0 });
    expect(r.tiledAreaM2).toBeGreaterThan(27);
    expect(r.tiles.full + r.tiles.cut).toBeGreaterThan(27 * 4);
  });
});

describe('perimeter quantities, materials, hours and warnings', () => {
  const L: Point[] = [
    [0, 0],
    [8000, 0],
    [8000, 4000],
    [4000, 4000],
    [4000, 6000],
    [0, 6000],
  ];
  const r = computeTakeoff({
    outline: L,
    obstacles: [rect(2000, 2000, 2400, 2400), rect(7500, 1000, 7800, 1300)],
    doorways: [
      { from: [1000, 0], to: [2000, 0], ramp: true },
      { from: [8000, 1000], to: [8000, 1800] },
    ],
    tile: { pitchMm: 500 },
    zones: {
      adhesive: [rect(0, 0, 2000, 2000), rect(7000, -500, 9000, 500)],
      levelling: [{ polygon: rect(5000, 1000, 6000, 2000), depthMm: 10 }],
    },
    rates: { crewSize: 2 },
  });

  it('skirting, corner trims and ramps', () => {
    // Outline 28 m + obstacles 1.6 m + 1.2 m − doorways 1.8 m.
    expect(r.perimeterMm).toBe(28_000 + 1600 + 1200);
    expect(r.skirtingMm).toBe(28_000 + 1600 + 1200 - 1800);
    expect(r.corners).toEqual({ internal: 5, external: 1 + 8 });
    expect(r.rampMm).toBe(1000);
    expect(r.materials.ramps.pieces).toBe(2);
    expect(r.materials.skirting.pieces).toBe(Math.ceil((29_000 * 1.1) / 2500));
  });

  it('adhesive, primer and filler', () => {
    // Adhesive: the 2 × 2 m zone inside the gap line and minus the column is (2000−5)² − 0 − …
    expect(r.materials.adhesive.areaM2).toBeGreaterThan(3.9);
    expect(r.materials.adhesive.areaM2).toBeLessThan(4 + 1);
    expect(r.materials.adhesive.kits).toBe(Math.ceil((r.materials.adhesive.areaM2 * 0.4) / 6));
    // Two fitters lay 8 m²/h each: 20 minutes of pot life covers 5.33 m² per mix.
    expect(r.materials.adhesive.mixes).toBe(Math.ceil(r.materials.adhesive.areaM2 / (16 / 3)));
    expect(r.materials.filler.kg).toBeCloseTo(1 * 10 * 1.6, 9);
    expect(r.materials.filler.bags).toBe(1);
    expect(r.materials.primer.litres).toBeCloseTo(0.15, 9);
    expect(r.materials.anchoring).toMatchObject({ method: 'tape', units: 2 });
  });

  it('hours and crew days', () => {
    const h = r.labour.hours;
    expect(h.total).toBeCloseTo(h.laying + h.cutting + h.adhesive + h.levelling + h.skirting, 1);
    expect(r.labour.crewDays).toBeCloseTo(h.total / 16, 1);
    expect(r.labour.crewDaysRoundedUp).toBe(Math.ceil(r.labour.crewDays));
  });

  it('warns about a column near a wall, a zone outside the floor, and acclimatisation', () => {
    const codes = r.warnings.map((w) => w.code);
    expect(codes).toContain('obstacle-near-wall');
    const near = r.warnings.find((w) => w.code === 'obstacle-near-wall');
    expect(near?.data?.['obstacle']).toBe(1);
    expect(codes).toContain('zone-outside-floor');
    expect(r.warnings.find((w) => w.code === 'zone-outside-floor')?.message).toMatch(
      /zones\.adhesive\[1\]/,
    );
    expect(codes).toContain('acclimatisation');
    expect(r.warnings.find((w) => w.code === 'acclimatisation')?.message).toMatch(/24 h.*15 °C/);
    expect(codes).not.toContain('production-batch');
  });

  it('asks for one batch per colour on a floor larger than a batch', () => {
    const big = computeTakeoff({ outline: rect(0, 0, 40_000, 30_000), tile: { pitchMm: 500 } });
    expect(big.warnings.map((w) => w.code)).toContain('production-batch');
  });

  it('an empty layout is a warning, not a crash', () => {
    const thin = computeTakeoff({ outline: rect(0, 0, 8, 2000), tile: { pitchMm: 500 }, gapMm: 5 });
    expect(thin.tiles.full + thin.tiles.cut).toBe(0);
    expect(thin.warnings.map((w) => w.code)).toContain('empty-layout');
  });
});
