import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import {
  ApplicationConfig,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MAT_ICON_DEFAULT_OPTIONS } from '@angular/material/icon';
import { provideRouter, withInMemoryScrolling } from '@angular/router';
import { routes } from './app.routes';
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
      withInterceptors([httpActivityInterceptor, apiErrorInterceptor]),
    ),
    // Icons come from the outlined font that styles.scss bundles (material-icons package).
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-icons-outlined' } },
  ],
};
