import {
  HttpContextToken,
  HttpErrorResponse,
  HttpInterceptorFn,
  HttpStatusCode,
} from '@angular/common/http';
import { Injector, inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';

/**
 * Set to `false` on a request whose caller shows its own error state (the status page does), so
 * that the same failure is not reported twice.
 */
export const SHOW_ERROR_SNACKBAR = new HttpContextToken<boolean>(() => true);

/** Text shown when the request never got an answer (offline, server stopped, DNS, CORS). */
export const NETWORK_ERROR_TEXT =
  'Could not reach Latchwork. Check your connection, then try again.';

/** How long an error stays on screen; long enough to read a sentence twice. */
const SNACKBAR_MS = 8000;

/** The error body every Latchwork API error carries. */
interface ApiErrorBody {
  error: { code: string; message: string };
}

/**
 * Shows a failed API call in a snackbar with the API's own message, then passes the error on
 * unchanged so callers can still react. A 401 is left to the sign-in flow, which redirects.
 */
export const apiErrorInterceptor: HttpInterceptorFn = (req, next) => {
  const injector = inject(Injector);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (
        err instanceof HttpErrorResponse &&
        err.status !== HttpStatusCode.Unauthorized &&
        req.context.get(SHOW_ERROR_SNACKBAR)
      ) {
        void showInSnackBar(injector, apiErrorMessage(err));
      }
      return throwError(() => err);
    }),
  );
};

/**
 * The snack bar (with the overlay machinery under it) is loaded on the first error, not with
 * the app: it is a sizeable part of the initial bundle that most visits never need.
 */
async function showInSnackBar(injector: Injector, message: string): Promise<void> {
  const { MatSnackBar } = await import('@angular/material/snack-bar');
  injector.get(MatSnackBar).open(message, 'Dismiss', { duration: SNACKBAR_MS });
}

/** A sentence for a person, from the API's error shape, the HTTP status, or a network failure. */
export function apiErrorMessage(err: HttpErrorResponse): string {
  if (err.status === 0) {
    return NETWORK_ERROR_TEXT;
  }
  const body = parseBody(err.error);
  if (isApiErrorBody(body)) {
    return body.error.message;
  }
  const reason = err.statusText && err.statusText !== 'OK' ? ` ${err.statusText}` : '';
  return `The server answered ${err.status}${reason}. Please try again.`;
}

/** Bodies of non-JSON requests arrive as text; an API error is still JSON inside. */
function parseBody(body: unknown): unknown {
  if (typeof body !== 'string') {
    return body;
  }
  try {
    return JSON.parse(body) as unknown;
  } catch {
    return body;
  }
}

function isApiErrorBody(body: unknown): body is ApiErrorBody {
  if (typeof body !== 'object' || body === null) {
    return false;
  }
  const error: unknown = (body as { error?: unknown }).error;
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as { message?: unknown }).message === 'string' &&
    (error as { message: string }).message.length > 0
  );
}
