import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { BROWSER_LOCATION } from './browser-location';
import { meOf } from './me-fixture';
import { Me, Session } from './session.store';

describe('Session', () => {
  let session: Session;
  let backend: HttpTestingController;
  const location = { assign: vi.fn() };

  beforeEach(() => {
    location.assign.mockClear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_LOCATION, useValue: location },
      ],
    });
    session = TestBed.inject(Session);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function load(answer: Me | { status: number }): Promise<void> {
    const done = session.load();
    const req = backend.expectOne('/api/v1/me');
    if ('status' in answer)
      req.flush({ error: { code: 'x', message: 'x' } }, { status: answer.status, statusText: 'x' });
    else req.flush(answer);
    await done;
  }

  it('is signed in with the person, the firm and the permissions /me returns', async () => {
    await load(meOf('bookkeeper', ['invoices:read', 'settings:read']));
    expect(session.signedIn()).toBe(true);
    expect(session.user()?.name).toBe('Ivy Marchetti');
    expect(session.activeTenant()?.name).toBe('Kestrel Floorworks Ltd');
    expect(session.can('invoices:read')).toBe(true);
    expect(session.can('members:read')).toBe(false);
  });

  it('is signed out, with no permissions, when /me answers 401', async () => {
    await load({ status: 401 });
    expect(session.signedIn()).toBe(false);
    expect(session.me()).toBeNull();
    expect(session.can('settings:read')).toBe(false);
    expect(session.signedOutReason()).toBe('signed-out');
  });

  it('starts signed out when the API cannot be reached, rather than failing to start', async () => {
    const done = session.load();
    backend.expectOne('/api/v1/me').error(new ProgressEvent('error'));
    await done;
    expect(session.signedIn()).toBe(false);
  });

  it('switches firm with PUT /me/active-tenant and takes the new role from the answer', async () => {
    await load(meOf('owner', ['members:read'], 2));
    const done = session.switchTenant('firm-b');
    const req = backend.expectOne('/api/v1/me/active-tenant');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ tenantId: 'firm-b' });
    const other = meOf('bookkeeper', ['invoices:read'], 2);
    req.flush({
      ...other,
      activeTenant: { ...other.activeTenant, id: 'firm-b', name: 'Pennick & Daughters Flooring' },
    });
    await done;
    expect(session.activeTenant()?.name).toBe('Pennick & Daughters Flooring');
    expect(session.can('members:read')).toBe(false);
    expect(session.can('invoices:read')).toBe(true);
  });

  it('signs out at the API, then sends the browser to the provider’s sign-out page', async () => {
    await load(meOf('installer', ['jobs:read']));
    const done = session.signOut();
    const req = backend.expectOne('/api/v1/auth/logout');
    expect(req.request.method).toBe('POST');
    req.flush({ signOutUrl: 'http://127.0.0.1:13400/session/end?id_token_hint=t' });
    await done;
    expect(session.signedIn()).toBe(false);
    expect(location.assign).toHaveBeenCalledWith(
      'http://127.0.0.1:13400/session/end?id_token_hint=t',
    );
  });

  it('goes to the start page after signing out when the provider has no sign-out page', async () => {
    await load(meOf('installer', ['jobs:read']));
    const done = session.signOut();
    backend.expectOne('/api/v1/auth/logout').flush({ signOutUrl: null });
    await done;
    expect(location.assign).toHaveBeenCalledWith('/');
  });

  it('remembers where a session ended, and its Sign in link returns there', async () => {
    await load(meOf('owner', ['members:read']));
    session.expire('/team?x=1');
    expect(session.signedIn()).toBe(false);
    expect(session.signedOutReason()).toBe('session-ended');
    expect(session.signInLink('/')).toBe('/api/v1/auth/login?returnTo=%2Fteam%3Fx%3D1');
  });

  it('ignores an expiry while already signed out (a 401 is then the ordinary answer)', async () => {
    await load({ status: 401 });
    session.expire('/team');
    expect(session.signedOutReason()).toBe('signed-out');
    expect(session.signInLink('/status')).toBe('/api/v1/auth/login?returnTo=%2Fstatus');
  });
});
