import { z } from 'zod';
import { roles } from '../auth/roles';

/** PATCH /api/staff/:id: an admin changes a member's role, or deactivates or reactivates them. */
export const staffUpdateSchema = z
  .object({
    role: z.enum(roles, { error: `Role must be one of: ${roles.join(', ')}` }).optional(),
    active: z.boolean({ error: 'Active must be true or false' }).optional(),
  })
  .refine((body) => body.role !== undefined || body.active !== undefined, { error: 'Send a new role, or active true or false' });
export type StaffUpdate = z.infer<typeof staffUpdateSchema>;

export const lastAdminMessage =
  'A clinic needs at least one active admin: make another member an admin first, then change this account.';

export const roleWords = { therapist: 'Therapist', supervisor: 'Supervisor', admin: 'Admin' } as const;
