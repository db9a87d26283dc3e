import { validateTakeoffInput, type Point } from '@latchwork/takeoff';
import { showProblem } from './problem-text';

const bowTie: Point[] = [
  [0, 0],
  [4000, 0],
  [4000, 3000],
  [2000, 4000],
  [6000, 5000],
  [0, 3000],
];

describe('validation problems as the page shows them', () => {
  it('names the outline point whose wall makes the walls cross', () => {
    // The wall from point 5 back to point 6 crosses the wall 3→4 at (2400, 3800) (solving
    // y = 3000 + x/3 and y = 3000 + (4000 − x)/2 by hand): point 6 is the last corner typed.
    const problems = validateTakeoffInput({ outline: bowTie, tile: { pitchMm: 500 } });
    expect(problems).toHaveLength(1);
    const shown = showProblem(problems[0], bowTie, 'metric');
    expect(shown.section).toBe('outline');
    expect(shown.text).toBe('Outline point 6 makes the walls cross (at 2.4 m, 3.8 m)');
  });

  it('names obstacles and scalars in the page’s words, in their form sections', () => {
    const square: Point[] = [
      [0, 0],
      [3000, 0],
      [3000, 3000],
      [0, 3000],
    ];
    const problems = validateTakeoffInput({
      outline: square,
      obstacles: [
        [
          [2500, 2500],
          [3500, 2500],
          [3500, 3500],
          [2500, 3500],
        ],
      ],
      tile: { pitchMm: 50 },
    }).map((p) => showProblem(p, square, 'metric'));
    expect(problems.map((p) => [p.section, p.text.replace(/ \(at .*\)$/, '')])).toEqual([
      ['layout', 'Tile pitch must be between 100 and 1500 mm (got 50)'],
      ['obstacles', 'Obstacle 1 lies (partly) outside the outline'],
    ]);
  });

  it('does not pin "too few points" on a corner', () => {
    const two: Point[] = [
      [0, 0],
      [1000, 0],
    ];
    const [problem] = validateTakeoffInput({ outline: two, tile: { pitchMm: 500 } });
    expect(showProblem(problem, two, 'metric').text).toMatch(/^Outline: needs at least 3/);
  });
});
