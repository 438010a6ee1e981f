/**
 * Inputs of sign-in, invitations, password changes and the team screen, shared by the forms and
 * the endpoints so the message next to a field is the one the server would give.
 */
import { z } from 'zod';
import { STAFF_ROLES } from './labels';

/** Source: OWASP ASVS 4.0.3 2.1.1 (at least 12 characters) and 2.1.2 (at most 128). */
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;

/** Trimmed and lower-cased, so Olive@Example.test and olive@example.test are one person. */
export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .min(1, { error: 'Enter your e-mail address.' })
  .max(254, { error: 'An e-mail address has at most 254 characters.' })
  .toLowerCase()
  .pipe(z.email({ error: 'Enter an e-mail address like name@example.com.' }));

/** A password someone chooses. Not trimmed: every character counts. */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(1, { error: 'Choose a password.' })
  .min(PASSWORD_MIN, { error: `Use at least ${PASSWORD_MIN} characters. A few ordinary words in a row work well.` })
  .max(PASSWORD_MAX, { error: `Use at most ${PASSWORD_MAX} characters.` });

/**
 * A password someone types to sign in. Only its length is checked: the cap keeps a huge input away
 * from the hash function, which would otherwise be an easy way to load the server.
 */
export const currentPasswordSchema = z
  .string({ error: 'Enter your password.' })
  .min(1, { error: 'Enter your password.' })
  .max(PASSWORD_MAX, { error: `A Lapwing password has at most ${PASSWORD_MAX} characters.` });

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: currentPasswordSchema,
});

const passwordPair = {
  password: newPasswordSchema,
  confirm: z
    .string({ error: 'Type the password again.' })
    .min(1, { error: 'Type the password again.' })
    .max(PASSWORD_MAX, { error: 'The two passwords differ.' }),
};

function samePasswords(value: { password: string; confirm: string }, ctx: z.RefinementCtx): void {
  if (value.password !== value.confirm) ctx.addIssue({ code: 'custom', path: ['confirm'], message: 'The two passwords differ.' });
}

export const personNameSchema = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, { error: 'Enter your name.' })
  .max(120, { error: 'A name has at most 120 characters.' });

/** A new person accepting an invitation: their name and a password. */
export const acceptInviteSchema = z.strictObject({ name: personNameSchema, ...passwordPair }).superRefine(samePasswords);

/** Someone who already has a Lapwing sign-in accepting an invitation to another firm. */
export const acceptInviteAsMemberSchema = z.strictObject({ password: currentPasswordSchema });

export const resetRequestSchema = z.strictObject({ email: emailSchema });

export const resetPasswordSchema = z.strictObject(passwordPair).superRefine(samePasswords);

export const changePasswordSchema = z.strictObject({ currentPassword: currentPasswordSchema, ...passwordPair }).superRefine(samePasswords);

const roleSchema = z.enum(STAFF_ROLES, { error: 'Choose Owner or Sales.' });

export const inviteSchema = z.strictObject({ email: emailSchema, role: roleSchema });

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export const switchFirmSchema = z.strictObject({ companyId: z.uuid({ error: 'Choose a firm.' }) });
