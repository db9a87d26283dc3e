import { formatCoordinates, parseCoordinates } from './coordinates';
import { formatLengthInput, parseLength } from './lengths';

describe('lengths as typed', () => {
  it('reads metric lengths in mm by default, and m or cm when marked', () => {
    expect(parseLength('6000', 'metric')).toBe(6000);
    expect(parseLength('6.5 m', 'metric')).toBe(6500);
    expect(parseLength('45cm', 'metric')).toBe(450);
    expect(parseLength('-120', 'metric')).toBe(-120);
    expect(parseLength('six', 'metric')).toBeNull();
  });

  it('reads feet and inches with the exact NIST SP 811 factors', () => {
    // NIST SP 811 appendix B: 1 ft = 0.3048 m, 1 in = 0.0254 m exactly.
    expect(parseLength(`19' 8"`, 'imperial')).toBeCloseTo(19 * 304.8 + 8 * 25.4, 9);
    expect(parseLength('10 ft 6 in', 'imperial')).toBeCloseTo(3200.4, 9);
    expect(parseLength(`6 1/2"`, 'imperial')).toBeCloseTo(165.1, 9);
    expect(parseLength('20', 'imperial')).toBeCloseTo(6096, 9);
    expect(parseLength('18', 'imperial', 'in')).toBeCloseTo(457.2, 9);
    expect(parseLength(`12'`, 'imperial')).toBeCloseTo(3657.6, 9);
  });

  it('writes lengths back in a form it reads', () => {
    expect(formatLengthInput(6096, 'imperial')).toBe(`20'`);
    expect(formatLengthInput(19 * 304.8 + 8.25 * 25.4, 'imperial')).toBe(`19' 8.25"`);
    expect(formatLengthInput(5, 'imperial')).toBe(`0.2"`);
    expect(formatLengthInput(457.2, 'metric')).toBe('457.2');
    for (const mm of [0, 304.8, 4876.8, 12345.6]) {
      expect(parseLength(formatLengthInput(mm, 'imperial'), 'imperial')).toBeCloseTo(mm, 0);
    }
  });
});

describe('pasting coordinates', () => {
  it('reads mm pairs separated by commas, tabs or semicolons, skipping blanks and comments', () => {
    const { points, errors } = parseCoordinates(
      '# garage\n0, 0\n6000\t0\n\n6000;6500\n0 6500\n',
      'metric',
    );
    expect(errors).toEqual([]);
    expect(points).toEqual([
      [0, 0],
      [6000, 0],
      [6000, 6500],
      [0, 6500],
    ]);
  });

  it('reads feet and inches: a 20 × 10 ft room is 6096 × 3048 mm (NIST SP 811: 1 ft = 304.8 mm)', () => {
    const { points, errors } = parseCoordinates(`0, 0\n20', 0\n20' 0", 10'\n0, 120"`, 'imperial');
    expect(errors).toEqual([]);
    expect(points[2][0]).toBeCloseTo(6096, 9);
    expect(points[2][1]).toBeCloseTo(3048, 9);
    expect(points[3][1]).toBeCloseTo(3048, 9);
  });

  it('names the line it cannot read', () => {
    const { points, errors } = parseCoordinates('0, 0\n4000, abc\n4000\n', 'metric');
    expect(points).toHaveLength(1);
    expect(errors.map((e) => e.message)).toEqual([
      'Line 2: cannot read "abc" as a length',
      'Line 3: write one point as "x, y"',
    ]);
  });

  it('round-trips the text it writes', () => {
    const points: [number, number][] = [
      [0, 0],
      [4876.8, 0],
      [4876.8, 3048],
    ];
    const back = parseCoordinates(formatCoordinates(points, 'imperial'), 'imperial').points;
    back.forEach((p, k) => {
      expect(p[0]).toBeCloseTo(points[k][0], 6);
      expect(p[1]).toBeCloseTo(points[k][1], 6);
    });
  });
});
