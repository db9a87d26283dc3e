import { DatePipe } from '@angular/common';
import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, Router } from '@angular/router';
import { Subject, catchError, map, of, switchMap } from 'rxjs';
import { errorText } from '../../api/api-problems';
import { MembersApi } from '../../api/members-api';
import {
  AUDIT_ACTIONS,
  AuditEntry,
  AuditFilters,
  PAGE_SIZE,
  actionLabel,
  apiQuery,
  describeDetail,
  filtersFromQuery,
  queryFromFilters,
} from './audit-query';

/**
 * The firm's audit log, newest first: filters kept in the address (so a filtered view can be
 * bookmarked or shared), and "Load older" for the next page.
 */
@Component({
  selector: 'lw-audit-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly actions = AUDIT_ACTIONS;
  protected readonly actionLabel = actionLabel;
  protected readonly describeDetail = describeDetail;
  protected readonly people = toSignal(
    inject(MembersApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );

  protected readonly form = inject(NonNullableFormBuilder).group({
    action: [''],
    userId: [''],
    from: [''],
    to: [''],
  });

  protected readonly entries = signal<readonly AuditEntry[] | null>(null);
  /** False once a page came back shorter than asked: there is nothing older. */
  protected readonly more = signal(false);
  protected readonly loading = signal(false);
  protected readonly problem = signal<string | null>(null);

  private filters: AuditFilters = { action: '', userId: '', from: '', to: '' };
  private readonly older = new Subject<void>();

  constructor() {
    // The address is the source of truth: the form follows it and every change reloads.
    this.route.queryParamMap
      .pipe(
        map(filtersFromQuery),
        switchMap((filters) => {
          this.filters = filters;
          this.form.setValue(filters, { emitEvent: false });
          this.entries.set(null);
          return this.page();
        }),
        takeUntilDestroyed(),
      )
      .subscribe((rows) => this.received(rows, false));
    this.older
      .pipe(
        switchMap(() => this.page(this.entries()?.at(-1)?.createdAt)),
        takeUntilDestroyed(),
      )
      .subscribe((rows) => this.received(rows, true));
  }

  /** Puts the chosen filters into the address, which reloads the list. */
  protected apply(): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: queryFromFilters(this.form.getRawValue()),
    });
  }

  protected clear(): void {
    this.form.reset();
    this.apply();
  }

  protected loadOlder(): void {
    this.older.next();
  }

  private page(before?: string) {
    this.loading.set(true);
    this.problem.set(null);
    return this.http
      .get<AuditEntry[]>('/api/v1/audit', { params: apiQuery(this.filters, before) })
      .pipe(
        catchError((err: unknown) => {
          this.problem.set(errorText(err));
          return of(null);
        }),
        takeUntilDestroyed(this.destroyRef),
      );
  }

  private received(rows: AuditEntry[] | null, append: boolean): void {
    this.loading.set(false);
    if (!rows) return;
    this.entries.update((list) => (append ? [...(list ?? []), ...rows] : rows));
    this.more.set(rows.length === PAGE_SIZE);
  }
}
