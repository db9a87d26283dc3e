import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { catchError, of, startWith, Subject, switchMap } from 'rxjs';
import { showProblems } from '../../api/api-problems';
import { Session } from '../../session/session.store';
import { StockApi, type Supplier } from '../stock-api';
import { moneyInput } from '../stock-format';
import { productFinder, stockChoices } from './stock-choices';
import { ORDER_STATUS, PurchasingApi, type OrderSummary } from './purchasing-api';

const WHOLE = Validators.pattern(/^\d{0,9}$/);
const lineGroup = () =>
  new FormGroup({
    productId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    packs: new FormControl('', { nonNullable: true, validators: WHOLE }),
    units: new FormControl('', { nonNullable: true, validators: WHOLE }),
    unitCost: new FormControl('', { nonNullable: true }),
  });

/** Purchase orders: the list by status, and a new order to a supplier. */
@Component({
  selector: 'lw-po-list-page',
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
    MatOption,
    MatSelect,
  ],
  templateUrl: './po-list-page.html',
  styleUrl: '../stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PoListPage {
  private readonly api = inject(PurchasingApi);
  private readonly stock = inject(StockApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  private readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly statusText = ORDER_STATUS;
  protected readonly filters = [
    { id: 'open', label: 'Open' },
    ...Object.entries(ORDER_STATUS).map(([id, label]) => ({ id, label })),
    { id: 'all', label: 'All' },
  ];
  protected readonly status = signal('open');
  protected readonly problem = signal<string | null>(null);
  private readonly reload = new Subject<void>();
  protected readonly orders = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() =>
        this.api
          .list(this.status() === 'all' ? undefined : this.status())
          .pipe(catchError(() => of([] as OrderSummary[]))),
      ),
    ),
    { initialValue: [] as OrderSummary[] },
  );
  protected readonly suppliers = toSignal(
    this.stock.suppliers().pipe(catchError(() => of([] as Supplier[]))),
    { initialValue: [] as Supplier[] },
  );
  protected readonly locations = stockChoices().locations;
  protected readonly finder = productFinder();
  protected readonly form = new FormGroup({
    supplierId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    deliveryLocationId: new FormControl('', { nonNullable: true }),
    expectedOn: new FormControl('', { nonNullable: true }),
    notes: new FormControl('', { nonNullable: true }),
    lines: new FormArray([lineGroup()]),
  });

  protected filter(status: string): void {
    this.status.set(status);
    this.reload.next();
  }

  protected addLine(): void {
    this.form.controls.lines.push(lineGroup());
  }

  protected removeLine(i: number): void {
    if (this.form.controls.lines.length > 1) this.form.controls.lines.removeAt(i);
  }

  protected packName(productId: string): string {
    return this.finder.byId(productId)?.packOther ?? 'packs';
  }

  protected create(): void {
    if (this.form.invalid) return this.form.markAllAsTouched();
    const v = this.form.getRawValue();
    const lines = v.lines.map((l) => {
      const cost = moneyInput(l.unitCost, this.currency());
      return {
        productId: l.productId,
        packs: Number(l.packs || 0),
        units: Number(l.units || 0),
        ...(cost === null || Number.isNaN(cost) ? {} : { unitCostMinor: cost }),
      };
    });
    this.problem.set(null);
    this.api
      .create({
        supplierId: v.supplierId,
        deliveryLocationId: v.deliveryLocationId || null,
        expectedOn: v.expectedOn || null,
        notes: v.notes,
        lines,
      })
      .subscribe({
        next: (o) => void this.router.navigate(['/stock/purchase-orders', o.id]),
        error: (err: unknown) => this.problem.set(showProblems(this.form, err)),
      });
  }
}
