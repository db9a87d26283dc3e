import { Routes } from '@angular/router';
import { accessGuard, signedInMatch } from './session/access.guard';
import { navData } from './shell/nav-items';

/**
 * The one route table. Every route is lazy (`loadComponent`/`loadChildren`) so that the initial
 * bundle holds only the shell; routes with `navData` appear in the navigation in this order,
 * shown only to roles whose permissions include the route's, and `accessGuard` enforces it.
 * The catch-all must stay last: the router matches in order.
 */
export const routes: Routes = [
  {
    // Signed in, the start page is the person's Home; signed out, the next route's landing page.
    path: '',
    pathMatch: 'full',
    title: 'Home · Latchwork',
    canMatch: [signedInMatch],
    data: navData('Home', 'home'),
    loadComponent: () => import('./pages/home-page/home-page').then((m) => m.HomePage),
  },
  {
    path: '',
    pathMatch: 'full',
    title: 'Latchwork',
    loadComponent: () => import('./pages/landing-page/landing-page').then((m) => m.LandingPage),
  },
  {
    path: 'jobs',
    title: 'Jobs · Latchwork',
    canActivate: [accessGuard],
    data: navData('Jobs', 'view_kanban', {
      permission: 'jobs:read',
      hint: 'Every job from enquiry to payment, as a board or a table, with its survey and files.',
    }),
    loadChildren: () => import('./jobs/jobs.routes').then((m) => m.JOB_ROUTES),
  },
  {
    path: 'customers',
    title: 'Customers · Latchwork',
    canActivate: [accessGuard],
    data: navData('Customers', 'contacts', {
      permission: 'customers:read',
      hint: 'Customers, their contacts and sites, and their jobs; import them from a spreadsheet.',
    }),
    loadChildren: () => import('./customers/customers.routes').then((m) => m.CUSTOMER_ROUTES),
  },
  {
    path: 'takeoff',
    title: 'Takeoff · Latchwork',
    canActivate: [accessGuard],
    data: navData('Takeoff', 'grid_on', {
      permission: 'takeoffs:read',
      hint: 'Measure a floor and see its tile layout, cuts, materials and hours.',
    }),
    loadComponent: () => import('./takeoff/takeoff-page').then((m) => m.TakeoffPage),
  },
  {
    path: 'stock',
    title: 'Stock · Latchwork',
    canActivate: [accessGuard],
    data: navData('Stock', 'inventory_2', {
      permission: 'stock:read',
      hint: 'Tiles, adhesives and trims: what is where, what is promised, counts and orders.',
    }),
    loadChildren: () => import('./stock/stock.routes').then((m) => m.STOCK_ROUTES),
  },
  {
    path: 'team',
    title: 'Team · Latchwork',
    canActivate: [accessGuard],
    data: navData('Team', 'group', {
      permission: 'members:read',
      hint: 'See who works in the firm, invite people and set what each role may do.',
    }),
    loadComponent: () => import('./pages/team-page/team-page').then((m) => m.TeamPage),
  },
  {
    path: 'settings',
    title: 'Firm settings · Latchwork',
    canActivate: [accessGuard],
    data: navData('Firm settings', 'tune', {
      permission: 'settings:write',
      hint: 'Name, address, currency, units, tax rate, payment terms and document numbers.',
    }),
    loadComponent: () => import('./pages/settings-page/settings-page').then((m) => m.SettingsPage),
  },
  {
    path: 'audit',
    title: 'Audit log · Latchwork',
    canActivate: [accessGuard],
    data: navData('Audit log', 'history', {
      permission: 'audit:read',
      hint: 'Who signed in, who was invited, and what changed in the firm’s settings.',
    }),
    loadComponent: () => import('./pages/audit-page/audit-page').then((m) => m.AuditPage),
  },
  {
    path: 'status',
    title: 'System status · Latchwork',
    data: navData('System status', 'monitor_heart', {
      hint: 'Whether the services Latchwork needs are up right now.',
    }),
    loadComponent: () => import('./pages/status-page/status-page').then((m) => m.StatusPage),
  },
  {
    // Shown in place of a page the person's role does not include (the address bar keeps theirs).
    path: 'not-in-your-role',
    title: 'Not in your role · Latchwork',
    loadComponent: () =>
      import('./pages/forbidden-page/forbidden-page').then((m) => m.ForbiddenPage),
  },
  {
    path: '**',
    title: 'Page not found · Latchwork',
    loadComponent: () =>
      import('./pages/not-found-page/not-found-page').then((m) => m.NotFoundPage),
  },
];
