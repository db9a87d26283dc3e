import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { catchError, map, of, switchMap } from 'rxjs';
import { Session } from '../session/session.store';
import { ExpiringBatch, StockApi, ValueReport } from './stock-api';
import { KIND_LABELS, moneyText } from './stock-format';

/** Stock value at weighted-average cost by location and kind; batches expired or expiring. */
@Component({
  selector: 'lw-stock-reports-page',
  imports: [RouterLink, MatButton, MatFormField, MatLabel, MatOption, MatSelect],
  templateUrl: './stock-reports-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockReportsPage {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly money = moneyText;
  protected readonly kindLabel = KIND_LABELS;
  protected readonly days = signal(30);
  protected readonly value = toSignal(this.api.valueReport().pipe(catchError(() => of(null))), {
    initialValue: null as ValueReport | null,
  });
  protected readonly expiring = toSignal(
    toObservable(this.days).pipe(
      switchMap((d) =>
        this.api.expiring(d).pipe(
          map((r) => r.batches),
          catchError(() => of([] as ExpiringBatch[])),
        ),
      ),
    ),
    { initialValue: [] as ExpiringBatch[] },
  );
}
