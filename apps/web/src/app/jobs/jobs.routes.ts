import { Routes } from '@angular/router';

/** The pages under /jobs, each lazy. Filled as the pages land. */
export const JOB_ROUTES: Routes = [];
