import { Routes } from '@angular/router';
import { accessGuard } from '../session/access.guard';
import { accessData } from '../shell/nav-items';

/** Pages that change customers: the owner and estimators (`customers:write`). */
const writers = { canActivate: [accessGuard], data: accessData('customers:write') };

/** The pages under /customers, each lazy. The parent route already asks for `customers:read`. */
export const CUSTOMER_ROUTES: Routes = [
  {
    path: '',
    loadComponent: () => import('./customer-list-page').then((m) => m.CustomerListPage),
  },
  {
    path: 'new',
    title: 'New customer · Latchwork',
    ...writers,
    loadComponent: () => import('./customer-form-page').then((m) => m.CustomerFormPage),
  },
  {
    path: 'import',
    title: 'Import customers · Latchwork',
    ...writers,
    loadComponent: () => import('./import/customer-import-page').then((m) => m.CustomerImportPage),
  },
  {
    path: ':customerId',
    loadComponent: () => import('./customer-page').then((m) => m.CustomerPage),
  },
  {
    path: ':customerId/edit',
    title: 'Edit customer · Latchwork',
    ...writers,
    loadComponent: () => import('./customer-form-page').then((m) => m.CustomerFormPage),
  },
];
