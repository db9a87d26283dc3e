import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import { permissionsOf, isRole } from '@latchwork/shared-access';
import { roleLabel } from '../../session/role-label';
import { Session } from '../../session/session.store';
import { navItemsFrom, visibleNavItems } from '../../shell/nav-items';

/** What each area of the product will hold, for the "coming" list; named by permission area. */
const AREAS: Readonly<Record<string, string>> = {
  customers: 'customers and sites',
  jobs: 'jobs',
  takeoffs: 'takeoffs',
  stock: 'stock',
  quotes: 'quotes',
  invoices: 'invoices',
  margins: 'margins',
};

/**
 * The signed-in start page: the firm in use, the person's role there, and the pages that role
 * may open now. Only pages that exist are linked; the role's other areas are named as coming.
 */
@Component({
  selector: 'lw-home-page',
  imports: [MatIcon, RouterLink],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  private readonly router = inject(Router);
  protected readonly session = inject(Session);

  protected readonly role = computed(() => roleLabel(this.session.activeTenant()?.role ?? ''));

  protected readonly firstName = computed(() => this.session.user()?.name.split(' ')[0] ?? '');

  /** Every page of the navigation this person may open, Home itself left out. */
  protected readonly pages = computed(() =>
    visibleNavItems(navItemsFrom(this.router.config), {
      signedIn: this.session.signedIn(),
      can: (permission) => this.session.can(permission),
    }).filter((item) => item.link !== '/'),
  );

  /** The role's areas of work that have no page yet, so the person knows what to expect. */
  protected readonly coming = computed(() => {
    const role = this.session.activeTenant()?.role ?? '';
    if (!isRole(role)) return [];
    const areas = new Set(permissionsOf(role).map((p) => p.split(':')[0]));
    return Object.entries(AREAS)
      .filter(([area]) => areas.has(area))
      .map(([, words]) => words);
  });
}
