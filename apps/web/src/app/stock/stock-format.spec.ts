import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { productForm, productInput, setKindAttributes } from './product-form';
import { moneyInput, moneyText, packsOf, quantityInput } from './stock-format';

const tiles = {
  packSize: 24,
  unitOne: 'tile',
  unitOther: 'tiles',
  packOne: 'box',
  packOther: 'boxes',
  decimals: 0,
};

describe('stock text', () => {
  it('reads money as decimal text into minor units, never through a float', () => {
    // Reference: decimal.js (a general-purpose decimal library) times 100.
    for (const text of ['43.00', '0.10', '1234.56', '0.29'])
      expect(moneyInput(text, 'GBP')).toBe(new Decimal(text).times(100).toNumber());
    expect(moneyInput('2.345', 'GBP')).toBeNaN();
    expect(moneyInput('', 'GBP')).toBeNull();
    expect(moneyInput('1,250.50', 'GBP')).toBe(125050);
  });

  it('shows money in the currency, JPY without minor digits (ISO 4217)', () => {
    expect(moneyText(4300, 'GBP')).toBe('£43.00');
    expect(moneyText(4300, 'JPY')).toBe('JP¥4,300');
  });

  it('refuses a fractional tile count but takes metres to the millimetre', () => {
    expect(quantityInput('2.5', 0)).toBeNaN();
    expect(quantityInput('2.345', 3)).toBe(2345);
  });

  it('shows quantities in packs: 77 tiles in boxes of 24 (arithmetic)', () => {
    expect(packsOf(tiles, 77)).toBe('3 boxes + 5 tiles');
  });
});

describe('product form', () => {
  it('shows the attribute fields of the kind and sends minor units', () => {
    const form = productForm();
    setKindAttributes(form, 'tile');
    expect(Object.keys(form.controls.attributes.controls)).toEqual([
      'colour',
      'thicknessMm',
      'finish',
      'pitchMm',
    ]);
    form.controls.kind.setValue('adhesive');
    setKindAttributes(form, 'adhesive');
    expect(Object.keys(form.controls.attributes.controls)).toEqual(['coverageMm2']);
    form.patchValue({ sku: 'DB-1', name: 'Kit', cost: '40.00', price: '69.00', packSize: '4' });
    form.controls.attributes.controls['coverageMm2'].setValue('12');
    const body = productInput(form, 'GBP');
    expect(body).toMatchObject({
      kind: 'adhesive',
      costMinor: 4000,
      priceMinor: 6900,
      packSize: 4,
      attributes: { coverageMm2: 12_000_000 },
    });
  });
});
