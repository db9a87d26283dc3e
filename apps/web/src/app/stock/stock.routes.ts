import { Routes } from '@angular/router';
import { accessGuard } from '../session/access.guard';
import { accessData } from '../shell/nav-items';

/** Pages that change stock or the catalogue: the owner and stores (`stock:write`). */
const writers = { canActivate: [accessGuard], data: accessData('stock:write') };

/** The pages under /stock, each lazy. The parent route already asks for `stock:read`. */
export const STOCK_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./stock-home-page').then((m) => m.StockHomePage) },
  {
    path: 'products',
    title: 'Catalogue · Latchwork',
    loadComponent: () => import('./product-list-page').then((m) => m.ProductListPage),
  },
  {
    path: 'products/new',
    title: 'New product · Latchwork',
    ...writers,
    loadComponent: () => import('./product-form-page').then((m) => m.ProductFormPage),
  },
  {
    path: 'products/import',
    title: 'Import catalogue · Latchwork',
    ...writers,
    loadComponent: () => import('./catalogue-import-page').then((m) => m.CatalogueImportPage),
  },
  {
    path: 'products/:productId',
    title: 'Product ledger · Latchwork',
    loadComponent: () => import('./product-page').then((m) => m.ProductPage),
  },
  {
    path: 'products/:productId/edit',
    title: 'Edit product · Latchwork',
    ...writers,
    loadComponent: () => import('./product-form-page').then((m) => m.ProductFormPage),
  },
  {
    path: 'book',
    title: 'Book a movement · Latchwork',
    ...writers,
    loadComponent: () => import('./movement-form-page').then((m) => m.MovementFormPage),
  },
  {
    path: 'places',
    title: 'Locations and batches · Latchwork',
    loadComponent: () => import('./places-page').then((m) => m.PlacesPage),
  },
  {
    path: 'suppliers',
    title: 'Suppliers · Latchwork',
    loadComponent: () => import('./suppliers-page').then((m) => m.SuppliersPage),
  },
  {
    path: 'reports',
    title: 'Stock value and expiry · Latchwork',
    loadComponent: () => import('./stock-reports-page').then((m) => m.StockReportsPage),
  },
  {
    path: 'jobs/:jobId',
    title: 'Job materials · Latchwork',
    loadComponent: () => import('./job-stock-page').then((m) => m.JobStockPage),
  },
  {
    path: 'counts',
    title: 'Stock counts · Latchwork',
    loadComponent: () => import('./counts/count-list-page').then((m) => m.CountListPage),
  },
  {
    path: 'counts/:countId/sheet',
    title: 'Count sheet · Latchwork',
    ...writers,
    loadComponent: () => import('./counts/count-sheet-page').then((m) => m.CountSheetPage),
  },
  {
    path: 'counts/:countId',
    title: 'Count review · Latchwork',
    loadComponent: () => import('./counts/count-review-page').then((m) => m.CountReviewPage),
  },
  {
    path: 'reorder',
    title: 'Reorder · Latchwork',
    loadComponent: () => import('./purchasing/reorder-page').then((m) => m.ReorderPage),
  },
  {
    path: 'purchase-orders',
    title: 'Purchase orders · Latchwork',
    loadComponent: () => import('./purchasing/po-list-page').then((m) => m.PoListPage),
  },
  {
    path: 'purchase-orders/:purchaseOrderId',
    title: 'Purchase order · Latchwork',
    loadComponent: () => import('./purchasing/po-page').then((m) => m.PoPage),
  },
];
