/**
 * Checks against outside references; each names its source.
 */
import Flatten from '@flatten-js/core';
import fc from 'fast-check';
import pc from 'polygon-clipping';
import { describe, expect, it } from 'vitest';
import { computeTakeoff } from './compute';
import type { Point } from './types';
import { feetInchesFromMm, ft2FromM2, m2FromFt2, mmFromFeetInches, mmFromInches } from './units';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

describe('areas and perimeters against @flatten-js/core (general-purpose geometry library)', () => {
  const starArb = fc
    .record({
      n: fc.integer({ min: 3, max: 24 }),
      radii: fc.array(fc.integer({ min: 500, max: 1000 }), { minLength: 24, maxLength: 24 }),
      scale: fc.integer({ min: 2, max: 20 }),
      cw: fc.boolean(),
      holes: fc.integer({ min: 0, max: 3 }),
    })
    .map(({ n, radii, scale, cw, holes }) => {
      const outline: Point[] = Array.from({ length: n }, (_, k) => {
        const t = (k / n) * 2 * Math.PI;
        return [radii[k] * scale * Math.cos(t), radii[k] * scale * Math.sin(t)];
      });
      if (cw) outline.reverse();
      // Small squares near the centre, well inside any of these stars.
      const obstacles = Array.from({ length: holes }, (_, k) =>
        rect(k * 300 - 450, -100, k * 300 - 250, 100),
      );
      return { outline, obstacles };
    });

  it('netAreaM2 and perimeterMm match Flatten Polygon.area() and Face.perimeter (either winding)', () => {
    fc.assert(
      fc.property(starArb, ({ outline, obstacles }) => {
        const r = computeTakeoff({
          outline,
          obstacles,
          tile: { pitchMm: 500 },
          suggestOrigin: false,
        });
        const outer = new Flatten.Polygon(outline);
        const faces = [...outer.faces] as Flatten.Face[];
        let area = outer.area();
        let per = faces.reduce((s, f) => s + f.perimeter, 0);
        for (const ob of obstacles) {
          const hole = new Flatten.Polygon(ob);
          area -= hole.area();
          per += ([...hole.faces] as Flatten.Face[]).reduce((s, f) => s + f.perimeter, 0);
        }
        expect(r.netAreaM2 * 1e6).toBeCloseTo(area, 3);
        expect(r.perimeterMm).toBeCloseTo(per, 6);
      }),
      { numRuns: 100 },
    );
  });

  it('tiledAreaM2 matches polygon-clipping on the offset region (worked by hand for a rectangle)', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 6000, 6500),
      obstacles: [rect(1000, 1000, 1400, 1400)],
      tile: { pitchMm: 500 },
      gapMm: 5,
    });
    const region = pc.difference([rect(5, 5, 5995, 6495)], [rect(995, 995, 1405, 1405)]);
    const ring = region[0][0];
    let a = 0;
    for (let k = 0; k < ring.length - 1; k++)
      a += ring[k][0] * ring[k + 1][1] - ring[k + 1][0] * ring[k][1];
    const hole = 410 * 410;
    expect(r.tiledAreaM2 * 1e6).toBeCloseTo(Math.abs(a) / 2 - (region[0].length > 1 ? hole : 0), 3);
    expect(r.tiledAreaM2 * 1e6).toBeCloseTo(5990 * 6490 - hole, 3);
  });
});

describe('worked examples', () => {
  it('500 mm tiles lay at 4 per m² (common practice)', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 10_000, 10_000),
      tile: { pitchMm: 500 },
      gapMm: 0,
      origin: { x: 0, y: 0 },
    });
    expect(r.tiles.perM2).toBe(4);
    expect(r.tiles.full).toBe(400);
    expect(r.tiles.cut).toBe(0);
    expect(r.tiles.full / r.tiledAreaM2).toBe(4);
  });

  it('a 490 mm pitch gives 4.165 tiles per m² (common practice)', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 4900, 4900),
      tile: { pitchMm: 490 },
      gapMm: 0,
      origin: { x: 0, y: 0 },
    });
    expect(r.tiles.perM2).toBeCloseTo(4.165, 3);
    expect(r.tiles.full).toBe(100);
    expect(r.tiles.full / r.tiledAreaM2).toBeCloseTo(4.165, 3);
  });

  it('a 6.0 m × 6.5 m garage, 5 mm gap, 500 mm pitch, grid from a wall: 13 × 12 = 156 tiles (from memory)', () => {
    const r = computeTakeoff({
      outline: rect(0, 0, 6000, 6500),
      tile: { pitchMm: 500 },
      gapMm: 5,
      origin: { x: 5, y: 5 },
    });
    // 5990 mm across: 11 whole + 1 cut = 12; 6490 mm along: 12 whole + 1 cut = 13.
    expect(r.tiles.full + r.tiles.cut).toBe(156);
    expect(r.tiles.full).toBe(11 * 12);
    expect(r.tiles.cut).toBe(13 + 11); // the cut column (13 cells, corner included) and the cut row
    expect(r.tiles.needed).toBe(156);
    expect(r.cuts.smallestMm).toBeCloseTo(490, 9);
    expect(r.netAreaM2).toBe(39);
    expect(r.perimeterMm).toBe(25_000);
    expect(r.corners).toEqual({ internal: 4, external: 0 });
  });
});

describe('imperial entry against NIST SP 811 (1 ft = 0.3048 m, 1 in = 25.4 mm, 1 ft² = 0.09290304 m²)', () => {
  it('converts lengths exactly', () => {
    expect(mmFromFeetInches(1)).toBe(304.8);
    expect(mmFromFeetInches(0, 1)).toBe(25.4);
    expect(mmFromInches(12)).toBeCloseTo(304.8, 12);
    expect(mmFromFeetInches(20, 6)).toBeCloseTo(20 * 304.8 + 6 * 25.4, 9);
    expect(feetInchesFromMm(mmFromFeetInches(12, 7.5))).toEqual({
      feet: 12,
      inches: expect.closeTo(7.5, 9),
    });
    expect(feetInchesFromMm(304.8)).toEqual({ feet: 1, inches: 0 });
  });

  it('converts areas exactly', () => {
    expect(m2FromFt2(1)).toBe(0.09290304);
    expect(m2FromFt2(100)).toBeCloseTo(9.290304, 12);
    expect(ft2FromM2(0.09290304)).toBe(1);
    // 0.3048² = 0.09290304: the two factors agree.
    expect(0.3048 * 0.3048).toBeCloseTo(0.09290304, 15);
  });

  it('a 20 ft × 24 ft garage entered in feet has 480 ft² = 44.5934592 m²', () => {
    const w = mmFromFeetInches(20);
    const l = mmFromFeetInches(24);
    const r = computeTakeoff({
      outline: rect(0, 0, w, l),
      tile: { pitchMm: mmFromInches(18) },
      gapMm: 0,
    });
    expect(r.netAreaM2).toBeCloseTo(m2FromFt2(480), 9);
    expect(ft2FromM2(r.netAreaM2)).toBeCloseTo(480, 9);
  });
});
