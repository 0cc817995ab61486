import { Routes } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

export const weatherRoutes: Routes = [
  {
    path: '',
    // ECharts (only the parts the chart registers) loads with these routes, never with the first page.
    providers: [
      provideEchartsCore({ echarts: () => import('./weather-chart/echarts-parts').then((m) => m.loadEcharts()) }),
    ],
    children: [
      {
        path: '',
        title: 'Weather stations · Rillmark',
        loadComponent: () => import('./station-list/station-list').then((m) => m.StationList),
      },
      {
        path: ':id',
        title: 'Weather station · Rillmark',
        loadComponent: () => import('./weather-station/weather-station').then((m) => m.WeatherStation),
      },
    ],
  },
];
