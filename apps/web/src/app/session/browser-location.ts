import { InjectionToken } from '@angular/core';

/**
 * The part of `window.location` the app uses to leave the single-page app (sign-out at the
 * identity provider). A token so that tests can watch where the app sends the browser.
 */
export interface BrowserLocation {
  assign(url: string): void;
}

export const BROWSER_LOCATION = new InjectionToken<BrowserLocation>('BROWSER_LOCATION', {
  providedIn: 'root',
  factory: () => ({ assign: (url: string) => window.location.assign(url) }),
});
