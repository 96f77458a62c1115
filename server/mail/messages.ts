// The texts of the mails the product sends. Plain text first; the links are the client's routes.
// Every mail ends with the preliminary-design caution (DOMAIN.md; the release mail says it per case).
import { cautionText } from '../../shared/api/caution';
import { roleLabels, type Role } from '../../shared/api/plain-lists';
import type { OutgoingMail } from './mailer';

/** What Eclipta's results are, said at the end of an account mail as in every other. */
const cautionLines = ['', `About Eclipta's results: ${cautionText}`];

export function invitationMail(opts: {
  to: string;
  workspaceName: string;
  role: Role;
  invitedBy: string;
  link: string;
  expiresAt: string;
}): OutgoingMail {
  return {
    to: opts.to,
    subject: `You are invited to the ${opts.workspaceName} workspace on Eclipta`,
    text: [
      `${opts.invitedBy} invites you to join the workspace "${opts.workspaceName}" on Eclipta with the role ${roleLabels[opts.role]}.`,
      '',
      `Accept the invitation here: ${opts.link}`,
      '',
      `The link works once and until ${opts.expiresAt}.`,
      'If you were not expecting this, ignore this message.',
      ...cautionLines,
    ].join('\n'),
  };
}

export function passwordResetMail(opts: { to: string; link: string; expiresAt: string }): OutgoingMail {
  return {
    to: opts.to,
    subject: 'Reset your Eclipta password',
    text: [
      'Someone asked to reset the password of your Eclipta account.',
      '',
      `Choose a new password here: ${opts.link}`,
      '',
      `The link works once and until ${opts.expiresAt}.`,
      'If it was not you, ignore this message; your password stays as it is.',
      ...cautionLines,
    ].join('\n'),
  };
}
