import { inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl } from '@angular/forms';
import { catchError, debounceTime, map, of, startWith, switchMap, tap } from 'rxjs';
import { StockApi, type Product, type StockLocation } from '../stock-api';

/**
 * The firm's locations and active products as signals, for the select boxes of the count and
 * order forms (empty when they cannot be loaded). Call it in an injection context.
 */
export function stockChoices(): {
  locations: Signal<StockLocation[]>;
  products: Signal<Product[]>;
} {
  const stock = inject(StockApi);
  return {
    locations: toSignal(stock.locations().pipe(catchError(() => of([] as StockLocation[]))), {
      initialValue: [] as StockLocation[],
    }),
    products: toSignal(
      stock.products({ active: 'true' }).pipe(
        map((page) => page.items),
        catchError(() => of([] as Product[])),
      ),
      { initialValue: [] as Product[] },
    ),
  };
}

/** A product select fed by a search box (see `productFinder`). */
export interface ProductFinder {
  /** What the person types: part of the SKU or the name. */
  readonly query: FormControl<string>;
  /** The active products matching it (the API's first page). */
  readonly results: Signal<Product[]>;
  /** A product met in any earlier result, so a chosen one keeps its label and its units. */
  byId(id: string): Product | undefined;
  /** The chosen product when the current results no longer hold it (to keep it an option). */
  keep(id: string): Product | undefined;
}

/**
 * Products found by typing rather than listed: a firm's catalogue runs to hundreds of lines
 * (the import takes thousands) and the API answers a page at a time, so a select holding "the
 * first page" would hide the very product wanted. Call it in an injection context.
 */
export function productFinder(): ProductFinder {
  const stock = inject(StockApi);
  const query = new FormControl('', { nonNullable: true });
  const seen = new Map<string, Product>();
  const results = toSignal(
    query.valueChanges.pipe(
      startWith(''),
      debounceTime(250),
      switchMap((q) =>
        stock.products({ q: q.trim() || undefined, active: 'true' }).pipe(
          map((page) => page.items),
          catchError(() => of([] as Product[])),
        ),
      ),
      tap((items) => items.forEach((p) => seen.set(p.id, p))),
    ),
    { initialValue: [] as Product[] },
  );
  return {
    query,
    results,
    byId: (id) => seen.get(id),
    keep: (id) => (results().some((p) => p.id === id) ? undefined : seen.get(id)),
  };
}
