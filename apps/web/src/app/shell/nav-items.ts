import { Data, Routes } from '@angular/router';

/** What a route shows in the navigation rail/drawer. */
export interface NavEntry {
  readonly label: string;
  /** Ligature name in the outlined Material Icons font, e.g. `monitor_heart`. */
  readonly icon: string;
}

/** One navigation entry with the absolute link it points to. */
export interface NavItem extends NavEntry {
  readonly link: string;
}

const NAV_KEY = 'nav';

/**
 * Route `data` that puts the route into the navigation. The route table is the only place where
 * navigation entries are declared; the shell derives its list with {@link navItemsFrom}.
 */
export function navData(label: string, icon: string): Data {
  const entry: NavEntry = { label, icon };
  return { [NAV_KEY]: entry };
}

/** The navigation entries of a route table, in table order; routes without nav data are left out. */
export function navItemsFrom(routes: Routes): NavItem[] {
  return routes.flatMap((route) => {
    const entry: unknown = route.data?.[NAV_KEY];
    if (!isNavEntry(entry)) {
      return [];
    }
    return [{ link: `/${route.path ?? ''}`, label: entry.label, icon: entry.icon }];
  });
}

function isNavEntry(value: unknown): value is NavEntry {
  return (
    typeof value === 'object' &&
    value !== null &&
    typeof (value as NavEntry).label === 'string' &&
    typeof (value as NavEntry).icon === 'string'
  );
}
