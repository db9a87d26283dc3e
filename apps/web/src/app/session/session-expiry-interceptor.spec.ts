import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { BROWSER_LOCATION } from './browser-location';
import { sessionExpiryInterceptor } from './session-expiry-interceptor';
import { meOf } from './me-fixture';
import { Session } from './session.store';

@Component({ selector: 'lw-stub', template: '' })
class Stub {}

describe('sessionExpiryInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let session: Session;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([sessionExpiryInterceptor])),
        provideHttpClientTesting(),
        provideRouter([{ path: '**', component: Stub }]),
        { provide: BROWSER_LOCATION, useValue: { assign: vi.fn() } },
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    session = TestBed.inject(Session);
    router = TestBed.inject(Router);
    await router.navigateByUrl('/audit?action=sign-in');
  });

  afterEach(() => backend.verify());

  async function signIn(): Promise<void> {
    const done = session.load();
    backend.expectOne('/api/v1/me').flush(meOf('owner', ['audit:read']));
    await done;
  }

  /** Sends a GET that the server answers with `status`; resolves with what the caller got. */
  async function call(status: number): Promise<unknown> {
    const result = firstValueFrom(http.get('/api/v1/audit')).catch((err: unknown) => err);
    backend
      .expectOne('/api/v1/audit')
      .flush({ error: { code: 'c', message: 'm' } }, { status, statusText: 'x' });
    return result;
  }

  it('on a 401 while signed in: forgets the person, goes to the start page, remembers the page', async () => {
    await signIn();
    const outcome = await call(401);
    await TestBed.inject(Router).navigated;
    await new Promise((resolve) => setTimeout(resolve));

    expect(outcome).toMatchObject({ status: 401 });
    expect(session.signedIn()).toBe(false);
    expect(session.signedOutReason()).toBe('session-ended');
    expect(router.url).toBe('/');
    expect(session.signInLink('/')).toBe('/api/v1/auth/login?returnTo=%2Faudit%3Faction%3Dsign-in');
  });

  it('leaves the session alone on other errors', async () => {
    await signIn();
    expect(await call(403)).toMatchObject({ status: 403 });
    expect(await call(500)).toMatchObject({ status: 500 });
    expect(session.signedIn()).toBe(true);
    expect(router.url).toBe('/audit?action=sign-in');
  });

  it('does nothing on a 401 while signed out: that is the ordinary signed-out answer', async () => {
    expect(await call(401)).toMatchObject({ status: 401 });
    expect(session.signedOutReason()).toBe('signed-out');
    expect(router.url).toBe('/audit?action=sign-in');
  });
});
