import { z } from 'zod';

export const roles = ['therapist', 'supervisor', 'admin'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

/** Where each role lands after signing in (decisions: therapists → Today, supervisors → Review desk, admins → Staff). */
export const homePathByRole: Record<Role, string> = {
  therapist: '/today',
  supervisor: '/review',
  admin: '/staff',
};
