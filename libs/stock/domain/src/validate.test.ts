import { describe, expect, it } from 'vitest';
import { validateMovement, type MovementContext } from './validate';

const ctx: MovementContext = {
  today: '2025-06-01',
  batches: [
    { code: 'B1', received: '2025-01-01', expiry: null },
    { code: 'ADH-4', received: '2024-06-01', expiry: '2025-05-31' },
  ],
};
const codes = (ps: { field: string; code: string; kind: string }[]) =>
  ps.map((p) => [p.field, p.code, p.kind]);

describe('validateMovement names the field at fault (issue 6, "Bad input")', () => {
  it('accepts a good issue', () => {
    expect(
      validateMovement({ kind: 'issue', quantity: 24, fromLocation: 'WH', batchCode: 'B1' }, ctx),
    ).toEqual([]);
  });

  it('refuses negative, fractional and zero tile quantities', () => {
    const issue = { kind: 'issue' as const, fromLocation: 'WH' };
    expect(codes(validateMovement({ ...issue, quantity: -3 }, ctx))).toEqual([
      ['quantity', 'negative-quantity', 'invalid'],
    ]);
    expect(codes(validateMovement({ ...issue, quantity: 2.5 }, ctx))).toEqual([
      ['quantity', 'fractional-quantity', 'invalid'],
    ]);
    expect(codes(validateMovement({ ...issue, quantity: 0 }, ctx))).toEqual([
      ['quantity', 'zero-quantity', 'invalid'],
    ]);
    expect(codes(validateMovement({ ...issue, quantity: '4' }, ctx))).toEqual([
      ['quantity', 'not-a-number', 'invalid'],
    ]);
    // Adjustments are signed; a metre with 3 decimals counts millimetres.
    expect(validateMovement({ kind: 'adjustment', quantity: -3 }, ctx)).toEqual([]);
    expect(
      validateMovement({ kind: 'adjustment', quantity: 2500 }, { ...ctx, decimals: 3 }),
    ).toEqual([]);
  });

  it('refuses an expiry before receipt and impossible dates', () => {
    const receipt = { kind: 'receipt' as const, quantity: 10, unitCost: 4000, toLocation: 'WH' };
    const bad = validateMovement(
      { ...receipt, newBatch: { code: 'N', received: '2025-06-01', expiry: '2025-05-01' } },
      ctx,
    );
    expect(codes(bad)).toEqual([['newBatch.expiry', 'expiry-before-receipt', 'invalid']]);
    const odd = validateMovement(
      { ...receipt, newBatch: { code: 'N', received: '2025-02-30' } },
      ctx,
    );
    expect(codes(odd)).toEqual([['newBatch.received', 'invalid-date', 'invalid']]);
  });

  it('refuses a transfer to the same location and an unknown batch', () => {
    expect(
      codes(
        validateMovement(
          { kind: 'transfer', quantity: 1, fromLocation: 'VAN1', toLocation: 'VAN1' },
          ctx,
        ),
      ),
    ).toEqual([['toLocation', 'same-location', 'invalid']]);
    expect(
      codes(
        validateMovement({ kind: 'issue', quantity: 1, fromLocation: 'WH', batchCode: 'ZZ' }, ctx),
      ),
    ).toEqual([['batchCode', 'unknown-batch', 'invalid']]);
  });

  it('expired adhesive is a conflict unless the owner overrides', () => {
    const m = { kind: 'issue' as const, quantity: 1, fromLocation: 'WH', batchCode: 'ADH-4' };
    expect(codes(validateMovement(m, ctx))).toEqual([['batchCode', 'expired-batch', 'conflict']]);
    expect(validateMovement(m, { ...ctx, overrideExpired: true })).toEqual([]);
  });

  it('not enough stock is a conflict unless the tenant allows negative stock', () => {
    const m = { kind: 'issue' as const, quantity: 11, fromLocation: 'WH' };
    expect(codes(validateMovement(m, { ...ctx, availableAtSource: 10 }))).toEqual([
      ['quantity', 'insufficient-stock', 'conflict'],
    ]);
    expect(validateMovement(m, { ...ctx, availableAtSource: 10, allowNegative: true })).toEqual([]);
  });

  it('goods in needs a cost in minor units; a write-off needs a reason; places are required', () => {
    expect(
      codes(validateMovement({ kind: 'receipt', quantity: 1, toLocation: 'WH' }, ctx)),
    ).toEqual([['unitCost', 'missing', 'invalid']]);
    expect(
      codes(
        validateMovement({ kind: 'receipt', quantity: 1, unitCost: 40.5, toLocation: 'WH' }, ctx),
      ),
    ).toEqual([['unitCost', 'invalid-money', 'invalid']]);
    expect(codes(validateMovement({ kind: 'write-off', quantity: 1 }, ctx))).toEqual([
      ['writeOffReason', 'missing', 'invalid'],
      ['fromLocation', 'missing', 'invalid'],
    ]);
  });
});
