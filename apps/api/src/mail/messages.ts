/** The texts of the e-mails Swardwise sends. Plain text: it reads on every phone. */
import type { OutgoingMail } from './mailer.ts';

export function invitationMail(to: string, name: string, role: string, url: string): OutgoingMail {
  return {
    to,
    subject: 'Your Swardwise account is ready',
    text: [
      `Hello ${name},`,
      '',
      `An administrator has given you a Swardwise account as ${role}.`,
      'Choose your password here (the link works once, for 7 days):',
      '',
      url,
      '',
      'If you did not expect this, you can ignore this message.',
    ].join('\n'),
  };
}

export function passwordResetMail(to: string, name: string, url: string): OutgoingMail {
  return {
    to,
    subject: 'Reset your Swardwise password',
    text: [
      `Hello ${name},`,
      '',
      'Someone asked to reset the password of your Swardwise account.',
      'Choose a new password here (the link works once, for one hour):',
      '',
      url,
      '',
      'If it was not you, ignore this message: your password stays as it is.',
    ].join('\n'),
  };
}
