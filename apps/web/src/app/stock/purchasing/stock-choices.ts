import { inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { catchError, map, of } from 'rxjs';
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
