import { Location } from '@angular/common';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { navData } from '../shell/nav-items';
import { accessGuard, signedInMatch } from './access.guard';
import { Session } from './session.store';

@Component({ selector: 'lw-page', template: 'page' })
class PageStub {}

@Component({ selector: 'lw-home', template: 'home' })
class HomeStub {}

@Component({ selector: 'lw-landing', template: 'landing' })
class LandingStub {}

@Component({ selector: 'lw-forbidden', template: 'not in your role' })
class ForbiddenStub {}

/** A stand-in session whose state is a signal the test sets. */
class FakeSession {
  readonly signedIn = signal(false);
  readonly granted = signal<string[]>([]);
  can(permission: string): boolean {
    return this.granted().includes(permission);
  }
}

describe('accessGuard', () => {
  let session: FakeSession;

  beforeEach(() => {
    session = new FakeSession();
    TestBed.configureTestingModule({
      providers: [
        { provide: Session, useValue: session },
        provideRouter([
          { path: '', pathMatch: 'full', canMatch: [signedInMatch], component: HomeStub },
          { path: '', pathMatch: 'full', component: LandingStub },
          {
            path: 'team',
            canActivate: [accessGuard],
            data: navData('Team', 'group', { permission: 'members:read' }),
            component: PageStub,
          },
          {
            path: 'mine',
            canActivate: [accessGuard],
            data: navData('Mine', 'person', { permission: 'signed-in' }),
            component: PageStub,
          },
          {
            path: 'status',
            canActivate: [accessGuard],
            data: navData('Status', 'monitor_heart'),
            component: PageStub,
          },
          { path: 'not-in-your-role', component: ForbiddenStub },
        ]),
      ],
    });
  });

  let harness: RouterTestingHarness | undefined;

  beforeEach(() => (harness = undefined));

  async function visit(url: string): Promise<{ text: string; address: string; routerUrl: string }> {
    harness ??= await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    return {
      text: harness.routeNativeElement?.textContent ?? '',
      address: TestBed.inject(Location).path(),
      routerUrl: TestBed.inject(Router).url,
    };
  }

  it('opens a page to a signed-in person whose role has its permission', async () => {
    session.signedIn.set(true);
    session.granted.set(['members:read']);
    expect(await visit('/team')).toMatchObject({ text: 'page', address: '/team' });
  });

  it('sends a signed-out person to the start page, remembering the page asked for', async () => {
    const seen = await visit('/team');
    expect(seen.text).toBe('landing');
    // Angular's Location drops the slash of the root path.
    expect(seen.address).toBe('?returnTo=%2Fteam');
  });

  it('shows "not in your role" to a signed-in person without the permission, keeping the address', async () => {
    session.signedIn.set(true);
    session.granted.set(['jobs:read']);
    const seen = await visit('/team');
    expect(seen.text).toBe('not in your role');
    expect(seen.address).toBe('/team');
    expect(seen.routerUrl).toBe('/not-in-your-role?page=%2Fteam');
  });

  it('lets any signed-in person into a signed-in page, and nobody signed out', async () => {
    expect((await visit('/mine')).text).toBe('landing');
    session.signedIn.set(true);
    expect((await visit('/mine')).text).toBe('page');
  });

  it('lets everyone into a public page', async () => {
    expect((await visit('/status')).text).toBe('page');
  });

  it('gives the start page to Home when signed in and to the landing page when not', async () => {
    expect((await visit('/')).text).toBe('landing');
    session.signedIn.set(true);
    await visit('/status');
    expect((await visit('/')).text).toBe('home');
  });
});
