import { Routes } from '@angular/router';
import { accessOf, navData, navItemsFrom, visibleNavItems } from './nav-items';

describe('navItemsFrom', () => {
  const page = () => Promise.resolve(class {});

  it('builds absolute links from the route paths, keeping table order', () => {
    const table: Routes = [
      { path: 'quotes', loadComponent: page, data: navData('Quotes', 'request_quote') },
      { path: '', loadComponent: page, data: navData('Home', 'home') },
    ];
    expect(navItemsFrom(table)).toEqual([
      { link: '/quotes', label: 'Quotes', icon: 'request_quote', access: 'public' },
      { link: '/', label: 'Home', icon: 'home', access: 'public' },
    ]);
  });

  it('leaves out routes without nav data and routes whose nav data is malformed', () => {
    const table: Routes = [
      { path: 'hidden', loadComponent: page },
      { path: 'other', loadComponent: page, data: { title: 'not nav' } },
      { path: 'broken', loadComponent: page, data: { nav: { label: 'No icon' } } },
      { path: 'stock', loadComponent: page, data: navData('Stock', 'inventory_2') },
    ];
    expect(navItemsFrom(table).map((item) => item.link)).toEqual(['/stock']);
  });

  it('carries the permission and the Home hint of a page', () => {
    const data = navData('Team', 'group', { permission: 'members:read', hint: 'People.' });
    expect(accessOf(data)).toBe('members:read');
    expect(navItemsFrom([{ path: 'team', loadComponent: page, data }])).toEqual([
      { link: '/team', label: 'Team', icon: 'group', access: 'members:read', hint: 'People.' },
    ]);
    expect(accessOf(undefined)).toBe('public');
  });

  it('shows public entries to everyone and the rest only to roles that hold the permission', () => {
    const items = navItemsFrom([
      { path: '', loadComponent: page, data: navData('Home', 'home') },
      {
        path: 'team',
        loadComponent: page,
        data: navData('Team', 'group', { permission: 'members:read' }),
      },
      {
        path: 'mine',
        loadComponent: page,
        data: navData('Mine', 'person', { permission: 'signed-in' }),
      },
    ]);
    const links = (signedIn: boolean, granted: string[]) =>
      visibleNavItems(items, { signedIn, can: (p) => granted.includes(p) }).map((i) => i.link);
    expect(links(false, [])).toEqual(['/']);
    // Signed out, even a stale permission shows nothing more.
    expect(links(false, ['members:read'])).toEqual(['/']);
    expect(links(true, [])).toEqual(['/', '/mine']);
    expect(links(true, ['members:read'])).toEqual(['/', '/team', '/mine']);
  });
});
