import { describe, expect, test } from 'vitest';
import { passwordResetMail } from '~/lib/server/auth/mails';
import { inviteMail } from '~/lib/server/team/mails';

describe('expiry times in e-mails', () => {
  test('an invitation names its expiry in the firm’s zone, with the zone’s name, across the start of daylight time', () => {
    // Sent 2026-03-05 09:00 CST; a week of 168 hours later the clocks have gone forward.
    // Source: IANA tz database, northamerica: Rule US 2007 max Mar Sun>=8 2:00 (2026-03-08).
    const sent = Date.parse('2026-03-05T15:00:00Z');
    const mail = inviteMail({
      firmName: 'Firm',
      inviterName: 'Olive',
      role: 'sales',
      token: 'T',
      expiresAt: new Date(sent + 7 * 24 * 3_600_000),
      timeZone: 'America/Chicago',
    });
    expect(mail.text).toContain('expires on Thu, Mar 12, 2026, 10:00 AM CDT.');
    expect(mail.text).not.toContain('GMT');
  });

  test('a reset link names its expiry in the zone it is given; UTC says so', () => {
    const expiresAt = new Date('2026-12-02T02:19:00Z');
    expect(passwordResetMail({ name: 'Sam', token: 'T', expiresAt, timeZone: 'America/Chicago' }).text).toContain('expires on Tue, Dec 1, 2026, 8:19 PM CST.');
    expect(passwordResetMail({ name: 'Sam', token: 'T', expiresAt, timeZone: 'UTC' }).text).toContain('expires on Wed, Dec 2, 2026, 2:19 AM UTC.');
  });
});
