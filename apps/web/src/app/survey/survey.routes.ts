import { Routes } from '@angular/router';

/**
 * The survey's own page, for the jobs routes to mount: `...SURVEY_ROUTES` inside JOB_ROUTES
 * gives /jobs/:jobId/areas/:areaId, the floor editor on one survey area.
 */
export const SURVEY_ROUTES: Routes = [
  {
    path: ':jobId/areas/:areaId',
    title: 'Survey area · Latchwork',
    loadComponent: () => import('./area-editor-page').then((m) => m.AreaEditorPage),
  },
];
