import { Routes } from '@angular/router';

/** The Watering rules section: the worklist of sites watering outside the rules, and the rules themselves. */
export const wateringRulesRoutes: Routes = [
  {
    path: '',
    title: 'Watering rules · Rillmark',
    loadComponent: () => import('./rule-worklist/rule-worklist').then((m) => m.RuleWorklist),
  },
  {
    path: 'rules',
    title: 'Watering rules by stage · Rillmark',
    loadComponent: () => import('./rules-page/rules-page').then((m) => m.RulesPage),
  },
];
