import { inject } from '@angular/core';
import { ActivatedRouteSnapshot, CanActivateFn, RedirectCommand, Router } from '@angular/router';
import { AuthSession } from '../auth/auth-session';
import { roleMayOpen, type SectionId } from '../shell/navigation';
import { CurrentWorkspace } from './current-workspace';

function workspaceIdOf(route: ActivatedRouteSnapshot): string | null {
  for (const step of [...route.pathFromRoot].reverse()) {
    const id = step.paramMap.get('workspaceId');
    if (id !== null) return id;
  }
  return null;
}

// The URL stays as typed and the page says why it is closed, rather than bouncing elsewhere.
function showInstead(page: 'not-allowed' | 'not-found'): RedirectCommand {
  return new RedirectCommand(inject(Router).parseUrl(`/${page}`), { skipLocationChange: true });
}

/**
 * Makes the workspace named in the URL the current one. A workspace the user does not belong to
 * shows "not found", as the server answers 404 rather than admitting it exists.
 */
export const workspaceGuard: CanActivateFn = (route) => {
  const id = workspaceIdOf(route);
  const member = inject(AuthSession).workspaces().some((w) => w.workspaceId === id);
  if (id === null || !member) return showInstead('not-found');
  inject(CurrentWorkspace).select(id);
  return true;
};

/** Opens a workspace section only for the roles the navigation table gives it. */
export function sectionGuard(section: SectionId): CanActivateFn {
  return (route) => {
    const id = workspaceIdOf(route);
    const membership = inject(AuthSession).workspaces().find((w) => w.workspaceId === id);
    return membership && roleMayOpen(membership.role, section) ? true : showInstead('not-allowed');
  };
}

/** The instance administrator's pages; the flag is separate from workspace roles. */
export const adminGuard: CanActivateFn = () => (inject(AuthSession).user()?.isAdmin ? true : showInstead('not-allowed'));
