import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { extendCost, formatMoney, parseMoney } from './money';
import { formatPacks, formatQuantity, packsToCover, parseQuantity } from './quantity';
import { divRound, mulDivRound } from './rounding';

const tiles = { unit: { one: 'tile', other: 'tiles' }, pack: { one: 'box', other: 'boxes' } };
const metres = { unit: { one: 'metre', other: 'metres' }, pack: { one: 'coil', other: 'coils' } };

/** ECMA-402 Intl.NumberFormat rounds exact decimal strings by a named roundingMode. */
const intlRound = (n: bigint, d: bigint, mode: 'halfEven' | 'halfExpand'): bigint => {
  const neg = n < 0n !== d < 0n;
  const [a, b] = [n < 0n ? -n : n, d < 0n ? -d : d];
  // a ÷ b as an exact decimal string with enough places to decide the tie (b divides 10^k·a
  // when b is made of 2s and 5s; other divisors never produce an exact .5 tie).
  const places = 40n;
  const scaled = (a * 10n ** places) / b;
  const s = scaled.toString().padStart(Number(places) + 1, '0');
  const text = `${neg ? '-' : ''}${s.slice(0, -Number(places))}.${s.slice(-Number(places))}`;
  const fmt = new Intl.NumberFormat('en-US', {
    maximumFractionDigits: 0,
    roundingMode: mode,
    useGrouping: false,
  } as Intl.NumberFormatOptions);
  return BigInt(fmt.format(text as unknown as number).replace('−', '-'));
};

describe('rounding rules', () => {
  it('ties: half-even vs half-away-from-zero (worked by hand, "from memory")', () => {
    expect(divRound(5n, 2n)).toBe(2n); // 2.5 → 2 (even)
    expect(divRound(7n, 2n)).toBe(4n); // 3.5 → 4 (even)
    expect(divRound(-5n, 2n)).toBe(-2n);
    expect(divRound(5n, 2n, 'half-away-from-zero')).toBe(3n);
    expect(divRound(-5n, 2n, 'half-away-from-zero')).toBe(-3n);
    expect(divRound(5n, -2n, 'half-away-from-zero')).toBe(-3n);
  });

  it('matches ECMA-402 Intl.NumberFormat roundingMode halfEven / halfExpand (Node Intl)', () => {
    fc.assert(
      fc.property(
        fc.bigInt({ min: -(10n ** 15n), max: 10n ** 15n }),
        fc.constantFrom(1n, 2n, 4n, 8n, 10n, 20n, 25n, 100n, 1000n, 3n, 7n, -2n, -100n),
        (n, d) => {
          expect(divRound(n, d, 'half-even')).toBe(intlRound(n, d, 'halfEven'));
          expect(divRound(n, d, 'half-away-from-zero')).toBe(intlRound(n, d, 'halfExpand'));
        },
      ),
    );
  });

  it('mulDivRound is exact beyond 2^53 intermediate products (arithmetic)', () => {
    // 9e15 × 3 would lose digits as a float; the result 2.7e16/3 = 9e15 is exact.
    expect(mulDivRound(9_000_000_000_000_000 / 1000, 3000, 3)).toBe(9_000_000_000_000_000);
    expect(() => mulDivRound(2 ** 53, 1, 1)).toThrow(RangeError);
  });
});

describe('money in minor units', () => {
  it('parses and prints exact decimals (arithmetic)', () => {
    expect(parseMoney('40.00')).toBe(4000);
    expect(parseMoney('-0.05')).toBe(-5);
    expect(parseMoney('12')).toBe(1200);
    expect(parseMoney('1.234', 3)).toBe(1234); // KWD has 3 minor digits (ISO 4217)
    expect(parseMoney('500', 0)).toBe(500); // JPY has none (ISO 4217)
    expect(() => parseMoney('1.005')).toThrow(/more than 2/);
    expect(() => parseMoney('1e3')).toThrow(RangeError);
    expect(formatMoney(4300)).toBe('43.00');
    expect(formatMoney(-5)).toBe('-0.05');
    expect(formatMoney(1234, 3)).toBe('1.234');
  });

  it('round-trips every amount (property, arithmetic)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 3 }), (m, d) => {
        expect(parseMoney(formatMoney(m, d), d)).toBe(m);
      }),
    );
  });

  it('extends a quantity at a unit cost, rounding once (arithmetic)', () => {
    expect(extendCost(12, 4300)).toBe(51600); // 12 × 43.00
    expect(extendCost(2345, 300, 3)).toBe(704); // 2.345 m × 3.00 = 7.035 → 7.04 (half-even)
    expect(extendCost(2355, 300, 3)).toBe(706); // 7.065 → 7.06 (half-even)
    expect(extendCost(2355, 300, 3, 'half-away-from-zero')).toBe(707);
  });
});

describe('quantities and packs', () => {
  it('formats packs with singular and plural (common practice)', () => {
    expect(formatPacks(77, 24, tiles)).toBe('3 boxes + 5 tiles');
    expect(formatPacks(25, 24, tiles)).toBe('1 box + 1 tile');
    expect(formatPacks(48, 24, tiles)).toBe('2 boxes');
    expect(formatPacks(24, 24, tiles)).toBe('1 box');
    expect(formatPacks(5, 24, tiles)).toBe('5 tiles');
    expect(formatPacks(1, 24, tiles)).toBe('1 tile');
    expect(formatPacks(0, 24, tiles)).toBe('0 tiles');
    expect(formatPacks(-77, 24, tiles)).toBe('-(3 boxes + 5 tiles)');
    expect(formatPacks(-48, 24, tiles)).toBe('-2 boxes');
    expect(formatPacks(7, 1, tiles)).toBe('7 tiles');
  });

  it('formats divisible units with their decimals (common practice)', () => {
    // 55.5 m of trim in 25 m coils: 2 coils + 5.5 metres.
    expect(formatPacks(55_500, 25_000, metres, 3)).toBe('2 coils + 5.5 metres');
    expect(formatPacks(1000, 25_000, metres, 3)).toBe('1 metre');
    expect(formatPacks(1500, 25_000, metres, 3)).toBe('1.5 metres');
    expect(parseQuantity('2.5', 3)).toBe(2500);
    expect(formatQuantity(2500, 3)).toBe('2.5');
    expect(formatQuantity(3000, 3)).toBe('3');
    expect(() => parseQuantity('2.5')).toThrow(RangeError); // tiles are whole
  });

  it('packs × size + loose always gives back the quantity (property, arithmetic)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 100_000 }),
        fc.integer({ min: 2, max: 500 }),
        (q, size) => {
          const text = formatPacks(q, size, tiles);
          const packs = /(\d+) box/.exec(text)?.[1] ?? '0';
          const loose = /(\d+) tiles?$/.exec(text)?.[1] ?? '0';
          expect(Number(packs) * size + Number(loose)).toBe(q);
          expect(packsToCover(q, size) * size).toBeGreaterThanOrEqual(q);
          expect((packsToCover(q, size) - 1) * size).toBeLessThan(q);
        },
      ),
    );
  });
});
