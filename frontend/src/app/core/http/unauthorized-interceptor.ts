import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { AuthStore } from '../auth/auth-store';

/** Calls whose 401 is an answer for the caller, not an expired session. */
const OWN_401 = ['/api/auth/me', '/api/auth/sign-in', '/api/auth/accept-invite', '/api/auth/reset-password'];

/** When the session has expired mid-work, send the user to sign in and bring them back afterwards. */
export const unauthorizedInterceptor: HttpInterceptorFn = (req, next) => {
  const router = inject(Router);
  const auth = inject(AuthStore);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse && err.status === 401 && !OWN_401.some((url) => req.url.startsWith(url))) {
        auth.forget();
        const here = router.url;
        if (!here.startsWith('/sign-in')) {
          void router.navigate(['/sign-in'], { queryParams: { returnUrl: here } });
        }
      }
      return throwError(() => err);
    }),
  );
};
