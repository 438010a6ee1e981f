import { config } from '../config';

/** The password reset e-mail. Plain text only. */
export function passwordResetMail(input: { name: string; token: string; expiresAt: Date }) {
  const link = `${config.publicOrigin}/reset/${input.token}`;
  return {
    subject: 'Choose a new Lapwing password',
    text: [
      `Hello ${input.name},`,
      '',
      'Someone (hopefully you) asked to reset the password of your Lapwing sign-in.',
      'Open this link to choose a new one:',
      link,
      '',
      `The link works once and expires on ${input.expiresAt.toUTCString()}.`,
      'If you did not ask, ignore this e-mail: your password stays as it is.',
    ].join('\n'),
  };
}
