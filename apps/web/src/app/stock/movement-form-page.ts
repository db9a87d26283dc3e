import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { Session } from '../session/session.store';
import { KIND_NEEDS, MOVEMENT_FIELD_OF, movementForm, movementInput } from './movement-form';
import { Batch, Movement, Product, StockApi } from './stock-api';
import { MOVEMENT_LABELS, packsOf, quantityInput } from './stock-format';

/**
 * Book one ledger movement: goods in (with a new batch and its dates), transfer, issue to a
 * job, return from a job, adjustment or write-off with its reason. The fields follow the kind;
 * a refusal names the field (400) or says what is in the way (409: not enough, expired).
 */
@Component({
  selector: 'lw-movement-form-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './movement-form-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MovementFormPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly isOwner = computed(() => this.session.activeTenant()?.role === 'owner');
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly form = movementForm();
  /** The form element's directive: resetting through it also clears "submitted". */
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly kinds = Object.entries(MOVEMENT_LABELS);
  protected readonly kind = toSignal(this.form.controls.kind.valueChanges, {
    initialValue: this.form.controls.kind.value,
  });
  protected readonly needs = computed(() => KIND_NEEDS[this.kind()]);
  protected readonly productSearch = new FormControl('', { nonNullable: true });
  protected readonly problem = signal<string | null>(null);
  protected readonly booked = signal<Movement | null>(null);
  protected readonly saving = signal(false);
  protected readonly locations = toSignal(this.api.locations().pipe(catchError(() => of([]))), {
    initialValue: [],
  });
  protected readonly products = toSignal(
    this.productSearch.valueChanges.pipe(
      startWith(''),
      debounceTime(250),
      switchMap((q) =>
        this.api.products({ q }).pipe(
          map((r) => r.items),
          catchError(() => of([] as Product[])),
        ),
      ),
    ),
    { initialValue: [] as Product[] },
  );
  protected readonly productId = toSignal(this.form.controls.productId.valueChanges, {
    initialValue: '',
  });
  protected readonly product = signal<Product | null>(null);
  protected readonly batches = signal<Batch[]>([]);
  protected readonly jobSearch = new FormControl('', { nonNullable: true });
  protected readonly jobs = toSignal(
    this.jobSearch.valueChanges.pipe(
      startWith(''),
      debounceTime(250),
      switchMap((q) =>
        this.api.jobs(q).pipe(
          map((r) => r.items),
          catchError(() => of([])),
        ),
      ),
    ),
    { initialValue: [] as { id: string; reference: string; title: string }[] },
  );
  /** The job the page was opened for (from a job's materials), named even when not in the list. */
  private readonly givenJob = signal<{ id: string; reference: string; title: string } | null>(null);
  protected readonly jobOptions = computed(() => {
    const list = this.jobs();
    const given = this.givenJob();
    return given && !list.some((j) => j.id === given.id) ? [given, ...list] : list;
  });
  protected readonly quantityText = toSignal(this.form.controls.quantity.valueChanges, {
    initialValue: '',
  });
  protected readonly packsHint = computed(() => {
    const p = this.product();
    const q = p ? quantityInput(this.quantityText(), p.decimals) : Number.NaN;
    return p && Number.isSafeInteger(q) ? `= ${packsOf(p, q)}` : '';
  });

  constructor() {
    const destroy = inject(DestroyRef);
    this.form.controls.productId.valueChanges
      .pipe(takeUntilDestroyed(destroy))
      .subscribe((id) => this.loadProduct(id));
    const given = inject(ActivatedRoute).snapshot.queryParamMap;
    if (given.get('productId')) this.form.patchValue({ productId: given.get('productId') ?? '' });
    const jobId = given.get('jobId');
    if (jobId) {
      this.form.patchValue({ jobId, kind: 'issue' });
      this.api.job(jobId).subscribe((j) => this.givenJob.set({ ...j, id: jobId }));
    }
  }

  /** Loads the product and its batches; the same product again keeps what is shown meanwhile. */
  private loadProduct(id: string): void {
    if (this.product()?.id !== id) {
      this.product.set(null);
      this.batches.set([]);
    }
    if (!id) return;
    this.api.product(id).subscribe((p) => this.product.set(p));
    this.api.batches({ productId: id }).subscribe((b) => this.batches.set(b));
  }

  protected book(): void {
    const p = this.product();
    if (!p) {
      this.problem.set('Choose the product first.');
      return;
    }
    this.saving.set(true);
    this.booked.set(null);
    this.api.book(movementInput(this.form, p, this.currency())).subscribe({
      next: (m) => {
        this.saving.set(false);
        this.problem.set(null);
        this.booked.set(m);
        // Ready for the next line of the same kind; the emptied quantity is not an error yet.
        // The product's batches reload with it, so their figures are current.
        this.formDirective().resetForm({
          ...this.form.getRawValue(),
          quantity: '',
          note: '',
          overrideExpiredReason: '',
        });
      },
      error: (err: unknown) => {
        this.saving.set(false);
        // 400s mark their fields; a 409 (not enough, expired batch) says what is in the way.
        this.problem.set(showProblems(this.form, err, MOVEMENT_FIELD_OF));
      },
    });
  }
}
