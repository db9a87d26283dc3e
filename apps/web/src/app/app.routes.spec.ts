import { Type, reflectComponentType } from '@angular/core';
import { Route } from '@angular/router';
import { isObservable, lastValueFrom } from 'rxjs';
import { isPermission } from '@latchwork/shared-access';
import { routes } from './app.routes';
import { navItemsFrom } from './shell/nav-items';

/** Runs a route's lazy loader and unwraps whatever form it returns the component in. */
async function loadComponentOf(route: Route): Promise<unknown> {
  const loaded = route.loadComponent?.();
  const value = isObservable(loaded) ? await lastValueFrom(loaded) : await loaded;
  return value && typeof value === 'object' && 'default' in value ? value.default : value;
}

describe('app route table', () => {
  it('derives the navigation from the routes that carry nav data, in table order', () => {
    expect(navItemsFrom(routes).map((item) => [item.link, item.label, item.access])).toEqual([
      ['/', 'Home', 'public'],
      ['/jobs', 'Jobs', 'jobs:read'],
      ['/customers', 'Customers', 'customers:read'],
      ['/takeoff', 'Takeoff', 'takeoffs:read'],
      ['/stock', 'Stock', 'stock:read'],
      ['/team', 'Team', 'members:read'],
      ['/settings', 'Firm settings', 'settings:write'],
      ['/audit', 'Audit log', 'audit:read'],
      ['/status', 'System status', 'public'],
    ]);
  });

  it('names only permissions of the role table, and guards every page that needs one', () => {
    for (const item of navItemsFrom(routes)) {
      if (item.access === 'public' || item.access === 'signed-in') continue;
      expect(isPermission(item.access), item.link).toBe(true);
      const route = routes.find((r) => `/${r.path}` === item.link);
      expect(route?.canActivate?.length, `${item.link} has no guard`).toBeGreaterThan(0);
    }
  });

  it('loads every page lazily, never eagerly', () => {
    for (const route of routes) {
      expect(route.component, `route "${route.path}" is eager`).toBeUndefined();
      expect(
        Boolean(route.loadComponent || route.loadChildren || route.redirectTo),
        `route "${route.path}" has neither loadComponent nor loadChildren`,
      ).toBe(true);
    }
  });

  it('resolves each lazy route to a standalone component', async () => {
    for (const route of routes.filter((r) => r.loadComponent)) {
      const component = await loadComponentOf(route);
      const mirror = reflectComponentType(component as Type<unknown>);
      expect(mirror?.isStandalone, `route "${route.path}"`).toBe(true);
      expect(mirror?.selector).toMatch(/^lw-/);
    }
  });

  it('ends with the single catch-all, so it cannot shadow a real page', () => {
    expect(routes.at(-1)?.path).toBe('**');
    expect(routes.filter((route) => route.path === '**')).toHaveLength(1);
  });

  it('gives every page a document title', () => {
    for (const route of routes) {
      expect(route.title, `route "${route.path}"`).toMatch(/Latchwork/);
    }
  });
});
