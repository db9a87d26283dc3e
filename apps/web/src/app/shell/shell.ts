import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbar } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';
import { returnToOf } from '../session/sign-in-link';
import { Session } from '../session/session.store';
import { AccountBar } from './account-bar';
import { HttpActivity } from './http-activity';
import { NavList } from './nav-list';
import { navItemsFrom, visibleNavItems } from './nav-items';

/** Below this width the rail turns into a drawer behind a menu button (phones held upright). */
export const PHONE_QUERY = '(max-width: 599.98px)';

/**
 * The frame around every page: top bar, navigation (a rail on wide screens, a drawer on phones),
 * the loading bar and the routed page.
 */
@Component({
  selector: 'lw-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    MatToolbar,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
    MatSidenav,
    MatSidenavContainer,
    MatSidenavContent,
    NavList,
    AccountBar,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly router = inject(Router);

  protected readonly activity = inject(HttpActivity);
  protected readonly session = inject(Session);

  /** Derived from the live route table, so a new route with nav data shows up by itself. */
  private readonly allNavItems = navItemsFrom(this.router.config);

  /** Only what the person's role may use; public pages for everyone. */
  protected readonly navItems = computed(() =>
    visibleNavItems(this.allNavItems, {
      signedIn: this.session.signedIn(),
      can: (permission) => this.session.can(permission),
    }),
  );

  private readonly url = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map(() => this.router.url),
    ),
    { initialValue: this.router.url },
  );

  /** Sign in brings the person back to the page they are on (or were sent away from). */
  protected readonly signInLink = computed(() =>
    this.session.signInLink(returnToOf(this.url()) ?? '/'),
  );

  protected readonly isPhone = toSignal(
    inject(BreakpointObserver)
      .observe(PHONE_QUERY)
      .pipe(map((state) => state.matches)),
    // The observer answers at once, so the first render already has the right layout.
    { requireSync: true },
  );

  /** Only meaningful on phones; on wide screens the rail is always shown. */
  protected readonly drawerOpen = signal(false);

  constructor() {
    // A drawer left open after choosing a page would hide the page the person asked for.
    this.router.events
      .pipe(
        filter((event) => event instanceof NavigationEnd),
        takeUntilDestroyed(),
      )
      .subscribe(() => this.drawerOpen.set(false));
  }
}
