import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { ATTRIBUTE_FIELDS, type ProductKindId } from '@latchwork/stock-domain';
import { catchError, of } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { Session } from '../session/session.store';
import {
  PRODUCT_FIELD_OF,
  decimalText,
  fillProductForm,
  productForm,
  productInput,
  setKindAttributes,
} from './product-form';
import { StockApi } from './stock-api';
import { KIND_LABELS, currencyDigits } from './stock-format';

/**
 * Add or edit a product. The attribute fields follow the kind (colour, thickness, finish and
 * laid pitch for tiles; coverage for adhesive, primer and filler; stock length for skirting
 * and ramps); money is typed as decimal text and sent as integer minor units.
 */
@Component({
  selector: 'lw-product-form-page',
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
    MatSuffix,
  ],
  templateUrl: './product-form-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductFormPage {
  private readonly api = inject(StockApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  protected readonly productId = inject(ActivatedRoute).snapshot.paramMap.get('productId');
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly form = productForm();
  protected readonly kinds = Object.entries(KIND_LABELS);
  protected readonly kind = signal('tile');
  protected readonly fields = computed(() => ATTRIBUTE_FIELDS[this.kind() as ProductKindId] ?? []);
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly suppliers = toSignal(this.api.suppliers().pipe(catchError(() => of([]))), {
    initialValue: [],
  });

  constructor() {
    const digits = currencyDigits(this.currency());
    this.form.controls.cost.addValidators(decimalText(digits));
    this.form.controls.price.addValidators(decimalText(digits));
    setKindAttributes(this.form, 'tile');
    this.form.controls.kind.valueChanges
      .pipe(takeUntilDestroyed(inject(DestroyRef)))
      .subscribe((k) => {
        this.kind.set(k);
        setKindAttributes(this.form, k);
      });
    if (this.productId)
      this.api.product(this.productId).subscribe({
        next: (p) => {
          fillProductForm(this.form, p, this.currency());
          this.kind.set(p.kind);
        },
        error: (err: unknown) => this.problem.set(showProblems(this.form, err)),
      });
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.saving.set(true);
    this.api
      .saveProduct(productInput(this.form, this.currency()), this.productId ?? undefined)
      .subscribe({
        next: (p) => void this.router.navigate(['/stock/products', p.id]),
        error: (err: unknown) => {
          this.saving.set(false);
          this.problem.set(showProblems(this.form, err, PRODUCT_FIELD_OF));
        },
      });
  }
}
