import { config } from '../config';
import { ROLE_LABELS, type StaffRole } from '~/lib/shared/labels';
import { formatInZone } from '~/lib/shared/time';

/**
 * The invitation e-mail. Plain text only: no markup to escape, and it reads well everywhere.
 * The expiry is written in the firm's zone (`timeZone`), with the zone's name.
 */
export function inviteMail(input: { firmName: string; inviterName: string | null; role: StaffRole; token: string; expiresAt: Date; timeZone: string }) {
  const link = `${config.publicOrigin}/invite/${input.token}`;
  const who = input.inviterName ? `${input.inviterName} has invited you` : 'You have been invited';
  return {
    subject: `Join ${input.firmName} on Lapwing`,
    text: [
      `${who} to join ${input.firmName} on Lapwing, as ${ROLE_LABELS[input.role]}.`,
      '',
      'Open this link to accept and choose your password:',
      link,
      '',
      `The link works once and expires on ${formatInZone(input.expiresAt, input.timeZone, 'dateTimeZone')}.`,
      'If you were not expecting this, you can ignore this e-mail.',
    ].join('\n'),
  };
}
