// admin/*: the instance administrator's view of the mail the product sent (server/mail/outbox-view.ts).
// Only a signed-in administrator reads it (no API token).
import { z } from 'zod';
import { mailMessage, mailSummary } from '../../shared/api/workspaces';
import { route, type ApiRoute } from '../http/api-route';
import { outboxList, outboxMessage } from '../mail/outbox-view';

export const adminRoutes: ApiRoute[] = [
  route({
    method: 'get', path: '/api/v1/admin/mail', tag: 'admin', access: 'admin-session', response: z.object({ items: z.array(mailSummary) }),
    summary: 'Mail received by the fake SMTP server (instance administrator, signed in; no API token)',
    handle: ({ ctx }) => outboxList(ctx),
  }),
  route({
    method: 'get', path: '/api/v1/admin/mail/:id', tag: 'admin', access: 'admin-session', response: mailMessage,
    summary: 'One received mail, invitation and reset links hidden unless ECLIPTA_OUTBOX_LINKS=shown (instance administrator, signed in; no API token)',
    handle: ({ ctx, param }) => outboxMessage(ctx, param('id')),
  }),
];
