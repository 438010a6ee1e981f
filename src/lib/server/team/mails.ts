import { config } from '../config';
import { ROLE_LABELS, type StaffRole } from '~/lib/shared/labels';

/** The invitation e-mail. Plain text only: no markup to escape, and it reads well everywhere. */
export function inviteMail(input: { firmName: string; inviterName: string | null; role: StaffRole; token: string; expiresAt: Date }) {
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
      `The link works once and expires on ${input.expiresAt.toUTCString()}.`,
      'If you were not expecting this, you can ignore this e-mail.',
    ].join('\n'),
  };
}
