import { FormControl, FormGroup, Validators } from '@angular/forms';
import type { MovementInput, MovementKind, Product } from './stock-api';
import { moneyInput, quantityInput } from './stock-format';

const text = (value = '') => new FormControl(value, { nonNullable: true });

/** Which places, cost, job and reason each kind of movement asks for. */
export const KIND_NEEDS: Readonly<
  Record<
    MovementKind,
    { from: boolean; to: boolean; cost: 'required' | 'optional' | 'none'; job: boolean }
  >
> = {
  receipt: { from: false, to: true, cost: 'required', job: false },
  transfer: { from: true, to: true, cost: 'none', job: false },
  issue: { from: true, to: false, cost: 'none', job: true },
  return: { from: false, to: true, cost: 'optional', job: true },
  adjustment: { from: false, to: false, cost: 'optional', job: false },
  count_correction: { from: false, to: false, cost: 'optional', job: false },
  write_off: { from: true, to: false, cost: 'none', job: false },
};

/** The movement form; quantities and money are decimal text until the movement is booked. */
export function movementForm() {
  return new FormGroup({
    kind: new FormControl<MovementKind>('receipt', { nonNullable: true }),
    productId: text(),
    batchId: text(),
    batchCode: text(),
    receivedOn: text(new Date().toISOString().slice(0, 10)),
    expiresOn: text(),
    fromLocationId: text(),
    toLocationId: text(),
    /** Adjustments: stock found (+) or missing (−) at `location`. */
    direction: text('found'),
    location: text(),
    quantity: new FormControl('', { nonNullable: true, validators: Validators.required }),
    unitCost: text(),
    jobId: text(),
    writeOffReason: text('damaged'),
    note: text(),
    overrideExpiredReason: text(),
  });
}
export type MovementForm = ReturnType<typeof movementForm>;

/** The API body; what cannot be read as a number goes as NaN → null, which the API names. */
export function movementInput(
  form: MovementForm,
  product: Product,
  currency: string,
): MovementInput {
  const v = form.getRawValue();
  const needs = KIND_NEEDS[v.kind];
  const adjusting = v.kind === 'adjustment' || v.kind === 'count_correction';
  const newBatch = v.batchId === 'new';
  const cost = needs.cost !== 'none' ? moneyInput(v.unitCost, currency) : null;
  return {
    kind: v.kind,
    productId: v.productId,
    batchId: newBatch || !v.batchId ? null : v.batchId,
    ...(newBatch && {
      newBatch: {
        code: v.batchCode.trim(),
        receivedOn: v.receivedOn,
        expiresOn: v.expiresOn || undefined,
      },
    }),
    fromLocationId: adjusting
      ? v.direction === 'missing'
        ? v.location
        : null
      : needs.from
        ? v.fromLocationId || null
        : null,
    toLocationId: adjusting
      ? v.direction === 'found'
        ? v.location
        : null
      : needs.to
        ? v.toLocationId || null
        : null,
    quantity: quantityInput(v.quantity, product.decimals),
    ...(cost !== null && { unitCostMinor: cost }),
    jobId: needs.job ? v.jobId || null : null,
    writeOffReason:
      v.kind === 'write_off' ? (v.writeOffReason as 'damaged' | 'expired' | 'lost') : null,
    note: v.note.trim(),
    overrideExpiredReason: v.overrideExpiredReason.trim() || null,
  };
}

/** API paths → form controls, so a refusal marks the field the person typed in. */
export const MOVEMENT_FIELD_OF: Readonly<Record<string, string>> = {
  unitCostMinor: 'unitCost',
  'newBatch.code': 'batchCode',
  'newBatch.receivedOn': 'receivedOn',
  'newBatch.expiresOn': 'expiresOn',
};
