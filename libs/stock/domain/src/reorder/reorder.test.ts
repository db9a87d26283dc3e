import fc from 'fast-check';
import { mean, probit, errorFunction, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { dailyDemandSeries, daysBetween, demandStats } from './demand';
import { economicOrderQuantity, reorderPoint, safetyStock, serviceLevelZ } from './formulas';
import { inverseNormalCdf } from './formulas';
import { reorderSuggestion, type ReorderProduct } from './suggestion';

/** Φ(z) through simple-statistics' errorFunction (fractional error below 1.2e-7). */
const phi = (z: number): number => 0.5 * (1 + errorFunction(z / Math.SQRT2));

describe('inverse normal CDF', () => {
  it('matches the standard normal table (standard normal table)', () => {
    expect(inverseNormalCdf(0.95)).toBeCloseTo(1.6449, 4);
    expect(inverseNormalCdf(0.99)).toBeCloseTo(2.3263, 4);
    expect(inverseNormalCdf(0.975)).toBeCloseTo(1.96, 4);
    expect(inverseNormalCdf(0.5)).toBe(0);
    expect(inverseNormalCdf(0.05)).toBeCloseTo(-1.6449, 4);
  });

  it.each([0.9, 0.95, 0.975, 0.99, 0.999])('agrees with simple-statistics probit at %s', (p) => {
    // simple-statistics' probit uses a closed-form inverse erf that is off by up to about
    // 0.35% of z (0.010 at 0.999; it calls itself an approximation): that is the tolerance…
    expect(Math.abs(inverseNormalCdf(p) - probit(p))).toBeLessThan(0.005 * inverseNormalCdf(p));
    // …and the tight check goes the other way: Φ of our z gives back p (simple-statistics).
    expect(phi(inverseNormalCdf(p))).toBeCloseTo(p, 6);
  });

  it('round-trips through Φ across (0, 1) (simple-statistics errorFunction, property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1 - 1e-6, noNaN: true }), (p) => {
        expect(Math.abs(phi(inverseNormalCdf(p)) - p)).toBeLessThan(2e-7);
      }),
    );
  });

  it('refuses p outside (0, 1) and service levels below one half', () => {
    expect(() => inverseNormalCdf(0)).toThrow(RangeError);
    expect(() => inverseNormalCdf(1)).toThrow(RangeError);
    expect(() => serviceLevelZ(0.4)).toThrow(RangeError);
  });
});

describe('daily demand', () => {
  it('mean and sample sd agree with simple-statistics (simple-statistics mean, sampleStandardDeviation)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 200 }), { minLength: 2, maxLength: 400 }),
        (xs) => {
          const s = demandStats(xs);
          expect(s.mean).toBeCloseTo(mean(xs), 9);
          expect(s.sd).toBeCloseTo(sampleStandardDeviation(xs), 9);
        },
      ),
    );
  });

  it('counts quiet days as zero and nets returns (arithmetic)', () => {
    const series = dailyDemandSeries(
      [
        { date: '2025-03-01', quantity: 4 },
        { date: '2025-03-03', quantity: 6 },
        { date: '2025-03-03', quantity: -1 },
        { date: '2025-04-01', quantity: 99 }, // outside the window
      ],
      '2025-03-01',
      '2025-03-04',
    );
    expect(series).toEqual([4, 0, 5, 0]);
    expect(daysBetween('2024-02-28', '2024-03-01')).toBe(2); // leap year (Gregorian calendar)
    expect(() => dailyDemandSeries([], '2025-02-30', '2025-03-01')).toThrow(/calendar date/);
  });
});

describe('the formulas', () => {
  it('EOQ: 600 kits a year, 25.00 per order, 12.00 holding → 50 (Harris 1913, arithmetic)', () => {
    expect(economicOrderQuantity(600, 2500, 1200)).toBeCloseTo(50, 12);
    expect(economicOrderQuantity(0, 2500, 1200)).toBe(0);
  });

  it('safety stock and reorder point (textbook formulas, arithmetic)', () => {
    // z = 1.6449, σ = 2 a day, 9 days: 1.6449 × 2 × 3 = 9.869; ROP = 4 × 9 + 9.869 = 45.869.
    const ss = safetyStock(serviceLevelZ(0.95), 2, 9);
    expect(ss).toBeCloseTo(9.8691, 3);
    expect(reorderPoint(4, 9, ss)).toBeCloseTo(45.8691, 3);
  });
});

const kits: ReorderProduct = {
  packSize: 4,
  leadTimeDays: 9,
  orderCost: 2500,
  holdingCostPerUnitYear: 1200,
};
// 2 kits one day, 0 the next, repeated: mean 1, sample sd √(n/(n−1)) ≈ 1.0 (arithmetic).
const history = Array.from({ length: 100 }, (_, i) => (i % 2 === 0 ? 2 : 0));

describe('reorderSuggestion', () => {
  const settings = { serviceLevel: 0.95 };

  it('orders EOQ rounded up to packs when at the reorder point (worked by hand, arithmetic)', () => {
    // mean 1, sd 1.00504, SS = 1.6449 × 1.00504 × 3 = 4.96 → ROP = ceil(9 + 4.96) = 14.
    // EOQ = √(2 × 365 × 25 / 12) = 39.0 → 10 packs of 4 = 40.
    const s = reorderSuggestion(
      kits,
      { onHand: 10, onOrder: 4, reservedWithinLeadTime: 0 },
      history,
      settings,
    );
    expect(s.reorderPoint).toBe(14);
    expect(s.eoq).toBeCloseTo(Math.sqrt((2 * 365 * 2500) / 1200), 9);
    expect(s.order).toBe(true);
    expect(s.quantity).toBe(40);
    expect(s.packs).toBe(10);
    expect(s.reasons.map((r) => r.code)).toEqual([
      'at-or-below-reorder-point',
      'economic-order-quantity',
      'rounded-up-to-packs',
    ]);
  });

  it('does not order above the reorder point, nor with no demand', () => {
    const above = reorderSuggestion(
      kits,
      { onHand: 15, onOrder: 0, reservedWithinLeadTime: 0 },
      history,
      settings,
    );
    expect(above.order).toBe(false);
    expect(above.reasons[0].code).toBe('above-reorder-point');
    const idle = reorderSuggestion(
      kits,
      { onHand: 0, onOrder: 0, reservedWithinLeadTime: 0 },
      [0, 0, 0],
      settings,
    );
    expect(idle.order).toBe(false);
    expect(idle.reasons[0].code).toBe('no-demand');
  });

  it('reservations consume the forecast by default, or add to it (arithmetic)', () => {
    const pos = { onHand: 20, onOrder: 0, reservedWithinLeadTime: 30 };
    const consume = reorderSuggestion(kits, pos, history, settings);
    expect(consume.leadTimeDemand).toBe(30); // max(9, 30)
    expect(consume.reorderPoint).toBe(35); // ceil(30 + 4.96)
    expect(consume.quantity).toBe(40); // EOQ 39 → 40 already lifts 20 above 35
    const add = reorderSuggestion(kits, pos, history, { ...settings, demandMode: 'add' });
    expect(add.position).toBe(-10); // 20 on hand − 30 reserved
    expect(add.reorderPoint).toBe(14);
    expect(add.quantity).toBe(40); // lift 14 − (−10) + 1 = 25 < EOQ 39 → 10 packs
    const big = { ...pos, reservedWithinLeadTime: 80 };
    const lifted = reorderSuggestion(kits, big, history, { ...settings, demandMode: 'add' });
    expect(lifted.quantity).toBe(76); // lift 14 − (−60) + 1 = 75 > EOQ → 19 packs
    expect(lifted.reasons.map((r) => r.code)).toContain('lift-above-reorder-point');
  });

  it('caps the order at what can be used before expiry (arithmetic)', () => {
    // Shelf life 20 days × 1 a day = 20 < EOQ 39: order 20 = 5 packs.
    const s = reorderSuggestion(
      { ...kits, shelfLifeDays: 20 },
      { onHand: 5, onOrder: 0, reservedWithinLeadTime: 0 },
      history,
      settings,
    );
    expect(s.expiryCap).toBe(20);
    expect(s.quantity).toBe(20);
    expect(s.reasons.map((r) => r.code)).toContain('capped-by-shelf-life');
  });

  it('always leaves the position above the reorder point, in whole packs (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 30 }), { minLength: 1, maxLength: 120 }),
        fc.record({
          onHand: fc.integer({ min: -20, max: 300 }),
          onOrder: fc.integer({ min: 0, max: 100 }),
          reservedWithinLeadTime: fc.integer({ min: 0, max: 300 }),
        }),
        fc.integer({ min: 1, max: 48 }),
        fc.integer({ min: 1, max: 60 }),
        fc.option(fc.integer({ min: 1, max: 365 }), { nil: null }),
        (daily, pos, packSize, leadTimeDays, shelfLifeDays) => {
          const p = { ...kits, packSize, leadTimeDays, shelfLifeDays };
          const s = reorderSuggestion(p, pos, daily, settings);
          if (s.order) {
            expect(s.quantity % packSize).toBe(0);
            expect(s.position + s.quantity).toBeGreaterThan(s.reorderPoint);
          } else {
            expect(s.quantity).toBe(0);
          }
        },
      ),
    );
  });
});
