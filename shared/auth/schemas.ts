import { z } from 'zod';
import { roleSchema } from './roles';

export const PASSWORD_MIN_LENGTH = 12;

export const signInSchema = z.object({
  email: z.string({ message: 'E-mail is required.' }).trim().toLowerCase().email({ message: 'Enter a valid e-mail address.' }),
  password: z
    .string({ message: 'Password is required.' })
    .min(1, { message: 'Password is required.' })
    .max(200, { message: 'Password is too long.' }),
});
export type SignInInput = z.infer<typeof signInSchema>;

/** For setting a password (invitations, resets): the length rule lives here only. */
export const newPasswordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, { message: `Use at least ${PASSWORD_MIN_LENGTH} characters.` })
  .max(200, { message: 'Password is too long.' });

export const sessionUserSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  clinicId: z.string().uuid(),
  clinicName: z.string().optional(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** `invited`: invited by e-mail and no password set yet (shown as "Invited", not "Deactivated"). */
export const staffMemberSchema = sessionUserSchema.extend({ active: z.boolean(), invited: z.boolean(), createdAt: z.string() });
export type StaffMember = z.infer<typeof staffMemberSchema>;
