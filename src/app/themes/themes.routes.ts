import type { Routes } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';

// Chart.js is registered here, not in app.config, so it stays out of the initial bundle.
export const themesRoutes: Routes = [
  {
    path: '',
    providers: [provideCharts(withDefaultRegisterables())],
    children: [
      { path: '', loadComponent: () => import('./theme-list/theme-list').then((m) => m.ThemeList), title: 'Themes · Kerfcast' },
      { path: ':themeId', loadComponent: () => import('./theme-page/theme-page').then((m) => m.ThemePage), title: 'Theme · Kerfcast' },
    ],
  },
];
