import { inject } from '@angular/core';
import { CanActivateFn, CanMatchFn, RedirectCommand, Router } from '@angular/router';
import { accessOf } from '../shell/nav-items';
import { Session } from './session.store';

/**
 * Lets a person into a route only when their role may use it (`access` in the route's data,
 * see `navData`). Signed out: the start page, whose Sign in link returns to the page asked
 * for. Signed in without the permission: the "not in your role" page, shown at the address
 * asked for (the address bar keeps it, so the person can tell someone which page it was).
 */
export const accessGuard: CanActivateFn = (route, state) => {
  const session = inject(Session);
  const router = inject(Router);
  const access = accessOf(route.data);
  if (access === 'public') return true;
  if (!session.signedIn()) {
    return new RedirectCommand(
      router.createUrlTree(['/'], { queryParams: { returnTo: state.url } }),
    );
  }
  if (access === 'signed-in' || session.can(access)) return true;
  return new RedirectCommand(
    router.createUrlTree(['/not-in-your-role'], { queryParams: { page: state.url } }),
    { browserUrl: state.url },
  );
};

/** Matches only while someone is signed in: the start page is Home then, the landing page before. */
export const signedInMatch: CanMatchFn = () => inject(Session).signedIn();
