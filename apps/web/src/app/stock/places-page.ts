import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormControl,
  FormGroup,
  FormGroupDirective,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith, Subject, switchMap } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { Session } from '../session/session.store';
import { Batch, Product, StockApi, StockLocation } from './stock-api';

const text = (v = '') => new FormControl(v, { nonNullable: true, validators: Validators.required });

/** The location kinds in the words the page shows. */
export const LOCATION_KINDS: Readonly<Record<StockLocation['kind'], string>> = {
  warehouse: 'Warehouse',
  van: 'Van',
  site: 'Job site',
};

/** Warehouses, vans and sites; batches with their dates (expiry before receipt is refused). */
@Component({
  selector: 'lw-places-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './places-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlacesPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly kindText = LOCATION_KINDS;
  protected readonly problem = signal<string | null>(null);
  private readonly reload = new Subject<void>();
  protected readonly locations = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() => this.api.locations().pipe(catchError(() => of([] as StockLocation[])))),
    ),
    { initialValue: [] as StockLocation[] },
  );
  protected readonly batches = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() => this.api.batches({}).pipe(catchError(() => of([] as Batch[])))),
    ),
    { initialValue: [] as Batch[] },
  );
  protected readonly products = toSignal(
    this.api.products({}).pipe(
      map((r) => r.items),
      catchError(() => of([] as Product[])),
    ),
    { initialValue: [] as Product[] },
  );
  protected readonly today = new Date().toISOString().slice(0, 10);
  protected readonly locationForm = new FormGroup({ name: text(), kind: text('warehouse') });
  protected readonly batchForm = new FormGroup({
    productId: text(),
    code: text(),
    receivedOn: text(this.today),
    expiresOn: new FormControl('', { nonNullable: true }),
  });

  // Each form is reset through its directive: that also clears "submitted", so the emptied
  // required fields do not show their errors as if the person had left them blank.
  protected addLocation(form: FormGroupDirective): void {
    if (this.locationForm.invalid) return this.locationForm.markAllAsTouched();
    const v = this.locationForm.getRawValue();
    this.api.addLocation(v).subscribe({
      next: () => {
        // The kind stays: a firm adding its vans adds them one after the other.
        form.resetForm({ name: '', kind: v.kind });
        this.problem.set(null);
        this.reload.next();
      },
      error: (err: unknown) => this.problem.set(showProblems(this.locationForm, err)),
    });
  }

  protected addBatch(form: FormGroupDirective): void {
    if (this.batchForm.invalid) return this.batchForm.markAllAsTouched();
    const v = this.batchForm.getRawValue();
    this.api.addBatch({ ...v, expiresOn: v.expiresOn || undefined }).subscribe({
      next: () => {
        form.resetForm({ productId: '', code: '', receivedOn: this.today, expiresOn: '' });
        this.problem.set(null);
        this.reload.next();
      },
      error: (err: unknown) => this.problem.set(showProblems(this.batchForm, err)),
    });
  }
}
