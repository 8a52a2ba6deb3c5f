import type { SessionUser, StaffMember } from '../../shared/auth/schemas';
import { User } from '../models';

export async function listStaff(actor: SessionUser): Promise<StaffMember[]> {
  const users = await User.findAll({ where: { clinicId: actor.clinicId }, order: [['name', 'ASC']] });
  return users.map((u) => ({
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    clinicId: u.clinicId,
    active: u.active,
    invited: u.passwordHash === null,
    createdAt: u.createdAt.toISOString(),
  }));
}

/** One member of the caller's clinic; another clinic's member is "not found". */
export async function getStaffMember(actor: SessionUser, id: string): Promise<StaffMember | null> {
  const u = await User.findOne({ where: { id, clinicId: actor.clinicId } });
  if (!u) return null;
  return { id: u.id, email: u.email, name: u.name, role: u.role, clinicId: u.clinicId, active: u.active, invited: u.passwordHash === null, createdAt: u.createdAt.toISOString() };
}
