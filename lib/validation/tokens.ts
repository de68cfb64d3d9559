// Invitations, password resets and their single-use tokens: schemas for the forms and route handlers.
import { z } from 'zod';
import { ROLES } from '@/lib/roles';
import { email, password } from './auth';
import { text } from './text';

/** A token as sent in a link: 32 random bytes, base64url. */
export const TOKEN_RE = /^[A-Za-z0-9_-]{43}$/;
export const tokenField = text({ error: 'The link is incomplete.' }).trim().regex(TOKEN_RE, 'The link is incomplete or damaged. Open it again from the e-mail.');

/** A manager adds a user by e-mail; a temporary password is still accepted for older clients. */
export const inviteUserSchema = z.object({
  name: text().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  email,
  role: z.enum(ROLES, { error: 'Choose a role.' }),
  temporaryPassword: password.optional(),
});

const newPassword = z
  .object({ password, confirm: text().max(200).optional() })
  .refine((v) => v.confirm === undefined || v.confirm === v.password, { message: 'The two passwords differ.', path: ['confirm'] });

export const acceptInviteSchema = z.intersection(
  z.object({ token: tokenField, name: text().trim().min(1, 'Enter your name.').max(120, 'Use at most 120 characters.').optional() }),
  newPassword,
);

export const resetPasswordSchema = z.intersection(z.object({ token: tokenField }), newPassword);

export const resetRequestSchema = z.object({ email });

export const resendInvitationSchema = z.object({ userId: z.coerce.number({ error: 'Give the user.' }).int().positive('Give the user.') }).strict();

/** The one answer to a reset request, whether or not the address has an account. */
export const RESET_REQUEST_ANSWER = 'If that address belongs to an account, a reset link is on its way. It works once, for an hour.';
