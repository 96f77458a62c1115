// admin/*: the instance administrator's view of the mail the product sent.
// With SMTP_URL set there is no local inbox: the list is empty with a note, and a message is 404.
// Only a signed-in administrator reads it (no API token), and the invitation and password reset
// links in it are hidden unless ECLIPTA_OUTBOX_LINKS=shown: they are their recipients' secrets.
import { Router } from 'express';
import type { AppContext } from '../app-context';
import { pathParam } from '../path-param';
import { requireAdminSession } from '../auth/middleware';
import { notFound } from '../errors';
import { hideSecretLinks } from '../mail/secret-links';

export function adminRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/admin/mail', requireAdminSession, (_req, res) => {
    const inbox = ctx.mailer.inbox;
    if (!inbox) {
      res.json({ items: [], note: 'Mail goes to the SMTP server in SMTP_URL; only the local fake server keeps a copy.' });
      return;
    }
    res.json({ items: inbox.list() });
  });

  router.get('/admin/mail/:id', requireAdminSession, async (req, res) => {
    const id = pathParam(req, 'id');
    const message = ctx.mailer.inbox ? await ctx.mailer.inbox.get(id) : null;
    if (!message) throw notFound(`No received mail with id ${JSON.stringify(id.slice(0, 80))}.`);
    if (ctx.config.outboxLinks === 'shown') {
      res.json({ ...message, hiddenLinks: 0 });
      return;
    }
    const text = hideSecretLinks(message.text);
    const html = message.html === null ? null : hideSecretLinks(message.html);
    res.json({ ...message, text: text.text, html: html?.text ?? null, hiddenLinks: Math.max(text.hidden, html?.hidden ?? 0) });
  });

  return router;
}
