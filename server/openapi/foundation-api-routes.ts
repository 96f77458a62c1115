// The foundation's routes: health, sign-in and the session, password reset, personal API tokens,
// workspaces, members, invitations, the audit log, the admin mail view, bodies and the compute route.
import { z } from 'zod';
import {
  invitationAccept, invitationPreview, meResponse, passwordResetConfirm, passwordResetRequest, signIn, tokenCreate, tokenCreated, apiToken,
} from '../../shared/api/auth';
import { bodiesResponse, environmentRequest, environmentResponse } from '../../shared/api/environment';
import { auditEvent, auditQuery, invitation, invitationCreate, mailMessage, mailSummary, member, memberUpdate, workspace } from '../../shared/api/workspaces';
import type { ApiRoute } from './api-route';

const v1 = '/api/v1';
const items = <T extends z.ZodType>(schema: T) => z.object({ items: z.array(schema) });
const message = z.object({ message: z.string() });

export const foundationApiRoutes: ApiRoute[] = [
  { method: 'get', path: '/api/health', tag: 'service', summary: 'Health: {"status":"ok"} once migrations are applied', public: true, response: z.object({ status: z.literal('ok') }) },
  { method: 'post', path: `${v1}/auth/sign-in`, tag: 'auth', summary: 'Sign in; sets the session cookie', public: true, body: signIn, response: meResponse },
  { method: 'post', path: `${v1}/auth/sign-out`, tag: 'auth', summary: 'Sign out', status: 204 },
  { method: 'get', path: `${v1}/auth/me`, tag: 'auth', summary: 'The caller, their workspaces and how they authenticated', response: meResponse },
  { method: 'post', path: `${v1}/auth/password-reset`, tag: 'auth', summary: 'Mail a password-reset link (same answer for unknown addresses)', public: true, body: passwordResetRequest, status: 202, response: message },
  { method: 'post', path: `${v1}/auth/password-reset/confirm`, tag: 'auth', summary: 'Set a new password with the link’s token', public: true, body: passwordResetConfirm, response: message },
  { method: 'get', path: `${v1}/invitations/:token`, tag: 'auth', summary: 'Preview an invitation', public: true, response: invitationPreview },
  { method: 'post', path: `${v1}/invitations/:token/accept`, tag: 'auth', summary: 'Accept an invitation; sets the session cookie', public: true, body: invitationAccept, response: meResponse },
  { method: 'get', path: `${v1}/tokens`, tag: 'tokens', summary: 'The caller’s personal API tokens', response: items(apiToken) },
  { method: 'post', path: `${v1}/tokens`, tag: 'tokens', summary: 'Create a personal API token (the secret is shown once)', body: tokenCreate, status: 201, response: tokenCreated },
  { method: 'delete', path: `${v1}/tokens/:id`, tag: 'tokens', summary: 'Revoke a token', status: 204 },
  { method: 'get', path: `${v1}/workspaces`, tag: 'workspaces', summary: 'The caller’s workspaces', response: items(workspace) },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/members`, tag: 'workspaces', summary: 'Members of a workspace', response: items(member) },
  { method: 'patch', path: `${v1}/workspaces/:workspaceId/members/:userId`, tag: 'workspaces', summary: 'Change a member’s role (owner)', body: memberUpdate, response: member },
  { method: 'delete', path: `${v1}/workspaces/:workspaceId/members/:userId`, tag: 'workspaces', summary: 'Remove a member (owner)', status: 204 },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/invitations`, tag: 'workspaces', summary: 'Open invitations (owner)', response: items(invitation) },
  { method: 'post', path: `${v1}/workspaces/:workspaceId/invitations`, tag: 'workspaces', summary: 'Invite by e-mail (owner)', body: invitationCreate, status: 201, response: invitation },
  { method: 'delete', path: `${v1}/workspaces/:workspaceId/invitations/:id`, tag: 'workspaces', summary: 'Withdraw an invitation (owner)', status: 204 },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/audit`, tag: 'workspaces', summary: 'The audit log, filtered (owner)', query: auditQuery, response: z.object({ items: z.array(auditEvent), total: z.number() }) },
  { method: 'get', path: `${v1}/admin/mail`, tag: 'admin', summary: 'Mail received by the fake SMTP server (instance administrator, signed in; no API token)', response: items(mailSummary) },
  { method: 'get', path: `${v1}/admin/mail/:id`, tag: 'admin', summary: 'One received mail, invitation and reset links hidden unless ECLIPTA_OUTBOX_LINKS=shown (instance administrator, signed in; no API token)', response: mailMessage },
  { method: 'get', path: `${v1}/bodies`, tag: 'environment', summary: 'The body catalogue with sources', response: bodiesResponse },
  { method: 'post', path: `${v1}/environment/compute`, tag: 'environment', summary: 'One orbit’s thermal environment (stateless)', body: environmentRequest, response: environmentResponse, perStep: true },
];
