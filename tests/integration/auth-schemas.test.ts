import { expect, test } from 'vitest';
import { acceptInviteSchema, emailSchema, inviteSchema, newPasswordSchema, signInSchema } from '../../src/lib/shared/auth-schemas';

test('passwords have 12 to 128 characters', () => {
  // Source: OWASP ASVS 4.0.3 2.1.1 (at least 12) and 2.1.2 (at most 128).
  expect(newPasswordSchema.safeParse('a'.repeat(11)).success).toBe(false);
  expect(newPasswordSchema.safeParse('a'.repeat(12)).success).toBe(true);
  expect(newPasswordSchema.safeParse('a'.repeat(64)).success).toBe(true);
  expect(newPasswordSchema.safeParse('a'.repeat(129)).success).toBe(false);
});

test('a 10 MB password is refused by length before anything hashes it', () => {
  const result = signInSchema.safeParse({ email: 'olive@cedar-hollow.test', password: 'x'.repeat(10 * 1024 * 1024) });
  expect(result.success).toBe(false);
  expect(result.error?.issues[0]).toMatchObject({ path: ['password'], message: 'A Lapwing password has at most 128 characters.' });
});

test('e-mail addresses are trimmed and lower-cased, and malformed ones get a plain message', () => {
  expect(emailSchema.parse('  Olive@Cedar-Hollow.TEST ')).toBe('olive@cedar-hollow.test');
  expect(emailSchema.safeParse('olive at cedar').error?.issues[0].message).toBe('Enter an e-mail address like name@example.com.');
  expect(emailSchema.safeParse('').error?.issues[0].message).toBe('Enter your e-mail address.');
});

test('empty fields each get their own message, and unknown fields are refused', () => {
  const empty = signInSchema.safeParse({ email: '', password: '' });
  expect(empty.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
    ['email', 'Enter your e-mail address.'],
    ['password', 'Enter your password.'],
  ]);
  expect(inviteSchema.safeParse({ email: 'a@b.test', role: 'sales', companyId: 'x' }).success).toBe(false);
  expect(inviteSchema.safeParse({ email: 'a@b.test', role: 'admin' }).error?.issues[0].message).toBe('Choose Owner or Sales.');
  const mismatch = acceptInviteSchema.safeParse({ name: 'Ann', password: 'a'.repeat(12), confirm: 'b'.repeat(12) });
  expect(mismatch.error?.issues[0]).toMatchObject({ path: ['confirm'], message: 'The two passwords differ.' });
});
