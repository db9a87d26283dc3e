import { BreakpointObserver, BreakpointState } from '@angular/cdk/layout';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { BehaviorSubject, Observable, map } from 'rxjs';
import { routes } from '../app.routes';
import { HttpActivity } from './http-activity';
import { navItemsFrom } from './nav-items';
import { Shell } from './shell';

describe('Shell', () => {
  /** Stands in for the viewport: true means a phone held upright. */
  const phone = new BehaviorSubject(false);
  const breakpoints: Pick<BreakpointObserver, 'observe'> = {
    observe: (): Observable<BreakpointState> =>
      phone.pipe(map((matches) => ({ matches, breakpoints: {} }))),
  };

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(routes),
        { provide: BreakpointObserver, useValue: breakpoints },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
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

  it('shows the product name and a sign-in link to the API', async () => {
    const fixture = await render();
    expect(query(fixture, '.brand')?.textContent).toContain('Latchwork');
    const signIn = query<HTMLAnchorElement>(fixture, 'a[href="/api/v1/auth/login"]');
    expect(signIn?.textContent).toContain('Sign in');
  });

  it('lists exactly the navigation entries of the route table, plus the API reference', async () => {
    const fixture = await render();
    const links = [
      ...(fixture.nativeElement as HTMLElement).querySelectorAll<HTMLAnchorElement>(
        'nav[aria-label="Main"] a',
      ),
    ];
    const fromRoutes = navItemsFrom(routes).map((item) => [item.link, item.label]);
    expect(links.map((a) => [a.getAttribute('href'), a.textContent?.trim()])).toEqual([
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
