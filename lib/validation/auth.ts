import { z } from 'zod';
import { ROLES } from '@/lib/roles';
import { text } from './text';

export const email = text().trim().toLowerCase().email('Enter a valid e-mail address.').max(254);
export const password = text().min(10, 'Use at least 10 characters.').max(200, 'Use at most 200 characters.');

export const signInSchema = z.object({
  email: text().trim().toLowerCase().max(254),
  password: text().max(200),
});

export const updateUserSchema = z
  .object({
    role: z.enum(ROLES).optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, { message: 'Give a role or active.', path: ['role'] });

export const changePasswordSchema = z
  .object({
    currentPassword: text().min(1, 'Enter your current password.').max(200),
    newPassword: password,
  })
  .refine((v) => v.currentPassword !== v.newPassword, { message: 'Choose a password different from the current one.', path: ['newPassword'] });

export const preferencesSchema = z
  .object({
    tempUnit: z.enum(['C', 'F']).optional(),
    volumeUnit: z.enum(['L', 'qt']).optional(),
    name: text().trim().min(1).max(120).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.', path: ['tempUnit'] });
