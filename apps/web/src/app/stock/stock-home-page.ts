import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { catchError, of, switchMap, tap } from 'rxjs';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { Balance, StockApi } from './stock-api';
import { KindFilter } from './kind-filter';
import { KIND_LABELS } from './stock-format';

/**
 * Stock on hand: every balance by product × batch × location with its packs ("3 boxes + 5
 * tiles"), filtered by location and kind, and the way into the other stock pages.
 */
@Component({
  selector: 'lw-stock-home-page',
  imports: [
    KindFilter,
    RouterLink,
    MatButton,
    MatFormField,
    MatIcon,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './stock-home-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockHomePage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly kindLabel = KIND_LABELS;
  protected readonly location = signal('');
  protected readonly kind = signal('');
  protected readonly problem = signal<string | null>(null);
  protected readonly loading = signal(true);
  protected readonly locations = toSignal(this.api.locations().pipe(catchError(() => of([]))), {
    initialValue: [],
  });
  private readonly filter = computed(() => ({ locationId: this.location(), kind: this.kind() }));
  protected readonly balances = toSignal(
    toObservable(this.filter).pipe(
      tap(() => this.loading.set(true)),
      switchMap((f) =>
        this.api.balances(f).pipe(
          catchError((err: unknown) => {
            this.problem.set(errorText(err));
            return of([] as Balance[]);
          }),
        ),
      ),
      tap(() => this.loading.set(false)),
    ),
    { initialValue: [] as Balance[] },
  );
}
