import { Routes } from '@angular/router';
import { navData, navItemsFrom } from './nav-items';

describe('navItemsFrom', () => {
  const page = () => Promise.resolve(class {});

  it('builds absolute links from the route paths, keeping table order', () => {
    const table: Routes = [
      { path: 'quotes', loadComponent: page, data: navData('Quotes', 'request_quote') },
      { path: '', loadComponent: page, data: navData('Home', 'home') },
    ];
    expect(navItemsFrom(table)).toEqual([
      { link: '/quotes', label: 'Quotes', icon: 'request_quote' },
      { link: '/', label: 'Home', icon: 'home' },
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
});
