import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

/**
 * A site's overview page (child of the site workspace at /sites/:id/overview); the monthly table is a plain child
 * route.
 */
export const readingsRoutes: Routes = [
  {
    path: '',
    title: 'Site overview · Rillmark',
    // ECharts loads with this route only, never with the first page.
    providers: [provideEchartsCore({ echarts: () => import('./echarts-parts').then((m) => m.loadEcharts()) })],
    loadComponent: () => import('./site-overview/site-overview').then((m) => m.SiteOverview),
  },
];
