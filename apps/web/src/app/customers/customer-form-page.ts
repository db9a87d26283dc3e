import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatSnackBar } from '@angular/material/snack-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { errorText, showProblems } from '../api/api-problems';
import { Session } from '../session/session.store';
import {
  ADDRESS_LINES,
  contactGroup,
  customerForm,
  customerInputOf,
  fillCustomerForm,
} from './customer-form';
import { CustomersApi } from './customers-api';
import { minorDigitsOf } from './money-text';

/**
 * Adds or edits a customer: kind, name, how to reach them, billing address, terms, credit
 * limit, notes and any number of contacts. The API's field problems appear under the fields
 * they name (contacts by their row).
 */
@Component({
  selector: 'lw-customer-form-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatRadioButton,
    MatRadioGroup,
  ],
  templateUrl: './customer-form-page.html',
  styleUrl: './customer-form-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomerFormPage {
  private readonly api = inject(CustomersApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly session = inject(Session);

  /** Set when editing; null for a new customer. */
  protected readonly customerId = inject(ActivatedRoute).snapshot.paramMap.get('customerId');
  protected readonly form = customerForm(this.fb);
  protected readonly addressLabels = Array.from({ length: ADDRESS_LINES }, (_, i) =>
    i === ADDRESS_LINES - 1 ? 'Town' : `Address line ${i + 1}`,
  );
  protected readonly currency = signal(this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly currencyHint = computed(() => {
    const digits = minorDigitsOf(this.currency());
    return digits ? `${this.currency()}, up to ${digits} decimal places` : this.currency();
  });
  protected readonly loading = signal(this.customerId !== null);
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    if (this.customerId) void this.load(this.customerId);
  }

  protected get contacts() {
    return this.form.controls.contacts;
  }

  protected addContact(): void {
    this.contacts.push(contactGroup(this.fb));
  }

  protected removeContact(index: number): void {
    this.contacts.removeAt(index);
  }

  protected async save(): Promise<void> {
    this.problem.set(null);
    const input = customerInputOf(this.form, this.currency());
    if ('invalid' in input) this.form.controls.creditLimit.setErrors({ money: true });
    if (this.form.invalid || 'invalid' in input) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    try {
      const saved = await firstValueFrom(
        this.customerId ? this.api.update(this.customerId, input) : this.api.create(input),
      );
      this.snackBar.open(`${saved.name} saved.`, undefined, { duration: 4000 });
      await this.router.navigate(['/customers', saved.id]);
    } catch (err: unknown) {
      this.problem.set(showProblems(this.form, err, { creditLimitMinor: 'creditLimit' }));
    } finally {
      this.saving.set(false);
    }
  }

  /** The first thing wrong with a control, in words. */
  protected errorOf(control: AbstractControl): string {
    const e = control.errors ?? {};
    if (typeof e['server'] === 'string') return e['server'];
    if (e['required']) return 'Required.';
    if (e['email']) return 'Enter an e-mail address such as name@example.test.';
    if (e['pattern']) return 'A whole number of days from 0 to 365.';
    if (e['money']) return `An amount in ${this.currency()}, such as 2500 or 2,500.00.`;
    if (e['maxlength']) return `At most ${e['maxlength'].requiredLength} characters.`;
    return 'Check this field.';
  }

  private async load(id: string): Promise<void> {
    try {
      const customer = await firstValueFrom(this.api.get(id));
      this.currency.set(customer.currency);
      fillCustomerForm(this.fb, this.form, customer);
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    } finally {
      this.loading.set(false);
    }
  }
}
