import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

export const siteOverviewRoutes: Routes = [
  {
    path: '',
    title: 'Site overview · Rillmark',
    // ECharts loads with this route only, never with the first page.
    providers: [provideEchartsCore({ echarts: () => import('./echarts-parts').then((m) => m.loadEcharts()) })],
    loadComponent: () => import('./site-overview').then((m) => m.SiteOverview),
  },
];
