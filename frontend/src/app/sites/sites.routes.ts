import { Routes } from '@angular/router';
import { capabilityGuard } from '../core/auth/auth-guards';

export const sitesRoutes: Routes = [
  {
    path: '',
    title: 'Sites · Rillmark',
    loadComponent: () => import('./site-list/site-list').then((m) => m.SiteList),
  },
  {
    path: 'new',
    title: 'New site · Rillmark',
    canActivate: [capabilityGuard('createSites')],
    loadComponent: () => import('./site-form/site-form').then((m) => m.SiteForm),
  },
  {
    // One workspace per site: its header and tabs stay while the pages below change.
    path: ':id',
    loadComponent: () => import('./site-workspace/site-workspace').then((m) => m.SiteWorkspace),
    children: [
      {
        path: '',
        title: 'Site details · Rillmark',
        loadComponent: () => import('./site-form/site-form').then((m) => m.SiteForm),
      },
      {
        path: 'overview',
        loadChildren: () => import('../readings/readings.routes').then((m) => m.readingsRoutes),
      },
      {
        path: 'monthly',
        title: 'Monthly table · Rillmark',
        loadComponent: () => import('../readings/site-monthly/site-monthly').then((m) => m.SiteMonthly),
      },
      {
        path: 'hydrozones',
        title: 'Hydrozones · Rillmark',
        loadComponent: () => import('../hydrozones/hydrozone-list/hydrozone-list').then((m) => m.HydrozoneList),
      },
      {
        path: 'equipment',
        title: 'Meters & zones · Rillmark',
        loadComponent: () => import('../meters/equipment-page/equipment-page').then((m) => m.EquipmentPage),
      },
      {
        path: 'alerts',
        title: 'Site alerts · Rillmark',
        loadComponent: () => import('../alerts/site-alerts/site-alerts').then((m) => m.SiteAlerts),
      },
      {
        path: 'uploads',
        title: 'Site uploads · Rillmark',
        loadComponent: () => import('../uploads/site-uploads/site-uploads').then((m) => m.SiteUploads),
      },
      {
        path: 'budget',
        title: 'Water budget · Rillmark',
        loadComponent: () => import('../budgets/site-budget/site-budget').then((m) => m.SiteBudget),
      },
      {
        path: 'audits',
        loadChildren: () => import('../field-audits/field-audits.routes').then((m) => m.fieldAuditsRoutes),
      },
      { path: 'planner', loadChildren: () => import('../planner/planner.routes').then((m) => m.plannerRoutes) },
      {
        path: 'rates',
        title: 'Water rates · Rillmark',
        loadComponent: () => import('../rates/rate-schedule-list/rate-schedule-list').then((m) => m.RateScheduleList),
      },
    ],
  },
];
