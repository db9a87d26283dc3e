import { Routes } from '@angular/router';

/** The pages under /stock, each lazy. Filled as the pages land. */
export const STOCK_ROUTES: Routes = [];
