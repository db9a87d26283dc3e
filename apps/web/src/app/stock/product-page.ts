import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { catchError, of, startWith, Subject, switchMap } from 'rxjs';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { Balance, Movement, Product, StockApi } from './stock-api';
import { KIND_LABELS, MOVEMENT_LABELS, moneyText, packsOf } from './stock-format';

/**
 * One product: its figures, where it is (by batch and location) and its ledger, newest first,
 * with the running quantity after each movement. A wrong movement is reversed, never edited.
 */
@Component({
  selector: 'lw-product-page',
  imports: [RouterLink, MatButton, MatIcon],
  templateUrl: './product-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly id = inject(ActivatedRoute).snapshot.paramMap.get('productId') ?? '';
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly kindLabel = KIND_LABELS;
  protected readonly movementLabel = MOVEMENT_LABELS;
  protected readonly money = moneyText;
  protected readonly problem = signal<string | null>(null);
  private readonly reload = new Subject<void>();
  private readonly fail = (err: unknown) => {
    this.problem.set(errorText(err));
    return of(null);
  };
  protected readonly product = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() => this.api.product(this.id).pipe(catchError(this.fail))),
    ),
    { initialValue: null as Product | null },
  );
  protected readonly balances = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() =>
        this.api.balances({ productId: this.id }).pipe(catchError(() => of([] as Balance[]))),
      ),
    ),
    { initialValue: [] as Balance[] },
  );
  protected readonly ledger = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() =>
        this.api.movements({ productId: this.id }).pipe(catchError(() => of([] as Movement[]))),
      ),
    ),
    { initialValue: [] as Movement[] },
  );
  protected readonly reversed = computed(
    () =>
      new Set(
        this.ledger()
          .map((m) => m.reversesMovementId)
          .filter((x) => !!x),
      ),
  );

  protected packs(q: number): string {
    const p = this.product();
    return p ? packsOf(p, q) : String(q);
  }

  protected reverse(m: Movement): void {
    const note = prompt(`Why reverse this ${MOVEMENT_LABELS[m.kind].toLowerCase()}?`);
    if (note === null) return;
    this.api.reverse(m.id, note).subscribe({
      next: () => this.reload.next(),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }
}
