import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { apiPath } from '../api/api-path';
import { AuthSession } from './auth-session';

// These calls answer 401 as part of their normal job (am I signed in? wrong password); the page
// that made them shows the answer itself.
const OWN_401 = [apiPath('auth', 'me'), apiPath('auth', 'sign-in')];

/** A session that expires mid-work sends the user to sign in, and back to the page afterwards. */
export const unauthorizedInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(AuthSession);
  const router = inject(Router);
  return next(request).pipe(
    catchError((failure: unknown) => {
      if (failure instanceof HttpErrorResponse && failure.status === 401 && !OWN_401.some((url) => request.url.startsWith(url))) {
        session.forget();
        const returnUrl = router.url.startsWith('/sign-in') ? undefined : router.url;
        void router.navigate(['/sign-in'], { queryParams: { returnUrl } });
      }
      return throwError(() => failure);
    }),
  );
};
