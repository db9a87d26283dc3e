import { Routes } from '@angular/router';
import { navData } from './shell/nav-items';

/**
 * The one route table. Every route is lazy (`loadComponent`/`loadChildren`) so that the initial
 * bundle holds only the shell; routes with `navData` appear in the navigation in this order.
 * The catch-all must stay last: the router matches in order.
 */
export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Latchwork',
    data: navData('Home', 'home'),
    loadComponent: () => import('./pages/landing-page/landing-page').then((m) => m.LandingPage),
  },
  {
    path: 'status',
    title: 'System status · Latchwork',
    data: navData('System status', 'monitor_heart'),
    loadComponent: () => import('./pages/status-page/status-page').then((m) => m.StatusPage),
  },
  {
    path: '**',
    title: 'Page not found · Latchwork',
    loadComponent: () =>
      import('./pages/not-found-page/not-found-page').then((m) => m.NotFoundPage),
  },
];
