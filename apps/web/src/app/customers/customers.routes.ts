import { Routes } from '@angular/router';

/** The pages under /customers, each lazy. Filled as the pages land. */
export const CUSTOMER_ROUTES: Routes = [];
