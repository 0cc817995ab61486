import { Routes } from '@angular/router';

export const reportsRoutes: Routes = [
  {
    path: '',
    title: 'Reports · Rillmark',
    loadComponent: () => import('./compliance-page/compliance-page').then((m) => m.CompliancePage),
  },
];
