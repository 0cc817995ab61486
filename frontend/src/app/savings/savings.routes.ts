import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

/** Mounted under /reports (the menu's Reports section): a site's savings projects and one project's report. */
export const savingsRoutes: Routes = [
  {
    path: '',
    // The same ECharts parts as the weather chart (bars and lines), loaded only with these routes.
    providers: [
      provideEchartsCore({
        echarts: () => import('../weather/weather-chart/echarts-parts').then((m) => m.loadEcharts()),
      }),
    ],
    children: [
      {
        path: 'sites/:siteId/savings',
        title: 'Savings projects · Rillmark',
        loadComponent: () => import('./savings-projects/savings-projects').then((m) => m.SavingsProjects),
      },
      {
        path: 'savings/:id',
        title: 'Savings report · Rillmark',
        loadComponent: () => import('./savings-report/savings-report').then((m) => m.SavingsReport),
      },
    ],
  },
];
