import { z } from 'zod';
import { roleSchema } from '../auth/roles';
import { newPasswordSchema } from '../auth/schemas';

/** Inputs of the e-mail driven account flows: inviting staff, asking for a reset link, setting a password. */

const email = z.string({ message: 'E-mail is required.' }).trim().toLowerCase().email({ message: 'Enter a valid e-mail address.' }).max(254, { message: 'E-mail must be at most 254 characters.' });

export const invitationSchema = z.object({
  name: z.string({ message: 'Name is required.' }).trim().min(1, { message: 'Name is required.' }).max(120, { message: 'Name must be at most 120 characters.' }),
  email,
  role: roleSchema,
});
export type InvitationInput = z.infer<typeof invitationSchema>;

export const passwordResetRequestSchema = z.object({ email });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

/** A link token: 32 random bytes in base64url. */
export const linkTokenSchema = z
  .string({ message: 'The link is incomplete. Open it again from the e-mail.' })
  .regex(/^[A-Za-z0-9_-]{43}$/, { message: 'The link is incomplete. Open it again from the e-mail.' });

export const linkTokenBodySchema = z.object({ token: linkTokenSchema });

export const setPasswordSchema = z.object({ token: linkTokenSchema, password: newPasswordSchema });
export type SetPasswordInput = z.infer<typeof setPasswordSchema>;

/** The screen's form: the password twice, so a typo does not lock anyone out. */
export const setPasswordFormSchema = z
  .object({ password: newPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords are not the same.' });
export type SetPasswordForm = z.infer<typeof setPasswordFormSchema>;

export type LinkPurpose = 'invitation' | 'password-reset';

export interface LinkTokenInfo {
  purpose: LinkPurpose;
  name: string;
  email: string;
  expiresAt: string;
}

export const passwordResetAnswer =
  'If an account uses that address, we have sent it a link to choose a new password. The link works for one hour.';
