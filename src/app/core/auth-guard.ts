import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { SessionStore } from './session-store';

export const authGuard: CanActivateFn = async (route, state) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  const me = await session.load();
  if (!me) return router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
  const studioId = Number(route.paramMap.get('studioId'));
  if (!me.studios.some((studio) => studio.id === studioId)) {
    return me.studios.length ? router.createUrlTree(['/studios', me.studios[0].id]) : router.createUrlTree(['/sign-up']);
  }
  return true;
};

export const firstStudioRedirect: CanActivateFn = async () => {
  const session = inject(SessionStore);
  const router = inject(Router);
  const me = await session.load();
  if (!me) return router.createUrlTree(['/sign-in']);
  return me.studios.length ? router.createUrlTree(['/studios', me.studios[0].id]) : router.createUrlTree(['/sign-up']);
};
