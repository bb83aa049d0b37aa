import type { Routes } from '@angular/router';

export const importsRoutes: Routes = [
  { path: '', loadComponent: () => import('./imports-page/imports-page').then((m) => m.ImportsPage), title: 'Imports · Kerfcast' },
  { path: ':importId', loadComponent: () => import('./import-detail/import-detail').then((m) => m.ImportDetailPage), title: 'Import · Kerfcast' },
];
