import { HttpClient, HttpErrorResponse, type HttpInterceptorFn, HttpXsrfTokenExtractor } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, switchMap, throwError } from 'rxjs';

/** Names the server uses for the token cookie and the header that echoes it. */
export const csrfCookieName = 'XSRF-TOKEN';
export const csrfHeaderName = 'X-XSRF-TOKEN';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Angular's built-in XSRF support copies the cookie into the header. The token lives in the server session, so
 * it goes stale when the session is replaced (sign-in elsewhere, server restart). When a write is refused for
 * that reason, fetch a fresh token with GET /api/session and send the write once more.
 */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (safeMethods.has(req.method)) return next(req);
  const http = inject(HttpClient);
  const tokens = inject(HttpXsrfTokenExtractor);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (!isCsrfRefusal(err)) return throwError(() => err);
      return http.get('/api/session').pipe(
        switchMap(() => next(req.clone({ setHeaders: { [csrfHeaderName]: tokens.getToken() ?? '' } }))),
      );
    }),
  );
};

function isCsrfRefusal(err: unknown): boolean {
  if (!(err instanceof HttpErrorResponse) || err.status !== 403) return false;
  const body: unknown = err.error;
  return typeof body === 'object' && body !== null && (body as { error?: { code?: unknown } }).error?.code === 'csrf';
}
