import { Routes } from '@angular/router';

export const uploadsRoutes: Routes = [
  {
    path: '',
    title: 'Data uploads · Rillmark',
    loadComponent: () => import('./upload-page/upload-page').then((m) => m.UploadPage),
  },
];
