import { QueryTypes } from 'sequelize';
import type { SessionUser, StaffMember } from '../../shared/auth/schemas';
import { lastAdminMessage, type StaffUpdate } from '../../shared/staff/schemas';
import { AppError } from '../errors';
import { User } from '../models';
import { recordAudit } from './audit-service';
import { getStaffMember } from './staff-service';
import { retireLinks } from './password-reset-service';

/**
 * An admin changes a member's role or deactivates or reactivates them. The clinic's last active admin can be
 * neither demoted nor deactivated, or nobody could manage the clinic any more. A deactivated member's
 * sessions are deleted as well: passport already refuses an inactive user on every request
 * (findActiveSessionUser), and deleting the sessions means a later reactivation does not bring an old,
 * possibly forgotten, signed-in tablet back to life.
 */
export async function updateStaffMember(actor: SessionUser, id: string, input: StaffUpdate): Promise<StaffMember> {
  await User.sequelize!.transaction(async (transaction) => {
    // Lock the clinic's active admins (in a fixed order) before the member: two admins demoting each other at
    // the same moment then queue here, and the second sees the first's change rather than a stale count.
    const admins = await User.findAll({
      where: { clinicId: actor.clinicId, role: 'admin', active: true },
      order: [['id', 'ASC']],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    const member = await User.findOne({ where: { id, clinicId: actor.clinicId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!member) throw AppError.notFound('Staff member');

    const nextRole = input.role ?? member.role;
    const nextActive = input.active ?? member.active;
    const stopsBeingAdmin = member.role === 'admin' && member.active && (nextRole !== 'admin' || !nextActive);
    if (stopsBeingAdmin && !admins.some((admin) => admin.id !== member.id)) {
      throw AppError.conflict(lastAdminMessage, 'last_admin');
    }

    // Someone invited becomes active by setting a password from their link; switching them on here would make an
    // account nobody can sign in to.
    if (!member.active && nextActive && member.passwordHash === null) {
      throw AppError.conflict(`${member.name} has not accepted the invitation yet: resend it instead.`, 'invitation_pending');
    }

    // Deactivating someone who has not accepted yet withdraws the invitation: their e-mailed link stops working.
    const withdrawsInvitation = input.active === false && member.passwordHash === null;
    if (withdrawsInvitation) {
      await retireLinks(member.id, ['invitation', 'password-reset'], transaction);
      await recordAudit(actor, 'staff.invitation-withdrawn', { type: 'user', id: member.id }, { name: member.name }, transaction);
    }

    const previous = { role: member.role, active: member.active };
    await member.update({ role: nextRole, active: nextActive }, { transaction });
    const record = { type: 'user', id: member.id };
    if (previous.role !== nextRole) {
      await recordAudit(actor, 'staff.role-changed', record, { name: member.name, from: previous.role, to: nextRole }, transaction);
    }
    if (previous.active && !nextActive) {
      await User.sequelize!.query(`DELETE FROM "session" WHERE sess -> 'passport' ->> 'user' = :id`, {
        replacements: { id: member.id },
        type: QueryTypes.DELETE,
        transaction,
      });
      await recordAudit(actor, 'staff.deactivated', record, { name: member.name }, transaction);
    }
    if (!previous.active && nextActive) {
      await recordAudit(actor, 'staff.reactivated', record, { name: member.name }, transaction);
    }
  });
  const member = await getStaffMember(actor, id);
  if (!member) throw AppError.notFound('Staff member');
  return member;
}
