import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { BatchStock } from './picking';
import { fefoPickingList } from './picking';
import { chooseBatches } from './reserve';

const today = '2025-06-01';
const b = (
  code: string,
  onHand: number,
  received: string,
  expiry?: string,
  reserved = 0,
): BatchStock => ({
  code,
  onHand,
  reserved,
  received,
  expiry,
});

describe('chooseBatches', () => {
  it('one batch covers it: the best fit, leaving least behind (our rule, see reserve.ts)', () => {
    const tiles = [
      b('A', 500, '2025-01-10'),
      b('B', 130, '2025-02-01'),
      b('C', 200, '2025-03-01', undefined, 60),
    ];
    // Need 120: A leaves 380, B leaves 10, C (200 − 60 reserved = 140) leaves 20 → B.
    expect(chooseBatches(tiles, 120, { today })).toEqual({
      picks: [{ code: 'B', quantity: 120, expiry: null, expired: false }],
      warning: null,
      shortBy: 0,
    });
  });

  it('equal fit goes to the earlier received (FEFO tie-break, common practice)', () => {
    const r = chooseBatches([b('LATE', 50, '2025-05-01'), b('EARLY', 50, '2025-01-01')], 40, {
      today,
    });
    expect(r.picks[0].code).toBe('EARLY');
  });

  it('expiring goods go first-expiry-first before fit (FEFO, common practice)', () => {
    const kits = [b('K1', 40, '2025-01-01', '2025-12-31'), b('K2', 6, '2025-02-01', '2025-09-30')];
    expect(chooseBatches(kits, 5, { today }).picks[0].code).toBe('K2');
  });

  it('no single batch: the fewest batches, FEFO among them, with a warning (our rule)', () => {
    const tiles = [
      b('A', 60, '2025-01-01'),
      b('B', 70, '2025-02-01'),
      b('C', 90, '2025-03-01'),
      b('D', 20, '2024-12-01'),
    ];
    // 150 needs two batches (90 + 70 or 90 + 60); the FEFO-first pair is A + C (A received
    // earliest of those that can pair): A takes 60, C takes 90.
    const r = chooseBatches(tiles, 150, { today });
    expect(r.warning).toBe('mixed-batches');
    expect(r.picks.map((p) => [p.code, p.quantity])).toEqual([
      ['A', 60],
      ['C', 90],
    ]);
  });

  it('not enough: all that is available, with the shortfall', () => {
    const r = chooseBatches([b('A', 10, '2025-01-01', undefined, 4), b('B', 5, '2025-01-02')], 20, {
      today,
    });
    expect(r).toMatchObject({ warning: 'short', shortBy: 9 });
    expect(r.picks.map((p) => p.quantity)).toEqual([6, 5]);
  });

  it('leaves expired batches out unless overridden, then flags them', () => {
    const kits = [
      b('OLD', 10, '2024-01-01', '2025-05-31'),
      b('NEW', 3, '2025-05-01', '2026-05-01'),
    ];
    expect(chooseBatches(kits, 5, { today })).toMatchObject({ warning: 'short', shortBy: 2 });
    const over = chooseBatches(kits, 5, { today, allowExpired: true });
    expect(over.picks).toEqual([{ code: 'OLD', quantity: 5, expiry: '2025-05-31', expired: true }]);
  });

  it('uses the fewest batches possible and covers exactly (exhaustive search over subsets)', () => {
    const batchArb = fc.uniqueArray(
      fc.record({
        code: fc.string({ minLength: 1, maxLength: 3 }),
        onHand: fc.integer({ min: 0, max: 100 }),
        reserved: fc.integer({ min: 0, max: 30 }),
        received: fc.constantFrom('2025-01-01', '2025-02-01', '2025-03-01'),
      }),
      { selector: (x) => x.code, maxLength: 8 },
    );
    fc.assert(
      fc.property(batchArb, fc.integer({ min: 1, max: 400 }), (batches, need) => {
        const r = chooseBatches(batches, need, { today });
        const avail = batches.map((x) => Math.max(0, x.onHand - x.reserved));
        const total = avail.reduce((s, x) => s + x, 0);
        let fewest = Infinity;
        for (let mask = 1; mask < 1 << avail.length; mask++) {
          let sum = 0;
          let n = 0;
          avail.forEach((a, i) => {
            if (mask & (1 << i)) {
              sum += a;
              n++;
            }
          });
          if (sum >= need) fewest = Math.min(fewest, n);
        }
        const picked = r.picks.reduce((s, p) => s + p.quantity, 0);
        if (total < need) {
          expect(r.warning).toBe('short');
          expect(picked).toBe(total);
        } else {
          expect(picked).toBe(need);
          expect(r.picks.length).toBe(fewest);
          expect(r.warning).toBe(fewest === 1 ? null : 'mixed-batches');
        }
        for (const p of r.picks) {
          const src = batches.find((x) => x.code === p.code);
          expect(p.quantity).toBeLessThanOrEqual((src?.onHand ?? 0) - (src?.reserved ?? 0));
        }
      }),
    );
  });
});

describe('fefoPickingList', () => {
  const sources = [
    { code: 'K3', quantity: 4, received: '2025-03-01', expiry: '2025-11-30' },
    { code: 'K1', quantity: 2, received: '2025-01-01', expiry: '2025-05-15' }, // expired
    { code: 'K2', quantity: 3, received: '2025-02-01', expiry: '2025-08-31' },
    { code: 'K4', quantity: 5, received: '2025-01-15', expiry: '2025-11-30' },
  ];

  it('first expiry first, ties by first received; expired skipped (FEFO, common practice)', () => {
    const r = fefoPickingList(sources, 9, { today });
    expect(r.lines.map((l) => [l.code, l.quantity])).toEqual([
      ['K2', 3],
      ['K4', 5],
      ['K3', 1],
    ]);
    expect(r.short).toBe(0);
    expect(r.skippedExpired).toEqual(['K1']);
  });

  it('with the override, expired stock goes first and is flagged', () => {
    const r = fefoPickingList(sources, 3, { today, allowExpired: true });
    expect(r.lines[0]).toMatchObject({ code: 'K1', quantity: 2, expired: true });
    expect(r.lines[1]).toMatchObject({ code: 'K2', quantity: 1, expired: false });
  });

  it('reports what it cannot pick; undated batches come last', () => {
    const r = fefoPickingList(
      [{ code: 'T', quantity: 2, received: '2024-01-01' }, ...sources],
      20,
      { today },
    );
    expect(r.lines.at(-1)?.code).toBe('T');
    expect(r.short).toBe(20 - 14);
  });
});
