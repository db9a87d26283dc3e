import { HttpErrorResponse, HttpInterceptorFn, HttpStatusCode } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { Session } from './session.store';

/**
 * Any API call answering 401 while the app believes it is signed in means the session ended
 * (expired, signed out in another tab, server forgot it). The app forgets the person and shows
 * the start page, which says so and offers a Sign in link back to where they were. The error
 * still reaches the caller, which stops whatever it was doing.
 */
export const sessionExpiryInterceptor: HttpInterceptorFn = (req, next) => {
  const session = inject(Session);
  const router = inject(Router);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (
        err instanceof HttpErrorResponse &&
        err.status === HttpStatusCode.Unauthorized &&
        session.signedIn()
      ) {
        session.expire(router.url);
        void router.navigateByUrl('/', { onSameUrlNavigation: 'reload' });
      }
      return throwError(() => err);
    }),
  );
};
