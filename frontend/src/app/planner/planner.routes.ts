import { Routes } from '@angular/router';

/** Below /sites/:id/planner: the site's what-if plans and one plan with its comparison. */
export const plannerRoutes: Routes = [
  {
    path: '',
    title: 'What-if planner · Rillmark',
    loadComponent: () => import('./plan-list/plan-list').then((m) => m.PlanList),
  },
  {
    path: ':planId',
    title: 'What-if plan · Rillmark',
    loadComponent: () => import('./plan-page/plan-page').then((m) => m.PlanPage),
  },
];
