import { describe, expect, it } from 'vitest';
import { weightedAverageCost } from '../valuation/weighted-average';
import { countVariance, type CountLineInput } from './variance';

const line = (over: Partial<CountLineInput>): CountLineInput => ({
  productId: 'tile-grey',
  expectedAtStart: 100,
  movementsDuring: 0,
  counted: 100,
  unitCost: 250,
  ...over,
});

describe('countVariance', () => {
  it('judges a count against start + movements during it (arithmetic)', () => {
    // 100 at the start, 24 issued to a van during the count, 76 counted: no variance.
    const r = countVariance([line({ movementsDuring: -24, counted: 76 })]);
    expect(r.lines[0]).toMatchObject({ expected: 76, variance: 0, varianceValue: 0 });
    expect(r.corrections).toEqual([]);
    expect(r.needsApproval).toBe(false);
  });

  it('values variances at the average cost; gross cannot net a loss against a gain (arithmetic)', () => {
    const r = countVariance(
      [
        line({ counted: 95 }), // 5 missing at 2.50 = −12.50
        line({ productId: 'kit', batchCode: 'K7', expectedAtStart: 4, counted: 5, unitCost: 4300 }),
      ],
      { gross: 5000 },
    );
    expect(r.lines.map((l) => l.varianceValue)).toEqual([-1250, 4300]);
    expect(r.netValue).toBe(3050);
    expect(r.grossValue).toBe(5550);
    expect(r.needsApproval).toBe(true); // 55.50 gross > 50.00
    expect(r.corrections).toEqual([
      {
        kind: 'count-correction',
        productId: 'tile-grey',
        batchCode: null,
        quantity: -5,
        unitCost: 250,
      },
      { kind: 'count-correction', productId: 'kit', batchCode: 'K7', quantity: 1, unitCost: 4300 },
    ]);
  });

  it('a single line over the per-line threshold needs approval too', () => {
    const r = countVariance([line({ counted: 60 })], { gross: 1_000_000, perLine: 5000 });
    expect(r.lines[0].overLineThreshold).toBe(true); // 40 × 2.50 = 100.00 > 50.00
    expect(r.needsApproval).toBe(true);
  });

  it('posting the corrections brings the book to the counted figure (arithmetic)', () => {
    const book = weightedAverageCost([{ kind: 'receipt', quantity: 100, unitCost: 250 }]);
    const r = countVariance([line({ counted: 93, unitCost: book.averageUnitCost ?? 0 })]);
    const after = weightedAverageCost(r.corrections, {}, book);
    expect(after.quantity).toBe(93);
    expect(after.value).toBe(book.value + r.netValue);
  });
});
