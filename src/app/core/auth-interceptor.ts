import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { SessionStore } from './session-store';

/** A 401 from any call but the session probe sends the user to sign-in; the error is always rethrown. */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  const router = inject(Router);
  const session = inject(SessionStore);
  return next(request).pipe(
    catchError((error: unknown) => {
      const isProbe = request.url.startsWith('/api/auth/');
      if (error instanceof HttpErrorResponse && error.status === 401 && !isProbe) {
        session.forget();
        void router.navigate(['/sign-in'], { queryParams: { next: router.url } });
      }
      return throwError(() => error);
    }),
  );
};
