// admin/*: the instance administrator's view of the mail the product sent.
// With SMTP_URL set there is no local inbox: the list is empty with a note, and a message is 404.
import { Router } from 'express';
import type { AppContext } from '../app-context';
import { pathParam } from '../path-param';
import { requireAdmin } from '../auth/middleware';
import { notFound } from '../errors';

export function adminRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/admin/mail', requireAdmin, (_req, res) => {
    const inbox = ctx.mailer.inbox;
    if (!inbox) {
      res.json({ items: [], note: 'Mail goes to the SMTP server in SMTP_URL; only the local fake server keeps a copy.' });
      return;
    }
    res.json({ items: inbox.list() });
  });

  router.get('/admin/mail/:id', requireAdmin, async (req, res) => {
    const id = pathParam(req, 'id');
    const message = ctx.mailer.inbox ? await ctx.mailer.inbox.get(id) : null;
    if (!message) throw notFound(`No received mail with id ${JSON.stringify(id.slice(0, 80))}.`);
    res.json(message);
  });

  return router;
}
