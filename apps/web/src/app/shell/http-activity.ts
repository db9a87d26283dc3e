import { HttpInterceptorFn } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { finalize } from 'rxjs';

/**
 * Counts HTTP requests in flight, so that the shell can show one loading bar however many
 * requests overlap. Fed by {@link httpActivityInterceptor}.
 */
@Injectable({ providedIn: 'root' })
export class HttpActivity {
  private readonly count = signal(0);

  /** Number of requests sent and not yet answered, failed or cancelled. */
  readonly inFlight = this.count.asReadonly();

  /** True while at least one request is in flight. */
  readonly busy = computed(() => this.count() > 0);

  /** Records that a request was sent. */
  started(): void {
    this.count.update((n) => n + 1);
  }

  /** Records that a request ended, however it ended. */
  ended(): void {
    this.count.update((n) => n - 1);
  }
}

/**
 * Keeps {@link HttpActivity} in step with the requests passing through. `finalize` runs exactly
 * once per request whether it succeeds, fails or is cancelled by an unsubscribe, so the count
 * cannot drift.
 */
export const httpActivityInterceptor: HttpInterceptorFn = (req, next) => {
  const activity = inject(HttpActivity);
  activity.started();
  return next(req).pipe(finalize(() => activity.ended()));
};
