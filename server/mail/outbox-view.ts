// The instance administrator's view of the mail the product sent. With SMTP_URL set there is no
// local inbox: the list is empty with a note, and a message is 404. The invitation and password
// reset links in a message are hidden unless ECLIPTA_OUTBOX_LINKS=shown: they are their recipients' secrets.
import type { AppContext } from '../app-context';
import { notFound } from '../errors';
import { hideSecretLinks } from './secret-links';

export function outboxList(ctx: AppContext) {
  const inbox = ctx.mailer.inbox;
  if (!inbox) return { items: [], note: 'Mail goes to the SMTP server in SMTP_URL; only the local fake server keeps a copy.' };
  return { items: inbox.list() };
}

export async function outboxMessage(ctx: AppContext, id: string) {
  const message = ctx.mailer.inbox ? await ctx.mailer.inbox.get(id) : null;
  if (!message) throw notFound(`No received mail with id ${JSON.stringify(id.slice(0, 80))}.`);
  if (ctx.config.outboxLinks === 'shown') return { ...message, hiddenLinks: 0 };
  const text = hideSecretLinks(message.text);
  const html = message.html === null ? null : hideSecretLinks(message.html);
  return { ...message, text: text.text, html: html?.text ?? null, hiddenLinks: Math.max(text.hidden, html?.hidden ?? 0) };
}
