import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

/** The Reports section: the compliance ranking, and the savings pages from savings/. */
export const reportsRoutes: Routes = [
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
        path: '',
        title: 'Reports · Rillmark',
        loadComponent: () => import('./compliance-page/compliance-page').then((m) => m.CompliancePage),
      },
      {
        path: 'savings',
        title: 'Savings book · Rillmark',
        loadComponent: () => import('../savings/savings-book/savings-book').then((m) => m.SavingsBook),
      },
      {
        path: 'sites/:siteId/savings',
        title: 'Savings projects · Rillmark',
        loadComponent: () => import('../savings/savings-projects/savings-projects').then((m) => m.SavingsProjects),
      },
      {
        path: 'savings/:id',
        title: 'Savings report · Rillmark',
        loadComponent: () => import('../savings/savings-report/savings-report').then((m) => m.SavingsReport),
      },
    ],
  },
];
