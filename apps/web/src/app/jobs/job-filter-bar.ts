import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSelect } from '@angular/material/select';
import { ActivatedRoute, Router } from '@angular/router';
import { catchError, debounceTime, distinctUntilChanged, filter, map, of, switchMap } from 'rxjs';
import { Session } from '../session/session.store';
import { moneyInputText, parseMoneyInput } from '../customers/money-text';
import {
  DATE_FIELDS,
  filterQueryParams,
  filtersFromParams,
  hasFilters,
  NO_FILTERS,
  type DateField,
  type JobFilters,
} from './job-filters';
import { JobsApi, type CustomerOption } from './jobs-api';

/**
 * The filters the board and the table share: search, owners, customer, a date range on a
 * chosen date, and a value range. Every change goes into the address (page back to 1); the
 * views follow the address, so a filtered view can be bookmarked and survives switching views.
 */
@Component({
  selector: 'lw-job-filter-bar',
  imports: [
    ReactiveFormsModule,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPrefix,
    MatSelect,
  ],
  templateUrl: './job-filter-bar.html',
  styleUrl: './job-filter-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobFilterBar {
  private readonly api = inject(JobsApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);

  protected readonly dateFields = DATE_FIELDS;
  protected readonly canPickCustomer = computed(() => this.session.can('customers:read'));
  private readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly filters = toSignal(this.route.queryParamMap.pipe(map(filtersFromParams)), {
    initialValue: filtersFromParams(this.route.snapshot.queryParamMap),
  });
  protected readonly filtered = computed(() => hasFilters(this.filters()));
  protected readonly team = toSignal(this.api.team().pipe(catchError(() => of([]))), {
    initialValue: [],
  });

  protected readonly search = new FormControl(this.filters().q, { nonNullable: true });
  protected readonly customerText = new FormControl(this.filters().customerName ?? '', {
    nonNullable: true,
  });
  protected readonly customers = toSignal(
    this.customerText.valueChanges.pipe(
      debounceTime(250),
      map((text) => text.trim()),
      distinctUntilChanged(),
      filter((text) => text.length >= 2 && this.canPickCustomer()),
      switchMap((text) =>
        this.api.customers(text).pipe(
          map((r) => r.items),
          catchError(() => of([] as CustomerOption[])),
        ),
      ),
    ),
    { initialValue: [] as CustomerOption[] },
  );

  constructor() {
    this.search.valueChanges
      .pipe(
        map((v) => v.trim()),
        debounceTime(300),
        distinctUntilChanged(),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe((q) => this.set({ q }));
  }

  protected ownersChosen(owners: string[]): void {
    this.set({ owners });
  }

  protected customerChosen(customer: CustomerOption): void {
    this.set({ customer: customer.id, customerName: customer.name });
  }

  /** Leaving the customer field empty drops the customer filter. */
  protected customerLeft(): void {
    if (!this.customerText.value.trim() && this.filters().customer)
      this.set({ customer: null, customerName: null });
  }

  protected dateFieldChosen(dateField: DateField): void {
    this.set({ dateField });
  }

  protected dateChosen(which: 'from' | 'to', value: string): void {
    this.set({ [which]: value || null });
  }

  protected valueText(minor: number | null): string {
    return moneyInputText(minor, this.currency());
  }

  /** A value bound typed in the firm's currency; a figure that is not money is ignored. */
  protected valueChosen(which: 'minValue' | 'maxValue', text: string): void {
    const minor = parseMoneyInput(text, this.currency());
    if (minor === null || (Number.isSafeInteger(minor) && minor >= 0)) this.set({ [which]: minor });
  }

  protected clear(): void {
    this.search.setValue('', { emitEvent: false });
    this.customerText.setValue('', { emitEvent: false });
    this.set(NO_FILTERS);
  }

  private set(change: Partial<JobFilters>): void {
    const next = { ...this.filters(), ...change };
    void this.router.navigate([], {
      relativeTo: this.route,
      replaceUrl: true,
      queryParamsHandling: 'merge',
      queryParams: { ...filterQueryParams(next), page: null },
    });
  }
}
