import { Routes } from '@angular/router';

/** The manager's month close (its page holds the review marks and the board packets). */
export const monthCloseRoutes: Routes = [
  {
    path: '',
    title: 'Month close · Rillmark',
    loadComponent: () => import('./month-close-page/month-close-page').then((m) => m.MonthClosePage),
  },
];
