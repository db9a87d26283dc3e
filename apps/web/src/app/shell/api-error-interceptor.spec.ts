import { HttpClient, HttpContext, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ApplicationRef } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  NETWORK_ERROR_TEXT,
  SHOW_ERROR_SNACKBAR,
  apiErrorInterceptor,
} from './api-error-interceptor';

describe('apiErrorInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    TestBed.inject(MatSnackBar).dismiss();
    backend.verify();
  });

  /**
   * The text of the snackbar on screen, or null when none is shown. The snack bar is loaded on
   * the first error, so a few turns of the event loop pass before it can appear.
   */
  async function snackbarText(): Promise<string | null> {
    for (let turn = 0; turn < 5; turn++) {
      await new Promise((resolve) => setTimeout(resolve));
      TestBed.inject(ApplicationRef).tick();
    }
    await TestBed.inject(ApplicationRef).whenStable();
    const label = document.querySelector('.mat-mdc-simple-snack-bar .mat-mdc-snack-bar-label');
    return label ? (label.textContent ?? '').trim() : null;
  }

  /** Sends a GET and records what reaches the caller, to prove the error is passed on. */
  function send(url: string, context?: HttpContext): { error?: unknown } {
    const outcome: { error?: unknown } = {};
    http.get(url, { context }).subscribe({ error: (err: unknown) => (outcome.error = err) });
    return outcome;
  }

  it("shows the API's own error message and still hands the error to the caller", async () => {
    const outcome = send('/api/v1/quotes/42');
    backend
      .expectOne('/api/v1/quotes/42')
      .flush(
        { error: { code: 'quote_not_found', message: 'That quote no longer exists.' } },
        { status: 404, statusText: 'Not Found' },
      );

    expect(await snackbarText()).toBe('That quote no longer exists.');
    expect(outcome.error).toMatchObject({ status: 404 });
  });

  it('reads the error shape from a body that arrived as text', async () => {
    http.get('/api/v1/export', { responseType: 'text' }).subscribe({ error: () => undefined });
    backend
      .expectOne('/api/v1/export')
      .flush('{"error":{"code":"busy","message":"Try the export again in a minute."}}', {
        status: 429,
        statusText: 'Too Many Requests',
      });

    expect(await snackbarText()).toBe('Try the export again in a minute.');
  });

  it('says the server could not be reached when no answer came back', async () => {
    send('/api/v1/jobs');
    backend.expectOne('/api/v1/jobs').error(new ProgressEvent('error'));

    expect(await snackbarText()).toBe(NETWORK_ERROR_TEXT);
  });

  it('falls back to the HTTP status when the body is not the API error shape', async () => {
    send('/api/v1/jobs');
    backend.expectOne('/api/v1/jobs').flush('<html>upstream down</html>', {
      status: 502,
      statusText: 'Bad Gateway',
    });

    expect(await snackbarText()).toBe('The server answered 502 Bad Gateway. Please try again.');
  });

  it('stays quiet on 401, which the sign-in flow handles', async () => {
    const outcome = send('/api/v1/me');
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'unauthenticated', message: 'Sign in first.' } },
        { status: 401, statusText: 'Unauthorized' },
      );

    expect(await snackbarText()).toBeNull();
    expect(outcome.error).toMatchObject({ status: 401 });
  });

  it('stays quiet when the caller shows the error itself', async () => {
    send('/api/v1/health', new HttpContext().set(SHOW_ERROR_SNACKBAR, false));
    backend.expectOne('/api/v1/health').error(new ProgressEvent('error'));

    expect(await snackbarText()).toBeNull();
  });

  it('shows nothing for a successful call', async () => {
    send('/api/v1/health');
    backend.expectOne('/api/v1/health').flush({ status: 'up', checks: {} });

    expect(await snackbarText()).toBeNull();
  });
});
