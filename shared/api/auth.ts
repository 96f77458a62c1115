// Sign-in, the signed-in user, password resets, invitations and personal API tokens.
// Routes (all under /api/v1 unless noted):
//   POST auth/sign-in                      signIn            -> 200 meResponse (+ session cookie)
//   POST auth/sign-out                                      -> 204
//   GET  auth/me                                            -> 200 meResponse
//   POST auth/password-reset               passwordResetRequest -> 202 {message} (same answer for unknown e-mails)
//   POST auth/password-reset/confirm       passwordResetConfirm -> 200 {message}
//   GET  invitations/:token                                 -> 200 invitationPreview (no sign-in needed)
//   POST invitations/:token/accept         invitationAccept  -> 200 meResponse (+ session cookie)
//   GET  tokens                                             -> 200 {items: apiToken[]}
//   POST tokens                            tokenCreate       -> 201 tokenCreated (the secret is shown this once)
//   DELETE tokens/:id                                       -> 204
import { z } from 'zod';
import { lineText } from './text';
import { role } from './workspaces';

export const email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'an e-mail address has at most 254 characters')
  .pipe(z.email({ message: 'is not an e-mail address' }));

export const password = z
  .string()
  .min(10, 'a password needs at least 10 characters')
  .max(200, 'a password has at most 200 characters');

export const signIn = z.strictObject({
  email: z.string().trim().toLowerCase().min(1, 'enter your e-mail address').max(254),
  password: z.string().min(1, 'enter your password').max(200),
});

export const user = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
});

export const membershipSummary = z.object({
  workspaceId: z.string(),
  workspaceName: z.string(),
  role,
});

export const meResponse = z.object({
  user,
  workspaces: z.array(membershipSummary),
  /** How the request was authenticated; a token's scope is shown to its holder. */
  auth: z.object({ kind: z.enum(['session', 'token']), readOnly: z.boolean() }),
});

export const passwordResetRequest = z.strictObject({ email });
export const passwordResetConfirm = z.strictObject({
  token: z.string().min(1).max(200),
  password,
});

export const invitationPreview = z.object({
  email: z.string(),
  workspaceName: z.string(),
  role,
  invitedBy: z.string(),
  expiresAt: z.string(),
  /** True when an account with this e-mail already exists: accepting then needs its password, not a new one. */
  existingUser: z.boolean(),
});

export const invitationAccept = z.strictObject({
  name: lineText(120).min(1, 'enter your name').optional(),
  password,
});

export const tokenCreate = z.strictObject({
  name: lineText(80, 'a token name has at most 80 characters').min(1, 'give the token a name'),
  readOnly: z.boolean().default(false),
  /** Days until the token stops working; absent means it never expires. */
  expiresInDays: z.number().int().min(1).max(3650).optional(),
});

export const apiToken = z.object({
  id: z.string(),
  name: z.string(),
  readOnly: z.boolean(),
  /** The first characters of the secret, so a holder can tell tokens apart. */
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  expiresAt: z.string().nullable(),
});

export const tokenCreated = z.object({ token: apiToken, secret: z.string() });

export type SignIn = z.infer<typeof signIn>;
export type User = z.infer<typeof user>;
export type MeResponse = z.infer<typeof meResponse>;
export type MembershipSummary = z.infer<typeof membershipSummary>;
export type InvitationPreview = z.infer<typeof invitationPreview>;
export type InvitationAccept = z.infer<typeof invitationAccept>;
export type TokenCreate = z.input<typeof tokenCreate>;
export type ApiToken = z.infer<typeof apiToken>;
export type TokenCreated = z.infer<typeof tokenCreated>;
