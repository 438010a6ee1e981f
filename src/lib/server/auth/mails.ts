import { config } from '../config';
import { formatInZone } from '~/lib/shared/time';

/**
 * The password reset e-mail. Plain text only. The expiry is written in `timeZone` with the zone's
 * name: the person's firm's zone, or UTC when their firms keep different time.
 */
export function passwordResetMail(input: { name: string; token: string; expiresAt: Date; timeZone: string }) {
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
      `The link works once and expires on ${formatInZone(input.expiresAt, input.timeZone, 'dateTimeZone')}.`,
      'If you did not ask, ignore this e-mail: your password stays as it is.',
    ].join('\n'),
  };
}
