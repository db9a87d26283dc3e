import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { catchError, map, of, startWith, Subject, switchMap } from 'rxjs';
import { errorText, showProblems } from '../api/api-problems';
import { Session } from '../session/session.store';
import { productFinder } from './purchasing/stock-choices';
import { JobMaterials, PickingItem, ReservationOffer, StockApi } from './stock-api';
import { KIND_LABELS, moneyText, packsOf, quantityInput } from './stock-format';

/**
 * A job's stock: materials estimated from its takeoffs against reserved, issued and returned
 * (with the material cost); reserving with the batch choice (a clear warning and the best
 * split when no single batch covers it); the FEFO picking list; issuing a reservation.
 */
@Component({
  selector: 'lw-job-stock-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatCheckbox,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './job-stock-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobStockPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly jobId = inject(ActivatedRoute).snapshot.paramMap.get('jobId') ?? '';
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly money = moneyText;
  protected readonly kindLabel = KIND_LABELS;
  protected readonly problem = signal<string | null>(null);
  protected readonly offer = signal<ReservationOffer | null>(null);
  private readonly reload = new Subject<void>();
  protected readonly materials = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() =>
        this.api.materials(this.jobId).pipe(
          catchError((e: unknown) => {
            this.problem.set(errorText(e));
            return of(null);
          }),
        ),
      ),
    ),
    { initialValue: null as JobMaterials | null },
  );
  protected readonly picking = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() =>
        this.api.pickingList(this.jobId).pipe(
          map((r) => r.items),
          catchError(() => of([] as PickingItem[])),
        ),
      ),
    ),
    { initialValue: [] as PickingItem[] },
  );
  protected readonly finder = productFinder();
  protected readonly form = new FormGroup({
    productId: new FormControl('', { nonNullable: true }),
    quantity: new FormControl('', { nonNullable: true }),
    acceptSplit: new FormControl(false, { nonNullable: true }),
  });
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.value });
  protected readonly product = computed(() => this.finder.byId(this.value().productId ?? ''));
  /** What the typed quantity is in packs, under the field: "= 2 boxes + 10 tiles". */
  protected readonly packsHint = computed(() => {
    const p = this.product();
    const q = p ? quantityInput(this.value().quantity ?? '', p.decimals) : Number.NaN;
    return p && Number.isSafeInteger(q) && q > 0 ? `= ${packsOf(p, q)}` : '';
  });

  /** A pick of the offer in the product's packs. */
  protected packs(quantity: number): string {
    const p = this.product();
    return p ? packsOf(p, quantity) : String(quantity);
  }

  private body() {
    const v = this.form.getRawValue();
    const p = this.finder.byId(v.productId);
    return {
      jobId: this.jobId,
      productId: v.productId,
      quantity: quantityInput(v.quantity, p?.decimals ?? 0),
      acceptSplit: v.acceptSplit,
    };
  }

  protected check(): void {
    this.api.offer(this.body()).subscribe({
      next: (o) => this.offer.set(o),
      error: (err: unknown) => this.problem.set(showProblems(this.form, err)),
    });
  }

  protected reserve(): void {
    this.api.reserve(this.body()).subscribe({
      next: () => {
        this.offer.set(null);
        this.form.reset();
        this.finder.query.setValue('');
        this.problem.set(null);
        this.reload.next();
      },
      error: (err: unknown) => {
        this.check();
        this.problem.set(showProblems(this.form, err));
      },
    });
  }

  protected issue(reservationId: string): void {
    this.api.issueReserved(reservationId).subscribe({
      next: () => this.reload.next(),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  protected release(reservationId: string): void {
    this.api.release(reservationId).subscribe({
      next: () => this.reload.next(),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }
}
