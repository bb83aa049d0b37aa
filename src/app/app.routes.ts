import { Routes } from '@angular/router';
import { authGuard, firstStudioRedirect } from './core/auth-guard';

export const routes: Routes = [
  { path: 'sign-in', loadComponent: () => import('./auth/sign-in/sign-in').then((m) => m.SignIn), title: 'Sign in · Kerfcast' },
  { path: 'sign-up', loadComponent: () => import('./auth/sign-up/sign-up').then((m) => m.SignUp), title: 'Sign up · Kerfcast' },
  { path: 'invitations/:token', loadComponent: () => import('./account/accept-invitation').then((m) => m.AcceptInvitation), title: 'Invitation · Kerfcast' },
  { path: 'forgot-password', loadComponent: () => import('./account/forgot-password').then((m) => m.ForgotPassword), title: 'Forgot password · Kerfcast' },
  { path: 'reset-password/:token', loadComponent: () => import('./account/reset-password').then((m) => m.ResetPassword), title: 'New password · Kerfcast' },
  {
    path: 'studios/:studioId',
    canActivate: [authGuard],
    loadComponent: () => import('./core/shell/shell').then((m) => m.Shell),
    children: [
      { path: '', loadComponent: () => import('./home/home').then((m) => m.Home), title: 'Studio · Kerfcast' },
      {
        path: 'calendar',
        loadComponent: () => import('./calendar/calendar-page/calendar-page').then((m) => m.CalendarPage),
        title: 'Calendar · Kerfcast',
        // Its code is loaded ahead, once the app is idle (PreloadMarkedRoutes).
        data: { preload: true },
      },
      { path: 'templates', loadComponent: () => import('./templates/templates-page').then((m) => m.TemplatesPage), title: 'Runway templates · Kerfcast' },
      { path: 'markets', loadComponent: () => import('./markets/markets-page').then((m) => m.MarketsPage), title: 'Markets and days off · Kerfcast' },
      { path: 'trends', loadChildren: () => import('./trends/trends.routes').then((m) => m.trendsRoutes) },
      { path: 'themes', loadChildren: () => import('./themes/themes.routes').then((m) => m.themesRoutes) },
      { path: 'imports', loadChildren: () => import('./imports/imports.routes').then((m) => m.importsRoutes) },
      { path: 'settings', loadComponent: () => import('./settings/studio-settings').then((m) => m.StudioSettingsPage), title: 'Settings · Kerfcast' },
      { path: 'team', loadComponent: () => import('./team/team-page').then((m) => m.TeamPage), title: 'Team · Kerfcast' },
      { path: 'feeds', loadComponent: () => import('./feeds/feeds-page').then((m) => m.FeedsPage), title: 'Feeds · Kerfcast' },
      { path: 'mailbox', loadComponent: () => import('./mailbox/mailbox-page').then((m) => m.MailboxPage), title: 'Mailbox · Kerfcast' },
      { path: 'profile', loadComponent: () => import('./account/profile-page').then((m) => m.ProfilePage), title: 'Profile · Kerfcast' },
    ],
  },
  { path: '', pathMatch: 'full', canActivate: [firstStudioRedirect], children: [] },
  { path: '**', redirectTo: '' },
];
