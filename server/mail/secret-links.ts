// Links whose last path segment is a single-use secret: an invitation (/invite/<secret>) and a
// password reset (/reset-password/<secret>). Whoever reads one can join a workspace or take the
// account over, so copies the server keeps are hidden: in the log (logger.ts) and on the mail
// outbox (routes/admin.ts) unless ECLIPTA_OUTBOX_LINKS=shown.

/** Client routes followed by a secret, and what a hidden one is called. */
export const secretLinkRoutes = { invite: 'invitation link', 'reset-password': 'password reset link' } as const;

const routeNames = Object.keys(secretLinkRoutes).join('|');
const secretLink = new RegExp(`(?:https?://[^\\s/]+)?/(${routeNames})/[A-Za-z0-9_-]+`, 'g');

/** A mail text with every secret link replaced by a sentence, and how many were replaced. */
export function hideSecretLinks(text: string): { text: string; hidden: number } {
  let hidden = 0;
  const out = text.replace(secretLink, (_link, route: keyof typeof secretLinkRoutes) => {
    hidden++;
    return `[${secretLinkRoutes[route]} hidden: only its recipient may use it]`;
  });
  return { text: out, hidden };
}
