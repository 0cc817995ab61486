import { Routes } from '@angular/router';

/** /etaf: achieved ETAF across the sites the user sees, and one site's standing among comparable sites. */
export const etafRoutes: Routes = [
  {
    path: '',
    title: 'Achieved ETAF · Rillmark',
    loadComponent: () => import('./etaf-page/etaf-page').then((m) => m.EtafPage),
  },
  {
    path: 'sites/:siteId',
    title: 'Site ETAF · Rillmark',
    loadComponent: () => import('./etaf-site-page/etaf-site-page').then((m) => m.EtafSitePage),
  },
];
