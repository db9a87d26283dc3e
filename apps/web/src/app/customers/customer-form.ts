import {
  FormArray,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  Validators,
} from '@angular/forms';
import type { Contact, CustomerDetail, CustomerInput, CustomerKind } from './customers-api';
import { moneyInputText, parseMoneyInput } from './money-text';

/** Billing address: street lines and town; the postcode has its own field. */
export const ADDRESS_LINES = 3;

export type ContactGroup = FormGroup<{
  id: FormControl<string>;
  name: FormControl<string>;
  role: FormControl<string>;
  email: FormControl<string>;
  phone: FormControl<string>;
}>;

export function contactGroup(fb: NonNullableFormBuilder, c?: Contact): ContactGroup {
  return fb.group({
    id: [c?.id ?? ''],
    name: [c?.name ?? '', [Validators.required, Validators.maxLength(200)]],
    role: [c?.role ?? '', Validators.maxLength(100)],
    email: [c?.email ?? '', [Validators.email, Validators.maxLength(254)]],
    phone: [c?.phone ?? '', Validators.maxLength(40)],
  });
}

/** The customer form's controls, named as the API's fields so its 400 problems land on them. */
export function customerForm(fb: NonNullableFormBuilder) {
  return fb.group({
    kind: ['business' as CustomerKind, Validators.required],
    name: ['', [Validators.required, Validators.maxLength(200)]],
    externalRef: ['', Validators.maxLength(60)],
    email: ['', [Validators.email, Validators.maxLength(254)]],
    phone: ['', Validators.maxLength(40)],
    billingAddressLines: fb.array(
      Array.from({ length: ADDRESS_LINES }, () => fb.control('', Validators.maxLength(200))),
    ),
    postcode: ['', Validators.maxLength(16)],
    paymentTermsDays: ['', Validators.pattern(/^(\d{1,2}|[12]\d\d|3[0-5]\d|36[0-5])$/)],
    creditLimit: [''],
    notes: ['', Validators.maxLength(4000)],
    contacts: fb.array<ContactGroup>([]),
  });
}
export type CustomerForm = ReturnType<typeof customerForm>;

/** Fills the form from a customer on file; money shown as a plain decimal of the currency. */
export function fillCustomerForm(
  fb: NonNullableFormBuilder,
  form: CustomerForm,
  c: CustomerDetail,
): void {
  const lines = [...c.billingAddressLines];
  form.patchValue({
    kind: c.kind,
    name: c.name,
    externalRef: c.externalRef ?? '',
    email: c.email ?? '',
    phone: c.phone ?? '',
    billingAddressLines: Array.from({ length: ADDRESS_LINES }, (_, i) =>
      // More lines than the form has (an import) go together on the last line.
      i < ADDRESS_LINES - 1 ? (lines[i] ?? '') : lines.slice(i).join(', '),
    ),
    postcode: c.postcode ?? '',
    paymentTermsDays: c.paymentTermsDays === null ? '' : String(c.paymentTermsDays),
    creditLimit: moneyInputText(c.creditLimitMinor, c.currency),
    notes: c.notes,
  });
  form.controls.contacts.clear();
  for (const contact of c.contacts) form.controls.contacts.push(contactGroup(fb, contact));
}

const orNull = (v: string) => (v.trim() ? v.trim() : null);

/**
 * The API body from the form, or the name of the control that cannot become one (money the
 * currency cannot hold, such as 12.345 in pounds).
 */
export function customerInputOf(
  form: CustomerForm,
  currency: string,
): CustomerInput | { invalid: 'creditLimit' } {
  const v = form.getRawValue();
  const creditLimitMinor = parseMoneyInput(v.creditLimit, currency);
  if (Number.isNaN(creditLimitMinor) || (creditLimitMinor ?? 0) < 0)
    return { invalid: 'creditLimit' };
  return {
    kind: v.kind,
    name: v.name.trim(),
    externalRef: orNull(v.externalRef),
    email: orNull(v.email),
    phone: orNull(v.phone),
    billingAddressLines: v.billingAddressLines.map((l) => l.trim()).filter(Boolean),
    postcode: orNull(v.postcode),
    paymentTermsDays: v.paymentTermsDays.trim() ? Number(v.paymentTermsDays) : null,
    creditLimitMinor,
    notes: v.notes.trim(),
    contacts: v.contacts.map((c) => ({
      ...(c.id ? { id: c.id } : {}),
      name: c.name.trim(),
      role: c.role.trim(),
      email: orNull(c.email),
      phone: orNull(c.phone),
    })),
  };
}

export type ContactsArray = FormArray<ContactGroup>;
