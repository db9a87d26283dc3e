import { Routes } from '@angular/router';
import { SURVEY_ROUTES } from '../survey/survey.routes';

/** The pages under /jobs, each lazy. The parent route already asks for `jobs:read`. */
export const JOB_ROUTES: Routes = [
  {
    path: '',
    loadComponent: () => import('./job-board-page').then((m) => m.JobBoardPage),
  },
  {
    path: 'table',
    title: 'Jobs table · Latchwork',
    loadComponent: () => import('./job-table-page').then((m) => m.JobTablePage),
  },
  // /jobs/:jobId/areas/:areaId: the floor editor on one survey area.
  ...SURVEY_ROUTES,
  {
    path: ':jobId',
    title: 'Job · Latchwork',
    loadComponent: () => import('./job-page').then((m) => m.JobPage),
  },
];
