import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';
import { capabilityGuard } from '../core/auth/auth-guards';

/** The Alerts section: the inbox, alert e-mail, and the watch's pages (runs, a site's settings) from watch/. */
export const alertsRoutes: Routes = [
  {
    path: '',
    // ECharts (only the parts the evidence chart registers) loads with these routes, never with the first page.
    providers: [
      provideEchartsCore({ echarts: () => import('./evidence-chart/echarts-parts').then((m) => m.loadEcharts()) }),
    ],
    children: [
      {
        path: '',
        title: 'Alerts · Rillmark',
        loadComponent: () => import('./alert-inbox/alert-inbox').then((m) => m.AlertInbox),
      },
      {
        path: 'notifications',
        title: 'Alert e-mail · Rillmark',
        loadComponent: () =>
          import('./notification-settings/notification-settings').then((m) => m.NotificationSettings),
      },
      {
        path: 'runs',
        title: 'Watch runs · Rillmark',
        canActivate: [capabilityGuard('manageSettings')],
        loadComponent: () => import('../watch/watch-runs/watch-runs').then((m) => m.WatchRuns),
      },
      {
        path: 'sites/:siteId/settings',
        title: 'Watch settings · Rillmark',
        loadComponent: () => import('../watch/watch-settings/watch-settings').then((m) => m.WatchSettings),
      },
      {
        path: 'repairs',
        title: 'Repairs verified · Rillmark',
        loadComponent: () => import('./repair-times/repair-times').then((m) => m.RepairTimes),
      },
      {
        path: ':id',
        title: 'Alert · Rillmark',
        loadComponent: () => import('./alert-detail/alert-detail').then((m) => m.AlertDetail),
      },
    ],
  },
];
