import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { catchError, of, startWith, Subject, switchMap } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { Session } from '../session/session.store';
import { StockApi, Supplier } from './stock-api';

/** Suppliers with their order e-mail, contact and lead time. */
@Component({
  selector: 'lw-suppliers-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
  ],
  templateUrl: './suppliers-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SuppliersPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly problem = signal<string | null>(null);
  private readonly reload = new Subject<void>();
  protected readonly suppliers = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() => this.api.suppliers().pipe(catchError(() => of([] as Supplier[])))),
    ),
    { initialValue: [] as Supplier[] },
  );
  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: Validators.required }),
    email: new FormControl('', { nonNullable: true, validators: Validators.email }),
    contact: new FormControl('', { nonNullable: true }),
    leadTimeDays: new FormControl('7', {
      nonNullable: true,
      validators: Validators.pattern(/^\d{1,3}$/),
    }),
  });

  protected add(): void {
    if (this.form.invalid) return this.form.markAllAsTouched();
    const v = this.form.getRawValue();
    this.api
      .saveSupplier({
        name: v.name.trim(),
        email: v.email.trim() || null,
        contacts: v.contact.trim() ? [{ name: v.contact.trim() }] : [],
        leadTimeDays: Number(v.leadTimeDays),
      })
      .subscribe({
        next: () => {
          this.form.reset();
          this.reload.next();
        },
        error: (err: unknown) => this.problem.set(showProblems(this.form, err)),
      });
  }
}
