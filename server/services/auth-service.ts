import bcrypt from 'bcrypt';
import { Clinic, User } from '../models';
import type { SessionUser } from '../../shared/auth/schemas';

export const BCRYPT_COST = 12;

// Compared against when the e-mail is unknown, so a wrong address costs as long as a wrong password.
const TIMING_DECOY_HASH = bcrypt.hashSync('mendstep-timing-decoy', BCRYPT_COST);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function toSessionUser(user: User, clinicName?: string): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, clinicId: user.clinicId, clinicName };
}

/** The user for these credentials, or null: callers answer one generic message either way. */
export async function verifyCredentials(email: string, password: string): Promise<SessionUser | null> {
  const user = await User.findOne({ where: { email: email.toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? TIMING_DECOY_HASH);
  if (!user || !user.passwordHash || !ok || !user.active) return null;
  const clinic = await Clinic.findByPk(user.clinicId);
  return toSessionUser(user, clinic?.name);
}

/** Loads the session's user on every request, so a deactivated account loses access at once. */
export async function findActiveSessionUser(id: string): Promise<SessionUser | null> {
  const user = await User.findByPk(id);
  if (!user || !user.active) return null;
  const clinic = await Clinic.findByPk(user.clinicId);
  return toSessionUser(user, clinic?.name);
}
