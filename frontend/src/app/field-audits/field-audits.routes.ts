import { Routes } from '@angular/router';

/** Below /sites/:id/audits: the site's audits, and one audit as the phone form and its results. */
export const fieldAuditsRoutes: Routes = [
  {
    path: '',
    title: 'Field audits · Rillmark',
    loadComponent: () => import('./field-audit-list/field-audit-list').then((m) => m.FieldAuditList),
  },
  {
    path: ':auditId',
    title: 'Field audit · Rillmark',
    loadComponent: () => import('./field-audit-page/field-audit-page').then((m) => m.FieldAuditPage),
  },
];
