import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  map,
  of,
  startWith,
  switchMap,
} from 'rxjs';
import { combineLatest } from 'rxjs';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { Product, StockApi } from './stock-api';
import { KindFilter } from './kind-filter';
import { KIND_LABELS, moneyText, packsOf } from './stock-format';

/** The catalogue: search by SKU or name, filter by kind, with stock figures; CSV in and out. */
@Component({
  selector: 'lw-product-list-page',
  imports: [
    KindFilter,
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatPrefix,
  ],
  templateUrl: './product-list-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductListPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly kindLabel = KIND_LABELS;
  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly kind = signal('');
  protected readonly problem = signal<string | null>(null);
  protected readonly money = moneyText;
  protected readonly packs = packsOf;
  protected readonly result = toSignal(
    combineLatest([
      this.search.valueChanges.pipe(
        startWith(''),
        map((v) => v.trim()),
        debounceTime(250),
        distinctUntilChanged(),
      ),
      toObservable(this.kind),
    ]).pipe(
      switchMap(([q, kind]) =>
        this.api.products({ q, kind }).pipe(
          catchError((err: unknown) => {
            this.problem.set(errorText(err));
            return of({ items: [] as Product[], total: 0 });
          }),
        ),
      ),
    ),
    { initialValue: { items: [] as Product[], total: 0 } },
  );
}
