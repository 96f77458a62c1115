import { inject } from '@angular/core';
import { Router, Routes, UrlTree } from '@angular/router';
import { AuthSession } from './auth/auth-session';
import { signedInGuard } from './auth/signed-in-guard';
import { adminGuard, sectionGuard, workspaceGuard } from './workspace/role-guard';
import { CurrentWorkspace } from './workspace/current-workspace';

/**
 * "/" opens the remembered workspace's missions; a user in none still has their tokens page.
 * Redirects run before guards, so a signed-out visitor is sent to sign in from here, coming back
 * to "/" (and so to their missions) rather than to wherever the signed-out fallback pointed.
 */
function homeOf(): string | UrlTree {
  const router = inject(Router);
  if (!inject(AuthSession).signedIn()) return router.createUrlTree(['/sign-in']);
  const id = inject(CurrentWorkspace).id();
  return id === null ? '/tokens' : router.createUrlTree(['/w', id, 'missions']);
}

export const appRoutes: Routes = [
  { path: 'sign-in', title: 'Sign in · Eclipta', loadComponent: () => import('./auth/sign-in-page').then((m) => m.SignInPage) },
  {
    path: 'reset-password',
    title: 'Reset password · Eclipta',
    loadComponent: () => import('./auth/password-reset-request-page').then((m) => m.PasswordResetRequestPage),
  },
  {
    path: 'reset-password/:token',
    title: 'Choose a new password · Eclipta',
    loadComponent: () => import('./auth/password-reset-confirm-page').then((m) => m.PasswordResetConfirmPage),
  },
  {
    path: 'invite/:token',
    title: 'Invitation · Eclipta',
    loadComponent: () => import('./auth/invitation-page').then((m) => m.InvitationPage),
  },
  {
    path: '',
    canActivate: [signedInGuard],
    loadComponent: () => import('./shell/shell-layout').then((m) => m.ShellLayout),
    children: [
      { path: '', pathMatch: 'full', redirectTo: homeOf },
      {
        path: 'w/:workspaceId',
        canActivate: [workspaceGuard],
        children: [
          { path: '', pathMatch: 'full', redirectTo: 'missions' },
          {
            path: 'missions',
            title: 'Missions · Eclipta',
            canActivate: [sectionGuard('missions')],
            loadComponent: () => import('./missions/missions-page').then((m) => m.MissionsPage),
          },
          {
            path: 'missions/:missionId',
            title: 'Mission · Eclipta',
            canActivate: [sectionGuard('missions')],
            loadComponent: () => import('./missions/mission-page').then((m) => m.MissionPage),
          },
          {
            path: 'missions/:missionId/ephemerides',
            title: 'Ephemerides · Eclipta',
            canActivate: [sectionGuard('missions')],
            loadComponent: () => import('./ephemerides/mission-ephemerides-page').then((m) => m.MissionEphemeridesPage),
          },
          {
            path: 'overview',
            title: 'Overview · Eclipta',
            loadComponent: () => import('./workspace/workspace-overview-page').then((m) => m.WorkspaceOverviewPage),
          },
          {
            path: 'cases',
            title: 'Load cases · Eclipta',
            canActivate: [sectionGuard('cases')],
            loadComponent: () => import('./cases/case-library-page').then((m) => m.CaseLibraryPage),
          },
          {
            path: 'cases/:caseId',
            title: 'Load case · Eclipta',
            canActivate: [sectionGuard('cases')],
            loadComponent: () => import('./cases/case-page').then((m) => m.CasePage),
          },
          {
            path: 'cases/:caseId/compare/:otherId',
            title: 'Compare load cases · Eclipta',
            canActivate: [sectionGuard('cases')],
            loadComponent: () => import('./cases/case-comparison-page').then((m) => m.CaseComparisonPage),
          },
          {
            path: 'environment',
            title: 'Environment table · Eclipta',
            canActivate: [sectionGuard('environment')],
            loadComponent: () => import('./workspace/environment-table-page').then((m) => m.EnvironmentTablePage),
          },
          {
            path: 'bodies',
            title: 'Bodies · Eclipta',
            canActivate: [sectionGuard('bodies')],
            loadComponent: () => import('./workspace/bodies-page').then((m) => m.BodiesPage),
          },
          {
            path: 'thermal',
            title: 'Thermal models · Eclipta',
            canActivate: [sectionGuard('thermal')],
            loadComponent: () => import('./thermal/thermal-models-page').then((m) => m.ThermalModelsPage),
          },
          {
            path: 'thermal/:modelId',
            title: 'Thermal model · Eclipta',
            canActivate: [sectionGuard('thermal')],
            loadComponent: () => import('./thermal/thermal-model-page').then((m) => m.ThermalModelPage),
          },
          {
            path: 'members',
            title: 'Members · Eclipta',
            canActivate: [sectionGuard('members')],
            loadComponent: () => import('./workspace/members-page').then((m) => m.MembersPage),
          },
          {
            path: 'audit',
            title: 'Audit log · Eclipta',
            canActivate: [sectionGuard('audit')],
            loadComponent: () => import('./workspace/audit-page').then((m) => m.AuditPage),
          },
        ],
      },
      {
        path: 'tokens',
        title: 'API tokens · Eclipta',
        loadComponent: () => import('./auth/api-tokens-page').then((m) => m.ApiTokensPage),
      },
      {
        path: 'admin/mail',
        title: 'Mail outbox · Eclipta',
        canActivate: [adminGuard],
        loadComponent: () => import('./admin/mail-outbox-page').then((m) => m.MailOutboxPage),
      },
      {
        path: 'not-allowed',
        title: 'Not allowed · Eclipta',
        loadComponent: () => import('./shell/not-allowed-page').then((m) => m.NotAllowedPage),
      },
      { path: '**', title: 'Not found · Eclipta', loadComponent: () => import('./shell/not-found-page').then((m) => m.NotFoundPage) },
    ],
  },
];
