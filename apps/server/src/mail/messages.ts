import type { Role } from '@biasproof/shared';
import { composeMail } from './compose.ts';
import type { OutgoingMail } from './send-mail.ts';

const roleList = (roles: readonly Role[]) => roles.join(', ');

/** Account messages name the link they carry, so the outbox can list it. */
export type LinkedMail = OutgoingMail & { link: string };

export function invitationMail(input: {
  to: string;
  orgName: string;
  invitedByName: string;
  roles: readonly Role[];
  link: string;
  expiresAt: Date;
}): LinkedMail {
  return {
    to: input.to,
    subject: `${input.invitedByName} invited you to ${input.orgName} on Biasproof`,
    link: input.link,
    ...composeMail({
      greeting: 'Hello,',
      paragraphs: [
        `${input.invitedByName} invited you to join ${input.orgName} on Biasproof as ${roleList(input.roles)}.`,
        `The link works once and expires on ${input.expiresAt.toUTCString()}.`,
      ],
      link: { url: input.link, label: 'Accept the invitation' },
      footer: 'If you did not expect this invitation, ignore this message.',
    }),
  };
}

export function passwordResetMail(input: { to: string; name: string; link: string }): LinkedMail {
  return {
    to: input.to,
    subject: 'Reset your Biasproof password',
    link: input.link,
    ...composeMail({
      greeting: `Hello ${input.name},`,
      paragraphs: [
        'Someone (hopefully you) asked to reset the password of your Biasproof account.',
        'Choose a new password with the link below; it works once, for one hour.',
      ],
      link: { url: input.link, label: 'Choose a new password' },
      footer: 'If you did not ask for this, ignore this message: your password stays as it is.',
    }),
  };
}
