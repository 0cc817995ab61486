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
    path: ':id',
    title: 'Site · Rillmark',
    loadComponent: () => import('./site-form/site-form').then((m) => m.SiteForm),
  },
  {
    path: ':id/hydrozones',
    title: 'Hydrozones · Rillmark',
    loadComponent: () => import('../hydrozones/hydrozone-list/hydrozone-list').then((m) => m.HydrozoneList),
  },
  {
    path: ':id/budget',
    title: 'Water budget · Rillmark',
    loadComponent: () => import('../budgets/site-budget/site-budget').then((m) => m.SiteBudget),
  },
  {
    path: ':id/rates',
    title: 'Water rates · Rillmark',
    loadComponent: () => import('../rates/rate-schedule-list/rate-schedule-list').then((m) => m.RateScheduleList),
  },
];
