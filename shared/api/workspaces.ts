// Workspaces, members, invitations, the audit log and the instance administrator's mail view.
// Routes (under /api/v1):
//   GET    workspaces                                   -> {items: workspace[]}          (the caller's)
//   GET    workspaces/:workspaceId/members              -> {items: member[]}             (any member)
//   PATCH  workspaces/:workspaceId/members/:userId      memberUpdate -> member           (owner)
//   DELETE workspaces/:workspaceId/members/:userId      -> 204                           (owner)
//   GET    workspaces/:workspaceId/invitations          -> {items: invitation[]}         (owner)
//   POST   workspaces/:workspaceId/invitations          invitationCreate -> 201 invitation (owner; sends the e-mail)
//   DELETE workspaces/:workspaceId/invitations/:id      -> 204                           (owner)
//   GET    workspaces/:workspaceId/audit?action=&actor=&since=&until=&limit=&offset=
//                                                       -> {items: auditEvent[], total}   (owner)
//   GET    admin/mail                                   -> {items: mailSummary[]}        (instance administrator)
//   GET    admin/mail/:id                               -> mailMessage                   (instance administrator)
// A workspace the caller is not a member of answers 404, never 403.
import { z } from 'zod';
import { roles, type Role } from './plain-lists';

export { roles, type Role };
export const role = z.enum(roles);

export const workspace = z.object({ id: z.string(), name: z.string(), role });

export const member = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role,
  joinedAt: z.string(),
});

export const memberUpdate = z.strictObject({ role });

export const invitationCreate = z.strictObject({
  email: z
    .string()
    .trim()
    .toLowerCase()
    .max(254)
    .pipe(z.email({ message: 'is not an e-mail address' })),
  role,
});

export const invitation = z.object({
  id: z.string(),
  email: z.string(),
  role,
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
});

export const auditQuery = z.strictObject({
  action: z.string().max(80).optional(),
  actor: z.string().max(254).optional(),
  since: z.iso.datetime({ offset: true }).optional(),
  until: z.iso.datetime({ offset: true }).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
});

export const auditEvent = z.object({
  id: z.string(),
  at: z.string(),
  actorEmail: z.string().nullable(),
  action: z.string(),
  targetType: z.string(),
  targetId: z.string().nullable(),
  summary: z.string(),
});

export const mailSummary = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
});

export const mailMessage = mailSummary.extend({
  text: z.string(),
  html: z.string().nullable(),
  /** How many invitation or password reset links the server hid (they are their recipients' secrets). */
  hiddenLinks: z.number().int().min(0),
});

export type Workspace = z.infer<typeof workspace>;
export type Member = z.infer<typeof member>;
export type Invitation = z.infer<typeof invitation>;
export type InvitationCreate = z.infer<typeof invitationCreate>;
export type AuditEvent = z.infer<typeof auditEvent>;
export type MailSummary = z.infer<typeof mailSummary>;
export type MailMessage = z.infer<typeof mailMessage>;
