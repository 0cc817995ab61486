import { Routes } from '@angular/router';
import { capabilityGuard } from '../core/auth/auth-guards';

/** /settings: one frame with a tab per section; each section is its own lazy page. */
export const settingsRoutes: Routes = [
  {
    path: '',
    loadComponent: () => import('./settings-page/settings-page').then((m) => m.SettingsPage),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'units' },
      {
        path: 'units',
        title: 'Units · Settings · Rillmark',
        loadComponent: () => import('./unit-settings/unit-settings').then((m) => m.UnitSettings),
      },
      // The same component as /alerts/notifications, which keeps working.
      {
        path: 'notifications',
        title: 'Notifications · Settings · Rillmark',
        loadComponent: () =>
          import('../alerts/notification-settings/notification-settings').then((m) => m.NotificationSettings),
      },
      {
        path: 'api-keys',
        title: 'API keys · Settings · Rillmark',
        canActivate: [capabilityGuard('manageSettings')],
        loadComponent: () => import('./api-key-list/api-key-list').then((m) => m.ApiKeyList),
      },
      {
        path: 'users',
        title: 'Users · Settings · Rillmark',
        canActivate: [capabilityGuard('manageUsers')],
        loadComponent: () => import('../admin/user-list/user-list').then((m) => m.UserList),
      },
    ],
  },
];
