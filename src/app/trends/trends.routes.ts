import type { Routes } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';

// Chart.js is registered here, not in app.config, so it stays out of the initial bundle.
export const trendsRoutes: Routes = [
  {
    path: '',
    providers: [provideCharts(withDefaultRegisterables())],
    children: [
      { path: '', loadComponent: () => import('./trend-board/trend-board').then((m) => m.TrendBoard), title: 'Trends · Kerfcast' },
      { path: 'compare', loadComponent: () => import('./trend-compare/trend-compare').then((m) => m.TrendCompare), title: 'Compare · Kerfcast' },
      { path: ':seriesId', loadComponent: () => import('./trend-detail/trend-detail').then((m) => m.TrendDetail), title: 'Series · Kerfcast' },
    ],
  },
];
