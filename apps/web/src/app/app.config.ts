import {
  provideHttpClient,
  withFetch,
  withInterceptors,
  withXsrfConfiguration,
} from '@angular/common/http';
import {
  ApplicationConfig,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MAT_ICON_DEFAULT_OPTIONS } from '@angular/material/icon';
import { provideRouter, withInMemoryScrolling } from '@angular/router';
import { routes } from './app.routes';
import { sessionExpiryInterceptor } from './session/session-expiry-interceptor';
import { Session } from './session/session.store';
import { apiErrorInterceptor } from './shell/api-error-interceptor';
import { httpActivityInterceptor } from './shell/http-activity';

/** Application-wide providers: zoneless change detection, the route table and the HTTP pipeline. */
export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withInMemoryScrolling({ scrollPositionRestoration: 'top' })),
    // The activity counter sits outermost so that it sees every request, failed ones included.
    provideHttpClient(
      withFetch(),
      // The API's CSRF check wants the session's token back in this header on every
      // state-changing request; HttpClient copies it from the cookie for relative URLs.
      withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
      withInterceptors([httpActivityInterceptor, sessionExpiryInterceptor, apiErrorInterceptor]),
    ),
    // Who is signed in decides the first page and the navigation, so ask before the first route.
    provideAppInitializer(() => inject(Session).load()),
    // Icons come from the outlined font that styles.scss bundles (material-icons package).
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-icons-outlined' } },
  ],
};
