import { closeWalk, pointsFromWalk, walkFromPoints, type Walk } from './wall-walk';

const left = (lengthMm: number, turnDeg = 90) => ({ lengthMm, turnDeg, turn: 'left' as const });

describe('walking the walls', () => {
  it('closes a 4 × 3 m rectangle walked with four 90° turns exactly', () => {
    // Plane geometry: four left turns of 90° bring the heading back to the start.
    const walk: Walk = {
      start: [0, 0],
      headingDeg: 0,
      walls: [left(4000), left(3000), left(4000), left(3000)],
    };
    const { points, gapMm } = pointsFromWalk(walk);
    expect(gapMm).toBe(0);
    expect(points).toEqual([
      [0, 0],
      [4000, 0],
      [4000, 3000],
      [0, 3000],
    ]);
  });

  it('walks a regular hexagon of 1 m walls with 60° turns back to the start', () => {
    // A regular hexagon's exterior angle is 360° / 6 = 60°; its corners are
    // (1000, 0) steps rotated by 60°: cos 60° = 1/2, sin 60° = √3/2 (from memory).
    const walk: Walk = {
      start: [0, 0],
      headingDeg: 0,
      walls: Array.from({ length: 6 }, () => left(1000, 60)),
    };
    const { points, gapMm } = pointsFromWalk(walk);
    const h = (1000 * Math.sqrt(3)) / 2;
    const expected = [
      [0, 0],
      [1000, 0],
      [1500, h],
      [1000, 2 * h],
      [0, 2 * h],
      [-500, h],
    ];
    expect(gapMm).toBe(0);
    expect(points).toHaveLength(6);
    points.forEach((p, k) => {
      expect(p[0]).toBeCloseTo(expected[k][0], 3);
      expect(p[1]).toBeCloseTo(expected[k][1], 3);
    });
  });

  it('turns right clockwise, and reports how far an open walk ends from the start', () => {
    const walk: Walk = {
      start: [100, 200],
      headingDeg: 90,
      walls: [
        { lengthMm: 2000, turnDeg: 90, turn: 'right' },
        { lengthMm: 1000, turnDeg: 90, turn: 'right' },
      ],
    };
    const { points, gapMm } = pointsFromWalk(walk);
    expect(points).toEqual([
      [100, 200],
      [100, 2200],
      [1100, 2200],
    ]);
    // Pythagoras: the missing wall runs from (1100, 2200) back to (100, 200).
    expect(gapMm).toBeCloseTo(Math.hypot(1000, 2000), 3);
  });

  it('closes an open walk with the wall back to the start and the right turn before it', () => {
    const open: Walk = {
      start: [0, 0],
      headingDeg: 0,
      walls: [left(4000), left(3000), left(4000)],
    };
    const closed = closeWalk(open);
    expect(closed.walls).toHaveLength(4);
    expect(closed.walls[2]).toMatchObject({ turnDeg: 90, turn: 'left' });
    expect(closed.walls[3].lengthMm).toBe(3000);
    expect(pointsFromWalk(closed).gapMm).toBe(0);
  });

  it('reads the walk back from an outline, an L-shaped room with a right turn', () => {
    const outline: [number, number][] = [
      [0, 0],
      [6000, 0],
      [6000, 3000],
      [3000, 3000],
      [3000, 5000],
      [0, 5000],
    ];
    const walk = walkFromPoints(outline);
    expect(walk.walls.map((w) => w.lengthMm)).toEqual([6000, 3000, 3000, 2000, 3000, 5000]);
    expect(walk.walls.map((w) => `${w.turn} ${w.turnDeg}`)).toEqual([
      'left 90',
      'left 90',
      'right 90',
      'left 90',
      'left 90',
      'left 90',
    ]);
    expect(pointsFromWalk(walk).points).toEqual(outline);
  });
});
