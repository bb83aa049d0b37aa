import { Routes } from '@angular/router';
import { authGuard, firstStudioRedirect } from './core/auth-guard';

export const routes: Routes = [
  { path: 'sign-in', loadComponent: () => import('./auth/sign-in/sign-in').then((m) => m.SignIn), title: 'Sign in · Kerfcast' },
  { path: 'sign-up', loadComponent: () => import('./auth/sign-up/sign-up').then((m) => m.SignUp), title: 'Sign up · Kerfcast' },
  {
    path: 'studios/:studioId',
    canActivate: [authGuard],
    loadComponent: () => import('./core/shell/shell').then((m) => m.Shell),
    children: [
      { path: '', loadComponent: () => import('./home/home').then((m) => m.Home), title: 'Studio · Kerfcast' },
      { path: 'calendar', loadComponent: () => import('./calendar/calendar-page/calendar-page').then((m) => m.CalendarPage), title: 'Calendar · Kerfcast' },
      { path: 'trends', loadChildren: () => import('./trends/trends.routes').then((m) => m.trendsRoutes) },
      { path: 'themes', loadChildren: () => import('./themes/themes.routes').then((m) => m.themesRoutes) },
      { path: 'imports', loadChildren: () => import('./imports/imports.routes').then((m) => m.importsRoutes) },
      { path: 'settings', loadComponent: () => import('./settings/studio-settings').then((m) => m.StudioSettingsPage), title: 'Settings · Kerfcast' },
    ],
  },
  { path: '', pathMatch: 'full', canActivate: [firstStudioRedirect], children: [] },
  { path: '**', redirectTo: '' },
];
