import { Data, Routes } from '@angular/router';
import type { Access } from '@latchwork/shared-access';

/** What a route shows in the navigation rail/drawer. */
export interface NavEntry {
  readonly label: string;
  /** Ligature name in the outlined Material Icons font, e.g. `monitor_heart`. */
  readonly icon: string;
  /** One sentence for the Home page: what the person can do there. */
  readonly hint?: string;
}

/** One navigation entry with the absolute link it points to and who may use it. */
export interface NavItem extends NavEntry {
  readonly link: string;
  readonly access: Access;
}

/** Options of {@link navData}. */
export interface NavOptions {
  /** Who may open the page: a permission of the role table, `signed-in`, or `public` (default). */
  readonly permission?: Access;
  /** One sentence for the Home page: what the person can do there. */
  readonly hint?: string;
}

const NAV_KEY = 'nav';
const ACCESS_KEY = 'access';

/**
 * Route `data` that puts the route into the navigation and says who may open it. The route
 * table is the only place where navigation entries and their permissions are declared; the
 * shell derives its list with {@link navItemsFrom} and `accessGuard` enforces the permission.
 */
export function navData(label: string, icon: string, options: NavOptions = {}): Data {
  const entry: NavEntry = options.hint ? { label, icon, hint: options.hint } : { label, icon };
  return { [NAV_KEY]: entry, ...accessData(options.permission ?? 'public') };
}

/** Route `data` for a page that is not in the navigation but still needs a permission. */
export function accessData(access: Access): Data {
  return { [ACCESS_KEY]: access };
}

/** Who may open a route, from its data; a route that says nothing is public. */
export function accessOf(data: Data | undefined): Access {
  const access: unknown = data?.[ACCESS_KEY];
  return typeof access === 'string' ? (access as Access) : 'public';
}

/** The navigation entries of a route table, in table order; routes without nav data are left out. */
export function navItemsFrom(routes: Routes): NavItem[] {
  return routes.flatMap((route) => {
    const entry: unknown = route.data?.[NAV_KEY];
    if (!isNavEntry(entry)) {
      return [];
    }
    const link = `/${route.path ?? ''}`;
    const item = { link, label: entry.label, icon: entry.icon, access: accessOf(route.data) };
    return [typeof entry.hint === 'string' ? { ...item, hint: entry.hint } : item];
  });
}

/** What a person may see: public entries always, the rest by sign-in and permission. */
export function visibleNavItems(
  items: readonly NavItem[],
  viewer: { signedIn: boolean; can(permission: string): boolean },
): NavItem[] {
  return items.filter(
    (item) =>
      item.access === 'public' ||
      (viewer.signedIn && (item.access === 'signed-in' || viewer.can(item.access))),
  );
}

function isNavEntry(value: unknown): value is NavEntry {
  return (
    typeof value === 'object' &&
    value !== null &&
    typeof (value as NavEntry).label === 'string' &&
    typeof (value as NavEntry).icon === 'string'
  );
}
