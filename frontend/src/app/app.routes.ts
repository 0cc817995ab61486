import { Routes } from '@angular/router';
import { capabilityGuard, signedInGuard, signedOutGuard } from './core/auth/auth-guards';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Rillmark',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'accept-invite',
    title: 'Accept invitation · Rillmark',
    data: { purpose: 'invite' },
    loadComponent: () => import('./auth/set-password/set-password').then((m) => m.SetPassword),
  },
  {
    path: 'reset-password',
    title: 'Choose a new password · Rillmark',
    data: { purpose: 'reset' },
    loadComponent: () => import('./auth/set-password/set-password').then((m) => m.SetPassword),
  },
  {
    path: '',
    canActivate: [signedInGuard],
    loadComponent: () => import('./core/shell/shell').then((m) => m.Shell),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'portfolio' },
      {
        path: 'portfolio',
        title: 'Portfolio · Rillmark',
        loadComponent: () => import('./portfolio/portfolio-page/portfolio-page').then((m) => m.PortfolioPage),
      },
      { path: 'sites', loadChildren: () => import('./sites/sites.routes').then((m) => m.sitesRoutes) },
      { path: 'uploads', loadChildren: () => import('./uploads/uploads.routes').then((m) => m.uploadsRoutes) },
      { path: 'alerts', loadChildren: () => import('./alerts/alerts.routes').then((m) => m.alertsRoutes) },
      { path: 'weather-stations', loadChildren: () => import('./weather/weather.routes').then((m) => m.weatherRoutes) },
      {
        path: 'month-close',
        loadChildren: () => import('./month-close/month-close.routes').then((m) => m.monthCloseRoutes),
      },
      { path: 'reports', loadChildren: () => import('./reports/reports.routes').then((m) => m.reportsRoutes) },
      { path: 'etaf', loadChildren: () => import('./etaf/etaf.routes').then((m) => m.etafRoutes) },
      {
        path: 'watering-rules',
        loadChildren: () => import('./watering-rules/watering-rules.routes').then((m) => m.wateringRulesRoutes),
      },
      { path: 'settings', loadChildren: () => import('./settings/settings.routes').then((m) => m.settingsRoutes) },
      {
        path: 'admin/users',
        title: 'Users · Rillmark',
        canActivate: [capabilityGuard('manageUsers')],
        loadComponent: () => import('./admin/user-list/user-list').then((m) => m.UserList),
      },
      {
        path: 'admin/outbox',
        title: 'Outbox · Rillmark',
        canActivate: [capabilityGuard('viewOutbox')],
        loadComponent: () => import('./admin/outbox/outbox').then((m) => m.Outbox),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
