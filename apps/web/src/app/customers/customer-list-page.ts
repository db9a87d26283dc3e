import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import {
  MatFormField,
  MatHint,
  MatLabel,
  MatPrefix,
  MatSuffix,
} from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, PageEvent } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, ParamMap, Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, distinctUntilChanged, map, of, switchMap, tap } from 'rxjs';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { CustomerQuery, CustomerRow, CustomerSort, CustomersApi } from './customers-api';

const SORTS: readonly CustomerSort[] = ['name', 'createdAt', 'postcode'];
/** Orders offered beside the table; the column headers sort by name and postcode too. */
const ORDERS = [
  { value: 'name asc', label: 'Name, A to Z' },
  { value: 'name desc', label: 'Name, Z to A' },
  { value: 'createdAt desc', label: 'Newest first' },
  { value: 'createdAt asc', label: 'Oldest first' },
  { value: 'postcode asc', label: 'Postcode' },
  { value: 'postcode desc', label: 'Postcode, descending' },
] as const;
export const PAGE_SIZES = [10, 25, 50, 100];

/** The list's state as the address bar holds it; anything odd falls back to the defaults. */
export function queryFromParams(p: ParamMap): CustomerQuery {
  const sort = p.get('sort') as CustomerSort;
  const page = Number(p.get('page'));
  const size = Number(p.get('pageSize'));
  return {
    q: (p.get('q') ?? '').slice(0, 100),
    sort: SORTS.includes(sort) ? sort : 'name',
    dir: p.get('dir') === 'desc' ? 'desc' : 'asc',
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: PAGE_SIZES.includes(size) ? size : 25,
  };
}

/**
 * The firm's customers: search (debounced, done by the server), sort and pages, all kept in
 * the address so a view can be bookmarked or shared; writers get New and Import.
 */
@Component({
  selector: 'lw-customer-list-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatIconButton,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPaginator,
    MatPrefix,
    MatSelect,
    MatSort,
    MatSortHeader,
    MatSuffix,
    MatTableModule,
  ],
  templateUrl: './customer-list-page.html',
  styleUrl: './customer-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomerListPage {
  private readonly api = inject(CustomersApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('customers:write'));

  protected readonly pageSizes = PAGE_SIZES;
  protected readonly orders = ORDERS;
  protected readonly order = computed(() => `${this.query().sort} ${this.query().dir}`);
  protected readonly columns = [
    'name',
    'email',
    'phone',
    'postcode',
    'externalRef',
    'sites',
    'jobs',
  ];
  protected readonly query = toSignal(this.route.queryParamMap.pipe(map(queryFromParams)), {
    initialValue: queryFromParams(this.route.snapshot.queryParamMap),
  });
  protected readonly search = new FormControl(this.query().q, { nonNullable: true });
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly result = toSignal(
    this.route.queryParamMap.pipe(
      map(queryFromParams),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      tap(() => this.loading.set(true)),
      switchMap((q) =>
        this.api.list(q).pipe(
          tap(() => this.problem.set(null)),
          catchError((err: unknown) => {
            this.problem.set(errorText(err));
            return of({ items: [] as CustomerRow[], total: 0 });
          }),
        ),
      ),
      tap(() => this.loading.set(false)),
    ),
    { initialValue: { items: [] as CustomerRow[], total: 0 } },
  );

  constructor() {
    // Typing waits for a pause, so the server is asked once per word, not once per key.
    this.search.valueChanges
      .pipe(
        map((v) => v.trim()),
        debounceTime(300),
        distinctUntilChanged(),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe((q) => this.go({ q, page: 1 }));
  }

  protected sorted(sort: Sort): void {
    const field = (sort.direction ? sort.active : 'name') as CustomerSort;
    this.go({ sort: field, dir: sort.direction === 'desc' ? 'desc' : 'asc', page: 1 });
  }

  protected ordered(value: string): void {
    const [sort, dir] = value.split(' ') as [CustomerSort, 'asc' | 'desc'];
    this.go({ sort, dir, page: 1 });
  }

  protected paged(event: PageEvent): void {
    this.go({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  protected clearSearch(): void {
    this.search.setValue('');
  }

  /** Puts the changed part of the query into the address; the list follows the address. */
  private go(change: Partial<CustomerQuery>): void {
    const next = { ...this.query(), ...change };
    void this.router.navigate([], {
      relativeTo: this.route,
      replaceUrl: true,
      queryParams: {
        q: next.q || null,
        sort: next.sort === 'name' ? null : next.sort,
        dir: next.dir === 'asc' ? null : next.dir,
        page: next.page === 1 ? null : next.page,
        pageSize: next.pageSize === 25 ? null : next.pageSize,
      },
    });
  }
}
