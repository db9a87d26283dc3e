import { describe, expect, it } from 'vitest';
import { computeTakeoff } from './compute';
import type { Point, TakeoffInput } from './types';
import { TakeoffInputError, validateTakeoffInput } from './validate';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];
const base: TakeoffInput = { outline: rect(0, 0, 6000, 5000), tile: { pitchMm: 500 } };

/** The problems for an input, and computeTakeoff throwing the same ones. */
function problems(input: unknown) {
  const list = validateTakeoffInput(input);
  expect(list.length).toBeGreaterThan(0);
  let thrown: unknown;
  try {
    computeTakeoff(input as TakeoffInput);
  } catch (e) {
    thrown = e;
  }
  expect(thrown).toBeInstanceOf(TakeoffInputError);
  expect((thrown as TakeoffInputError).problems).toEqual(list);
  return list;
}

describe('validateTakeoffInput', () => {
  it('accepts a good input, with either winding and a repeated closing point', () => {
    expect(validateTakeoffInput(base)).toEqual([]);
    expect(
      validateTakeoffInput({ ...base, outline: [...rect(0, 0, 6000, 5000)].reverse() }),
    ).toEqual([]);
    expect(validateTakeoffInput({ ...base, outline: [...rect(0, 0, 6000, 5000), [0, 0]] })).toEqual(
      [],
    );
  });

  it('rejects fewer than 3 points', () => {
    expect(
      problems({
        ...base,
        outline: [
          [0, 0],
          [1000, 0],
        ],
      }),
    ).toEqual([
      expect.objectContaining({ field: 'outline', message: expect.stringMatching(/at least 3/) }),
    ]);
  });

  it('rejects a self-intersecting outline and names the point', () => {
    const bowtie: Point[] = [
      [0, 0],
      [4000, 4000],
      [4000, 0],
      [0, 4000],
    ];
    const [p] = problems({ ...base, outline: bowtie });
    expect(p.field).toBe('outline');
    expect(p.message).toMatch(/crosses/);
    expect(p.point?.[0]).toBeCloseTo(2000, 6);
    expect(p.point?.[1]).toBeCloseTo(2000, 6);
  });

  it('rejects an outline that touches itself or folds back', () => {
    expect(
      problems({
        ...base,
        outline: [
          [0, 0],
          [4000, 0],
          [4000, 4000],
          [2000, 0],
          [0, 4000],
        ],
      })[0].field,
    ).toBe('outline');
    expect(
      problems({
        ...base,
        outline: [
          [0, 0],
          [4000, 0],
          [2000, 0],
          [2000, 3000],
        ],
      })[0].message,
    ).toMatch(/crosses|zero/);
  });

  it('rejects zero area', () => {
    expect(
      problems({
        ...base,
        outline: [
          [0, 0],
          [1000, 0],
          [3000, 0],
        ],
      })[0],
    ).toMatchObject({ field: 'outline', message: expect.stringMatching(/zero area/) });
  });

  it('rejects an obstacle outside the outline, naming it and the point', () => {
    const [p] = problems({
      ...base,
      obstacles: [rect(1000, 1000, 1400, 1400), rect(5800, 1000, 6200, 1400)],
    });
    expect(p).toMatchObject({ field: 'obstacles[1]', message: expect.stringMatching(/outside/) });
    expect(p.point).toEqual([6200, 1000]);
  });

  it('rejects an obstacle that crosses a reflex wall while its corners are inside', () => {
    const L: Point[] = [
      [0, 0],
      [6000, 0],
      [6000, 3000],
      [3000, 3000],
      [3000, 6000],
      [0, 6000],
    ];
    // Corners all inside the L, but the edge from (2000, 5000) to (5000, 2000) leaves it.
    const [p] = problems({
      ...base,
      outline: L,
      obstacles: [
        [
          [2000, 5000],
          [2000, 2000],
          [5000, 2000],
        ],
      ],
    });
    expect(p.field).toBe('obstacles[0]');
  });

  it('accepts a column standing against a wall, rejects two overlapping columns', () => {
    expect(validateTakeoffInput({ ...base, obstacles: [rect(0, 1000, 400, 1400)] })).toEqual([]);
    expect(
      validateTakeoffInput({
        ...base,
        obstacles: [rect(1000, 1000, 1400, 1400), rect(1400, 1000, 1800, 1400)],
      }),
    ).toEqual([]);
    const [p] = problems({
      ...base,
      obstacles: [rect(1000, 1000, 1400, 1400), rect(1200, 1200, 1600, 1600)],
    });
    expect(p).toMatchObject({ field: 'obstacles[1]', message: 'overlaps obstacles[0]' });
    expect(p.point).toBeDefined();
    // Identical and nested columns overlap too.
    expect(
      problems({
        ...base,
        obstacles: [rect(1000, 1000, 1400, 1400), rect(1000, 1000, 1400, 1400)],
      })[0].field,
    ).toBe('obstacles[1]');
    expect(
      problems({
        ...base,
        obstacles: [rect(1000, 1000, 2400, 2400), rect(1200, 1200, 1400, 1400)],
      })[0].field,
    ).toBe('obstacles[1]');
  });

  it('rejects a doorway not on an edge', () => {
    expect(
      validateTakeoffInput({ ...base, doorways: [{ from: [1000, 0], to: [1900, 0] }] }),
    ).toEqual([]);
    const [p] = problems({
      ...base,
      doorways: [
        { from: [1000, 0], to: [1900, 0] },
        { from: [1000, 10], to: [1900, 10] },
      ],
    });
    expect(p).toMatchObject({
      field: 'doorways[1]',
      message: expect.stringMatching(/not on an edge/),
      point: [1000, 10],
    });
    // Both ends on the outline but on different walls: not one opening.
    expect(problems({ ...base, doorways: [{ from: [5000, 0], to: [6000, 1000] }] })[0].field).toBe(
      'doorways[0]',
    );
  });

  it('rejects a floor narrower than twice the gap, where the gap would close up', () => {
    // Found by the random point-soup test: the inward offset of a 1 mm² sliver of a floor
    // turns inside out, and was tiled as 2.6 mm². Wider floors with short jogs still pass.
    for (const outline of [
      [
        [0, 0],
        [0, -1],
        [-2, 0],
      ],
      [
        [0, 1],
        [0, 0],
        [3, 3],
        [-6, -7],
      ],
    ] as Point[][]) {
      const problems = validateTakeoffInput({ outline, tile: { pitchMm: 500 }, gapMm: 1 });
      expect(problems.map((p) => p.field)).toContain('gapMm');
    }
    const jog: Point[] = [
      [0, 0],
      [1350, 0],
      [1350, 150],
      [1500, 150],
      [1500, 1350],
      [1350, 1350],
      [1350, 1500],
      [1336.5, 1500],
      [0, 1500],
    ];
    expect(validateTakeoffInput({ outline: jog, tile: { pitchMm: 250 }, gapMm: 20 })).toEqual([]);
  });

  it('rejects pitch outside 100–1500 mm and gap outside 0–50 mm', () => {
    expect(problems({ ...base, tile: { pitchMm: 99 } })[0]).toMatchObject({
      field: 'tile.pitchMm',
    });
    expect(problems({ ...base, tile: { pitchMm: 1501 } })[0]).toMatchObject({
      field: 'tile.pitchMm',
    });
    expect(validateTakeoffInput({ ...base, tile: { pitchMm: 100 } })).toEqual([]);
    expect(validateTakeoffInput({ ...base, tile: { pitchMm: 1500 } })).toEqual([]);
    expect(problems({ ...base, gapMm: -1 })[0]).toMatchObject({ field: 'gapMm' });
    expect(problems({ ...base, gapMm: 51 })[0]).toMatchObject({ field: 'gapMm' });
    expect(validateTakeoffInput({ ...base, gapMm: 0 })).toEqual([]);
    expect(validateTakeoffInput({ ...base, gapMm: 50 })).toEqual([]);
  });

  it('rejects an area over 100,000 m²', () => {
    expect(validateTakeoffInput({ ...base, outline: rect(0, 0, 316_000, 316_000) })).toEqual([]);
    expect(problems({ ...base, outline: rect(0, 0, 317_000, 317_000) })[0]).toMatchObject({
      field: 'outline',
      message: expect.stringMatching(/100000 m²/),
    });
  });

  it('rejects more than 5,000 vertices', () => {
    const circle = (n: number): Point[] =>
      Array.from({ length: n }, (_, k) => [
        20_000 * Math.cos((2 * Math.PI * k) / n),
        20_000 * Math.sin((2 * Math.PI * k) / n),
      ]);
    expect(validateTakeoffInput({ ...base, outline: circle(5000) })).toEqual([]);
    expect(problems({ ...base, outline: circle(5001) })[0]).toMatchObject({
      field: 'outline',
      message: expect.stringMatching(/5000 vertices/),
    });
    const cols = Array.from({ length: 30 }, (_, k) =>
      rect(-1000 + k * 50, -100, -980 + k * 50, 100),
    );
    expect(problems({ ...base, outline: circle(4900), obstacles: cols })[0]).toMatchObject({
      field: 'obstacles',
    });
  });

  it('reports malformed values by field, never crashes', () => {
    const bad: unknown[] = [
      null,
      42,
      {},
      { outline: 'square', tile: { pitchMm: 500 } },
      {
        outline: [
          [0, 0],
          [1, 'a'],
          [2, 2],
        ],
        tile: { pitchMm: 500 },
      },
      { ...base, tile: {} },
      { ...base, obstacles: [[[0, 0]]] },
      { ...base, origin: 'middle' },
      { ...base, packSize: 2.5 },
      { ...base, overagePct: -3 },
      { ...base, minCutMm: 600 },
      { ...base, pattern: { kind: 'plaid' } },
      { ...base, pattern: { kind: 'chequer', colours: ['red'] } },
      { ...base, zones: { levelling: [{ polygon: rect(0, 0, 100, 100), depthMm: 0 }] } },
      { ...base, rates: { crewSize: 0 } },
      { ...base, rates: { nonsense: 1 } },
      { ...base, doorways: [{ from: [0, 0] }] },
      {
        ...base,
        outline: [
          [0, 0],
          [NaN, 0],
          [1, 1],
        ],
      },
    ];
    const fields = bad.map((input) => problems(input)[0].field);
    expect(fields).toEqual([
      '',
      '',
      'tile',
      'outline',
      'outline[1]',
      'tile.pitchMm',
      'obstacles[0]',
      'origin',
      'packSize',
      'overagePct',
      'minCutMm',
      'pattern.kind',
      'pattern.colours',
      'zones.levelling[0].depthMm',
      'rates.crewSize',
      'rates.nonsense',
      'doorways[0].to',
      'outline[1]',
    ]);
  });
});

describe('never a crash', () => {
  it('random point soups either validate with problems (TakeoffInputError) or compute finite results', async () => {
    const fc = (await import('fast-check')).default;
    const pt = fc.tuple(
      fc.integer({ min: -5000, max: 5000 }),
      fc.integer({ min: -5000, max: 5000 }),
    );
    fc.assert(
      fc.property(
        fc.array(pt, { minLength: 0, maxLength: 10 }),
        fc.array(fc.array(pt, { minLength: 2, maxLength: 5 }), { maxLength: 3 }),
        fc.integer({ min: 0, max: 50 }),
        fc.integer({ min: 100, max: 1500 }),
        fc.oneof(
          fc.constant<'auto'>('auto'),
          fc.constant<'centre'>('centre'),
          fc.record({ x: fc.integer(), y: fc.integer() }),
        ),
        fc.integer({ min: -90, max: 90 }),
        fc.constantFrom<TakeoffInput['pattern']>(
          undefined,
          { kind: 'chequer', colours: ['a', 'b'] },
          { kind: 'border', rows: 2, borderColour: 'a', fieldColour: 'b' },
          { kind: 'stripes', colours: ['a', 'b', 'c'], direction: 'columns' },
        ),
        (outline, obstacles, gapMm, pitchMm, origin, layoutAngleDeg, pattern) => {
          const input = {
            pattern,
            outline: outline as Point[],
            obstacles: obstacles as Point[][],
            gapMm,
            tile: { pitchMm },
            origin,
            layoutAngleDeg,
          };
          const list = validateTakeoffInput(input);
          if (list.length) {
            expect(() => computeTakeoff(input)).toThrow(TakeoffInputError);
            for (const p of list) expect(typeof p.field).toBe('string');
            return;
          }
          const r = computeTakeoff(input);
          for (const v of [
            r.netAreaM2,
            r.tiledAreaM2,
            r.perimeterMm,
            r.tiles.toOrder,
            r.labour.hours.total,
          ])
            expect(Number.isFinite(v)).toBe(true);
          expect(
            Number.isInteger(r.tiles.toOrder) &&
              Number.isInteger(r.tiles.full) &&
              Number.isInteger(r.tiles.cut),
          ).toBe(true);
          expect(r.tiledAreaM2).toBeLessThanOrEqual(r.netAreaM2 + 1e-9);
          const sum = (f: (c: (typeof r.tiles.byColour)[number]) => number) =>
            r.tiles.byColour.reduce((t, c) => t + f(c), 0);
          expect([sum((c) => c.full), sum((c) => c.cut), sum((c) => c.toOrder)]).toEqual([
            r.tiles.full,
            r.tiles.cut,
            r.tiles.toOrder,
          ]);
          expect(r.plan.cutTiles).toHaveLength(r.tiles.cut);
          // The tiles cover exactly the tiled region.
          const covered =
            r.tiles.full * pitchMm * pitchMm + r.plan.cutTiles.reduce((s, c) => s + c.areaMm2, 0);
          expect(Math.abs(covered - r.tiledAreaM2 * 1e6)).toBeLessThan(
            1 + 1e-6 * r.tiledAreaM2 * 1e6 + (r.tiles.full + r.tiles.cut) * 1,
          );
        },
      ),
      { numRuns: 300 },
    );
  });
});
