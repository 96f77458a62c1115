import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { AuthSession } from './auth-session';

/** Lets signed-in users through; sends others to sign in and back here afterwards. */
export const signedInGuard: CanActivateFn = (_route, state) => {
  if (inject(AuthSession).signedIn()) return true;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};

/** Only accepts a same-site path as a place to return to, so a crafted link cannot send users elsewhere. */
export function safeReturnUrl(candidate: string | null | undefined): string {
  return candidate && candidate.startsWith('/') && !candidate.startsWith('//') ? candidate : '/';
}
