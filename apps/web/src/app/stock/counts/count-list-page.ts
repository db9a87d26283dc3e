import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatError } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { catchError, of, startWith, Subject, switchMap } from 'rxjs';
import { showProblems } from '../../api/api-problems';
import { Session } from '../../session/session.store';
import { stockChoices } from '../purchasing/stock-choices';
import { moneyText } from '../stock-format';
import { CountsApi, type CountSummary, type VarianceGroup } from './counts-api';

const STATUS: Record<string, string> = {
  counting: 'Counting',
  submitted: 'To review',
  posted: 'Posted',
  cancelled: 'Cancelled',
};

/** Stock counts: start one for a location, open its sheet or review, and variances over time. */
@Component({
  selector: 'lw-count-list-page',
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
  templateUrl: './count-list-page.html',
  styleUrl: '../stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CountListPage {
  private readonly api = inject(CountsApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly statusText = STATUS;
  protected readonly problem = signal<string | null>(null);
  protected readonly groupBy = signal<'product' | 'location' | 'month'>('month');
  private readonly reload = new Subject<void>();
  protected readonly counts = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() => this.api.list().pipe(catchError(() => of([] as CountSummary[])))),
    ),
    { initialValue: [] as CountSummary[] },
  );
  private readonly choices = stockChoices();
  protected readonly locations = this.choices.locations;
  protected readonly products = this.choices.products;
  protected readonly report = signal<VarianceGroup[]>([]);
  protected readonly form = new FormGroup({
    locationId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    productIds: new FormControl<string[]>([], { nonNullable: true }),
    note: new FormControl('', { nonNullable: true }),
  });

  constructor() {
    this.showReport('month');
  }

  protected money(minor: number | null): string {
    return moneyText(minor, this.currency());
  }

  /** The sheet while counting, the review after. */
  protected link(c: CountSummary): string[] {
    return c.status === 'counting' ? ['/stock/counts', c.id, 'sheet'] : ['/stock/counts', c.id];
  }

  protected showReport(groupBy: 'product' | 'location' | 'month'): void {
    this.groupBy.set(groupBy);
    this.api.report(groupBy).subscribe({
      next: (rows) => this.report.set(rows),
      error: () => this.report.set([]),
    });
  }

  protected start(): void {
    if (this.form.invalid) return this.form.markAllAsTouched();
    this.problem.set(null);
    this.api.start(this.form.getRawValue()).subscribe({
      next: (count) => void this.router.navigate(['/stock/counts', count.id, 'sheet']),
      error: (err: unknown) => this.problem.set(showProblems(this.form, err)),
    });
  }
}
