import { basisPointsToPercent, percentToBasisPoints } from './tax-rate';

describe('tax rate as a percentage ⇄ basis points', () => {
  // Worked examples, common practice of percent arithmetic: 1 % = 100 basis points,
  // 0.01 % = 1 basis point.
  it.each([
    ['20', 2000],
    ['17.5', 1750],
    ['0.01', 1],
    ['5', 500],
    ['12.75', 1275],
    ['0', 0],
    ['100', 10000],
    ['8.1', 810],
    ['8.10', 810],
    ['0.29', 29], // 0.29 * 100 is 28.999… in floating point: the digits are parsed instead.
    ['19,6', 1960], // a decimal comma as typed in much of Europe
    [' 20 % ', 2000],
  ])('"%s" %% is %i basis points', (text, bp) => {
    expect(percentToBasisPoints(text)).toBe(bp);
  });

  it.each(['', 'abc', '20.125', '-5', '100.01', '1000', '1e2', '.5', '20.', '2 0'])(
    'refuses "%s"',
    (text) => {
      expect(percentToBasisPoints(text)).toBeNull();
    },
  );

  // Worked examples, common practice: 2000 bp = 20 %, 1750 bp = 17.5 %, 1 bp = 0.01 %.
  it.each([
    [2000, '20'],
    [1750, '17.5'],
    [1, '0.01'],
    [10, '0.1'],
    [1275, '12.75'],
    [0, '0'],
    [10000, '100'],
  ])('%i basis points shows as "%s"', (bp, text) => {
    expect(basisPointsToPercent(bp)).toBe(text);
  });

  it('returns every rate from 0 to 100 % unchanged through the text and back', () => {
    for (let bp = 0; bp <= 10000; bp++) {
      expect(percentToBasisPoints(basisPointsToPercent(bp))).toBe(bp);
    }
  });

  it('refuses fractional or negative basis points', () => {
    expect(() => basisPointsToPercent(12.5)).toThrow(RangeError);
    expect(() => basisPointsToPercent(-1)).toThrow(RangeError);
  });
});
