import { FormControl, FormGroup, FormRecord, ValidatorFn, Validators } from '@angular/forms';
import { ATTRIBUTE_FIELDS, formatDecimal, type ProductKindId } from '@latchwork/stock-domain';
import type { Product, ProductInput } from './stock-api';
import { currencyDigits, moneyInput, quantityInput } from './stock-format';

const text = (value = '', ...v: ValidatorFn[]) =>
  new FormControl(value, { nonNullable: true, validators: v });

/** Refuses text that is not a decimal with at most `digits` places (never rounded away). */
export const decimalText =
  (digits: number): ValidatorFn =>
  (c) =>
    !c.value || Number.isFinite(quantityInput(String(c.value), digits))
      ? null
      : { decimal: `a number with at most ${digits} decimal places` };

/** The product form: every money and quantity is decimal text, converted only on save. */
export function productForm() {
  return new FormGroup({
    sku: text('', Validators.required, Validators.maxLength(60)),
    name: text('', Validators.required, Validators.maxLength(200)),
    kind: text('tile', Validators.required),
    attributes: new FormRecord<FormControl<string>>({}),
    unitOne: text('tile', Validators.required),
    unitOther: text('tiles', Validators.required),
    decimals: text('0'),
    packOne: text('box', Validators.required),
    packOther: text('boxes', Validators.required),
    packSize: text('24', Validators.required),
    cost: text('0.00', Validators.required),
    price: text('0.00', Validators.required),
    taxRate: text('20', decimalText(2)),
    preferredSupplierId: text(''),
    leadTimeDays: text('', decimalText(0)),
    minOrderQuantity: text(''),
    shelfLifeDays: text('', decimalText(0)),
    serviceLevel: text('', decimalText(2)),
    roundToPacks: new FormControl(true, { nonNullable: true }),
    active: new FormControl(true, { nonNullable: true }),
  });
}
export type ProductForm = ReturnType<typeof productForm>;

/** Text shown for an attribute value: lengths in mm, areas in m². */
const attributeText = (type: string, v: string | number | undefined) =>
  v === undefined
    ? ''
    : type === 'mm2'
      ? formatDecimal(Number(v), 6).replace(/\.?0+$/, '')
      : String(v);

/** Replaces the attribute controls with the ones the kind records, keeping values typed. */
export function setKindAttributes(
  form: ProductForm,
  kind: string,
  values: Record<string, string | number> = {},
) {
  const group = form.controls.attributes;
  const old = group.getRawValue();
  for (const key of Object.keys(group.controls)) group.removeControl(key);
  for (const f of ATTRIBUTE_FIELDS[kind as ProductKindId] ?? [])
    group.addControl(
      f.key,
      text(
        old[f.key] ?? attributeText(f.type, values[f.key]),
        f.type === 'text' ? Validators.maxLength(60) : decimalText(f.type === 'mm' ? 0 : 6),
      ),
    );
}

/** Fills the form from a saved product. */
export function fillProductForm(form: ProductForm, p: Product, currency: string) {
  const d = currencyDigits(currency);
  const q = (n: number | null) => (n === null ? '' : formatDecimal(n, p.decimals));
  form.patchValue({
    sku: p.sku,
    name: p.name,
    kind: p.kind,
    unitOne: p.unitOne,
    unitOther: p.unitOther,
    decimals: String(p.decimals),
    packOne: p.packOne,
    packOther: p.packOther,
    packSize: q(p.packSize),
    cost: formatDecimal(p.costMinor, d),
    price: formatDecimal(p.priceMinor, d),
    taxRate: formatDecimal(p.taxRateBp, 2),
    preferredSupplierId: p.preferredSupplierId ?? '',
    leadTimeDays: p.leadTimeDays === null ? '' : String(p.leadTimeDays),
    minOrderQuantity: q(p.minOrderQuantity),
    shelfLifeDays: p.shelfLifeDays === null ? '' : String(p.shelfLifeDays),
    serviceLevel: p.serviceLevelBp === null ? '' : formatDecimal(p.serviceLevelBp, 2),
    roundToPacks: p.roundToPacks,
    active: p.active,
  });
  setKindAttributes(form, p.kind, p.attributes);
}

/** The API body from the form; NaN where text is not a number, which the API names as a 400. */
export function productInput(form: ProductForm, currency: string): ProductInput {
  const v = form.getRawValue();
  const decimals = Number(v.decimals) || 0;
  const opt = (t: string, digits: number) => (t.trim() ? quantityInput(t, digits) : null);
  const attributes: Record<string, string | number> = {};
  for (const f of ATTRIBUTE_FIELDS[v.kind as ProductKindId] ?? []) {
    const t = (v.attributes[f.key] ?? '').trim();
    if (t) attributes[f.key] = f.type === 'text' ? t : quantityInput(t, f.type === 'mm' ? 0 : 6);
  }
  return {
    sku: v.sku.trim(),
    name: v.name.trim(),
    kind: v.kind,
    attributes,
    unitOne: v.unitOne.trim(),
    unitOther: v.unitOther.trim(),
    decimals,
    packOne: v.packOne.trim(),
    packOther: v.packOther.trim(),
    packSize: quantityInput(v.packSize, decimals),
    kitComponents: [],
    costMinor: moneyInput(v.cost, currency) ?? 0,
    priceMinor: moneyInput(v.price, currency) ?? 0,
    taxRateBp: opt(v.taxRate, 2) ?? 0,
    preferredSupplierId: v.preferredSupplierId || null,
    serviceLevelBp: opt(v.serviceLevel, 2),
    leadTimeDays: opt(v.leadTimeDays, 0),
    minOrderQuantity: opt(v.minOrderQuantity, decimals),
    roundToPacks: v.roundToPacks,
    shelfLifeDays: opt(v.shelfLifeDays, 0),
    active: v.active,
  };
}

/** API body paths → form controls, so a 400 marks the field typed in. */
export const PRODUCT_FIELD_OF: Readonly<Record<string, string>> = {
  costMinor: 'cost',
  priceMinor: 'price',
  taxRateBp: 'taxRate',
  serviceLevelBp: 'serviceLevel',
};
