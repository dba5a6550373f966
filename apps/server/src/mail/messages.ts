import type { Role } from '@biasproof/shared';
import type { OutgoingMail } from './send-mail.ts';

const roleList = (roles: readonly Role[]) => roles.join(', ');

export function invitationMail(input: {
  to: string;
  orgName: string;
  invitedByName: string;
  roles: readonly Role[];
  link: string;
  expiresAt: Date;
}): OutgoingMail {
  return {
    to: input.to,
    subject: `${input.invitedByName} invited you to ${input.orgName} on Biasproof`,
    text: [
      `${input.invitedByName} invited you to join ${input.orgName} on Biasproof as ${roleList(input.roles)}.`,
      '',
      'Accept the invitation here (the link works once and expires on',
      `${input.expiresAt.toUTCString()}):`,
      '',
      input.link,
      '',
      'If you did not expect this invitation, ignore this message.',
    ].join('\n'),
  };
}

export function passwordResetMail(input: { to: string; name: string; link: string }): OutgoingMail {
  return {
    to: input.to,
    subject: 'Reset your Biasproof password',
    text: [
      `Hello ${input.name},`,
      '',
      'Someone (hopefully you) asked to reset the password of your Biasproof account.',
      'Choose a new password here; the link works once, for one hour:',
      '',
      input.link,
      '',
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ].join('\n'),
  };
}
