import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatPaginator, PageEvent } from '@angular/material/paginator';
import { MatSort, MatSortHeader, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, distinctUntilChanged, map, of, switchMap, tap } from 'rxjs';
import { STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { errorText } from '../api/api-problems';
import { moneyText } from '../customers/money-text';
import { Session } from '../session/session.store';
import { JobFilterBar } from './job-filter-bar';
import { hasFilters, PAGE_SIZES, SORTS, tableQueryFromParams, type JobSort } from './job-filters';
import { JobsApi, type JobRow } from './jobs-api';

/**
 * The pipeline as a table: the board's filters, sorted and paged by the server (the firm may
 * have a hundred thousand jobs), all in the address; Export CSV downloads the same rows.
 */
@Component({
  selector: 'lw-job-table-page',
  imports: [
    JobFilterBar,
    MatButton,
    MatIcon,
    MatPaginator,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './job-table-page.html',
  styleUrls: ['./job-views.scss', './job-table-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobTablePage {
  private readonly api = inject(JobsApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);
  private readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');

  protected readonly pageSizes = PAGE_SIZES;
  // Every sortable column but the install date, which the board's cards do not show either.
  protected readonly columns = SORTS.filter((s) => s !== 'installStartOn');
  protected readonly query = toSignal(this.route.queryParamMap.pipe(map(tableQueryFromParams)), {
    initialValue: tableQueryFromParams(this.route.snapshot.queryParamMap),
  });
  protected readonly exportHref = computed(() => this.api.exportHref(this.query()));
  protected readonly filtered = computed(() => hasFilters(this.query()));
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly result = toSignal(
    this.route.queryParamMap.pipe(
      map(tableQueryFromParams),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      tap(() => this.loading.set(true)),
      switchMap((q) =>
        this.api.list(q).pipe(
          tap(() => this.problem.set(null)),
          catchError((err: unknown) => {
            this.problem.set(errorText(err));
            return of({ items: [] as JobRow[], total: 0 });
          }),
        ),
      ),
      tap(() => this.loading.set(false)),
    ),
    { initialValue: { items: [] as JobRow[], total: 0 } },
  );

  protected stageLabel(stage: Stage): string {
    return STAGE_LABELS[stage];
  }

  protected money(minor: number | null): string {
    return moneyText(minor, this.currency());
  }

  protected sorted(sort: Sort): void {
    this.go({
      sort: sort.direction ? (sort.active as JobSort) : null,
      dir: sort.direction === 'asc' ? 'asc' : null,
      page: null,
    });
  }

  protected paged(event: PageEvent): void {
    this.go({
      page: event.pageIndex === 0 ? null : event.pageIndex + 1,
      pageSize: event.pageSize === 25 ? null : event.pageSize,
    });
  }

  protected clearFilters(): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: {} });
  }

  private go(params: Record<string, string | number | null>): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      replaceUrl: true,
      queryParamsHandling: 'merge',
      queryParams: params,
    });
  }
}
