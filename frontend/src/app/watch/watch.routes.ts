import { Routes } from '@angular/router';
import { capabilityGuard } from '../core/auth/auth-guards';

/** Mounted under /alerts (the menu's Alerts section): the watch's runs and a site's watch settings. */
export const watchRoutes: Routes = [
  {
    path: 'runs',
    title: 'Watch runs · Rillmark',
    canActivate: [capabilityGuard('manageSettings')],
    loadComponent: () => import('./watch-runs/watch-runs').then((m) => m.WatchRuns),
  },
  {
    path: 'sites/:siteId/settings',
    title: 'Watch settings · Rillmark',
    loadComponent: () => import('./watch-settings/watch-settings').then((m) => m.WatchSettings),
  },
];
