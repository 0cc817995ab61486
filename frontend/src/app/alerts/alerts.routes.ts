import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

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
        path: ':id',
        title: 'Alert · Rillmark',
        loadComponent: () => import('./alert-detail/alert-detail').then((m) => m.AlertDetail),
      },
    ],
  },
];
