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
];
