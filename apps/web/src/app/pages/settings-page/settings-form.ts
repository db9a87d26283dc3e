import {
  AbstractControl,
  FormArray,
  FormControl,
  NonNullableFormBuilder,
  ValidationErrors,
  Validators,
} from '@angular/forms';
import { CURRENCY_PATTERN } from './currencies';
import { basisPointsToPercent, percentToBasisPoints } from './tax-rate';

/** The body of `GET`/`PUT /api/v1/settings`. */
export interface TenantSettings {
  readonly name: string;
  readonly addressLines: readonly string[];
  readonly currency: string;
  readonly units: 'metric' | 'imperial';
  /** Basis points: 2000 = 20 %. */
  readonly defaultTaxRateBp: number;
  readonly paymentTermsDays: number;
  readonly numberPrefixes: Readonly<Record<PrefixKey, string>>;
}

export type PrefixKey = 'job' | 'quote' | 'invoice' | 'creditNote' | 'purchaseOrder';

/** The document kinds with their own number sequence, in the order shown. */
export const PREFIXES: readonly { readonly key: PrefixKey; readonly label: string }[] = [
  { key: 'job', label: 'Jobs' },
  { key: 'quote', label: 'Quotes' },
  { key: 'invoice', label: 'Invoices' },
  { key: 'creditNote', label: 'Credit notes' },
  { key: 'purchaseOrder', label: 'Purchase orders' },
];

/** As many address lines as a letter window holds; the API allows the same. */
export const MAX_ADDRESS_LINES = 6;

/** Where the API's problem paths land in this form (only the tax rate is named differently). */
export const PROBLEM_PATHS: Readonly<Record<string, string>> = { defaultTaxRateBp: 'taxRate' };

const PREFIX_RULES = [Validators.maxLength(12), Validators.pattern(/^[A-Za-z0-9\-/]*$/)];

/** A percentage with at most two decimals from 0 to 100 (see {@link percentToBasisPoints}). */
function taxRateValidator(control: AbstractControl<string>): ValidationErrors | null {
  return percentToBasisPoints(control.value) === null ? { taxRate: true } : null;
}

/** Payment terms: a whole number of days from 0 to 365. */
function wholeDaysValidator(control: AbstractControl<number | null>): ValidationErrors | null {
  const days = control.value;
  if (days === null) return null;
  return Number.isInteger(days) && days >= 0 && days <= 365 ? null : { days: true };
}

/** The settings form; the tax rate is the text of a percentage, converted on save. */
export function buildSettingsForm(fb: NonNullableFormBuilder) {
  return fb.group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    addressLines: fb.array<FormControl<string>>([]),
    currency: ['', [Validators.required, Validators.pattern(CURRENCY_PATTERN)]],
    units: fb.control<'metric' | 'imperial'>('metric'),
    taxRate: ['', [Validators.required, taxRateValidator]],
    paymentTermsDays: fb.control<number | null>(null, [Validators.required, wholeDaysValidator]),
    numberPrefixes: fb.group({
      job: ['', PREFIX_RULES],
      quote: ['', PREFIX_RULES],
      invoice: ['', PREFIX_RULES],
      creditNote: ['', PREFIX_RULES],
      purchaseOrder: ['', PREFIX_RULES],
    }),
  });
}

export type SettingsForm = ReturnType<typeof buildSettingsForm>;

/** An address line control, limited as the API limits it. */
export function addressLine(value = ''): FormControl<string> {
  return new FormControl(value, { nonNullable: true, validators: [Validators.maxLength(200)] });
}

/** Fills the form from the API's settings. */
export function fillSettingsForm(form: SettingsForm, settings: TenantSettings): void {
  const lines = form.controls.addressLines as FormArray<FormControl<string>>;
  lines.clear();
  for (const line of settings.addressLines.slice(0, MAX_ADDRESS_LINES))
    lines.push(addressLine(line));
  if (lines.length === 0) lines.push(addressLine());
  form.patchValue({
    name: settings.name,
    currency: settings.currency,
    units: settings.units,
    taxRate: basisPointsToPercent(settings.defaultTaxRateBp),
    paymentTermsDays: settings.paymentTermsDays,
    numberPrefixes: settings.numberPrefixes,
  });
  form.markAsPristine();
}

/** The body to send: blank address lines dropped, the percentage turned into basis points. */
export function settingsFromForm(form: SettingsForm): TenantSettings {
  const value = form.getRawValue();
  return {
    name: value.name.trim(),
    addressLines: value.addressLines.map((l) => l.trim()).filter((l) => l.length > 0),
    currency: value.currency.trim().toUpperCase(),
    units: value.units,
    defaultTaxRateBp: percentToBasisPoints(value.taxRate) ?? -1,
    paymentTermsDays: Number(value.paymentTermsDays),
    numberPrefixes: value.numberPrefixes,
  };
}

/** The first thing wrong with a control, in words. */
export function errorText(control: AbstractControl | null): string {
  const errors = control?.errors ?? {};
  if (typeof errors['server'] === 'string') return errors['server'];
  if (errors['required']) return 'Required.';
  if (errors['taxRate'])
    return 'A percentage from 0 to 100 with up to two decimals, e.g. 20 or 17.5.';
  if (errors['pattern'] && control?.parent?.get('currency') === control) {
    return 'A three-letter ISO 4217 code in capitals, such as GBP or EUR.';
  }
  if (errors['pattern']) return 'Letters, digits, "-" and "/" only.';
  if (errors['maxlength'])
    return `At most ${(errors['maxlength'] as { requiredLength: number }).requiredLength} characters.`;
  if (errors['days']) return 'A whole number of days from 0 to 365.';
  return 'Check this value.';
}
