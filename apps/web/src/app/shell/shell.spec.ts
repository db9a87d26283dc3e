import { BreakpointObserver, BreakpointState } from '@angular/cdk/layout';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { BehaviorSubject, Observable, map } from 'rxjs';
import { routes } from '../app.routes';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';
import { HttpActivity } from './http-activity';
import { navItemsFrom, visibleNavItems } from './nav-items';
import { Shell } from './shell';

describe('Shell', () => {
  /** Stands in for the viewport: true means a phone held upright. */
  const phone = new BehaviorSubject(false);
  const breakpoints: Pick<BreakpointObserver, 'observe'> = {
    observe: (): Observable<BreakpointState> =>
      phone.pipe(map((matches) => ({ matches, breakpoints: {} }))),
  };

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Shell],
      providers: [
        provideRouter(routes),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BreakpointObserver, useValue: breakpoints },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    // The account bar is a deferred block: its component is resolved here.
    await TestBed.compileComponents();
  });

  async function render(onPhone = false): Promise<ComponentFixture<Shell>> {
    phone.next(onPhone);
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    return fixture;
  }

  function query<T extends Element>(fixture: ComponentFixture<Shell>, selector: string): T | null {
    return (fixture.nativeElement as HTMLElement).querySelector<T>(selector);
  }

  /** Signs the session in as `role` with `permissions`, as `/me` would answer. */
  async function signInAs(role: string, permissions: string[], firms = 1): Promise<void> {
    const loaded = TestBed.inject(Session).load();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/v1/me')
      .flush(meOf(role, permissions, firms));
    await loaded;
  }

  function navLinks(fixture: ComponentFixture<Shell>): string[][] {
    return [
      ...(fixture.nativeElement as HTMLElement).querySelectorAll<HTMLAnchorElement>(
        'nav[aria-label="Main"] a',
      ),
    ].map((a) => [a.getAttribute('href') ?? '', a.textContent?.trim() ?? '']);
  }

  it('shows the product name and a sign-in link to the API', async () => {
    const fixture = await render();
    expect(query(fixture, '.brand')?.textContent).toContain('Latchwork');
    const signIn = query<HTMLAnchorElement>(fixture, 'a[href="/api/v1/auth/login"]');
    expect(signIn?.textContent).toContain('Sign in');
  });

  it('signed in: shows the person, the firm and Sign out, and the pages of their role', async () => {
    await signInAs('owner', ['members:read', 'members:write', 'settings:write', 'audit:read']);
    const fixture = await render();
    await fixture.whenStable();
    const bar = query(fixture, '.top-bar')?.textContent ?? '';
    expect(bar).toContain('Ivy Marchetti');
    expect(bar).toContain('Kestrel Floorworks Ltd');
    expect(bar).toContain('Sign out');
    expect(query(fixture, 'a[href^="/api/v1/auth/login"]')).toBeNull();
    expect(navLinks(fixture).map(([href]) => href)).toEqual([
      '/',
      '/team',
      '/settings',
      '/audit',
      '/status',
      '/api/v1/docs',
    ]);
  });

  it('signed in with a role without those permissions: none of the owner pages', async () => {
    await signInAs('installer', ['jobs:read', 'settings:read']);
    const fixture = await render();
    expect(navLinks(fixture).map(([href]) => href)).toEqual([
      '/',
      '/jobs',
      '/status',
      '/api/v1/docs',
    ]);
  });

  it('offers a firm menu only to a person of more than one firm', async () => {
    await signInAs('bookkeeper', ['invoices:read'], 2);
    const fixture = await render();
    await fixture.whenStable();
    expect(
      query(fixture, 'button[aria-label="Firm: Kestrel Floorworks Ltd. Switch firm"]'),
    ).not.toBeNull();
  });

  it('lists exactly the public navigation entries of the route table when signed out, plus the API reference', async () => {
    const fixture = await render();
    const links = navLinks(fixture);
    const fromRoutes = visibleNavItems(navItemsFrom(routes), {
      signedIn: false,
      can: () => false,
    }).map((item) => [item.link, item.label]);
    expect(fromRoutes.map(([link]) => link)).toEqual(['/', '/status']);
    expect(links).toEqual([
      ...fromRoutes.map(([link, label]) => [link, expect.stringContaining(label)]),
      ['/api/v1/docs', expect.stringContaining('API reference')],
    ]);
  });

  it('shows the loading bar only while requests are in flight', async () => {
    const fixture = await render();
    const activity = TestBed.inject(HttpActivity);
    expect(query(fixture, 'mat-progress-bar')).toBeNull();

    activity.started();
    await fixture.whenStable();
    expect(query(fixture, 'mat-progress-bar')).not.toBeNull();

    activity.ended();
    await fixture.whenStable();
    expect(query(fixture, 'mat-progress-bar')).toBeNull();
  });

  it('uses an always-open rail on wide screens, with no menu button', async () => {
    const fixture = await render();
    expect(query(fixture, '.nav--rail')).not.toBeNull();
    expect(query(fixture, 'mat-sidenav')?.classList).toContain('mat-drawer-opened');
    expect(query(fixture, 'button[aria-label="Open navigation"]')).toBeNull();
  });

  it('uses a closed drawer behind a menu button on phones', async () => {
    const fixture = await render(true);
    const menu = query<HTMLButtonElement>(fixture, 'button[aria-label="Open navigation"]');
    expect(query(fixture, '.nav--drawer')).not.toBeNull();
    expect(query(fixture, 'mat-sidenav')?.classList).not.toContain('mat-drawer-opened');
    expect(menu?.getAttribute('aria-expanded')).toBe('false');

    menu?.click();
    await fixture.whenStable();
    expect(menu?.getAttribute('aria-expanded')).toBe('true');
    expect(query(fixture, 'mat-sidenav')?.classList).toContain('mat-drawer-opened');
  });
});
