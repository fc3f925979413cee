import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { Session } from './session';

/**
 * When the server says we are not signed in although we thought we were (the session expired or was ended
 * elsewhere), forget the user and go to the sign-in page, which explains why. Calls to /api/session itself
 * are left to the Session service.
 */
export const sessionExpiryInterceptor: HttpInterceptorFn = (req, next) => {
  const session = inject(Session);
  const router = inject(Router);
  return next(req).pipe(
    catchError((err: unknown) => {
      const unauthenticated = err instanceof HttpErrorResponse && err.status === 401;
      if (unauthenticated && session.signedIn() && !req.url.startsWith('/api/session')) {
        session.forget();
        void router.navigate(['/sign-in'], { queryParams: { reason: 'expired' } });
      }
      return throwError(() => err);
    }),
  );
};
