import { UniqueConstraintError, type Transaction } from 'sequelize';
import type { SessionUser, StaffMember } from '../../shared/auth/schemas';
import type { InvitationInput } from '../../shared/mail/account-schemas';
import { buildInvitationMail } from '../../shared/mail/account-mail';
import { AppError } from '../errors';
import { AuthToken, Clinic, User } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { enqueueMail } from './mail-outbox-service';
import { newLinkToken, retireLinks, setPasswordLink } from './password-reset-service';

export const INVITATION_DAYS = 7;

function toStaffMember(u: User, clinicName?: string): StaffMember {
  return { id: u.id, email: u.email, name: u.name, role: u.role, clinicId: u.clinicId, clinicName, active: u.active, invited: u.passwordHash === null, createdAt: u.createdAt.toISOString() };
}

/** A fresh single-use link for the account (earlier invitation links stop working) and its e-mail, in the caller's transaction. */
async function sendInvitationLink(actor: SessionUser, user: User, clinic: { name: string } | null, timeZone: string, transaction: Transaction): Promise<Date> {
  const { token, hash } = newLinkToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3_600_000);
  await retireLinks(user.id, ['invitation'], transaction);
  await AuthToken.create({ clinicId: actor.clinicId, userId: user.id, purpose: 'invitation', tokenHash: hash, expiresAt, createdBy: actor.id }, { transaction });
  await enqueueMail(
    [
      {
        clinicId: actor.clinicId,
        kind: 'invitation',
        to: user.email,
        content: buildInvitationMail({
          clinicName: clinic?.name ?? 'your clinic',
          inviteeName: user.name,
          inviterName: actor.name,
          role: user.role,
          link: setPasswordLink(token),
          expiresAt,
          timeZone,
        }),
        discardAfter: expiresAt,
      },
    ],
    transaction,
  );
  return expiresAt;
}

/**
 * An admin invites someone: an inactive account without a password, and an e-mailed single-use link to set one
 * (valid 7 days). Inviting an address again that has not yet accepted sends a fresh link and retires the old one.
 */
export async function inviteStaff(actor: SessionUser, input: InvitationInput): Promise<{ member: StaffMember; expiresAt: string }> {
  const existing = await User.findOne({ where: { email: input.email } });
  const pending = existing && existing.clinicId === actor.clinicId && !existing.active && existing.passwordHash === null;
  const [clinic, settings] = await Promise.all([Clinic.findByPk(actor.clinicId), getClinicSettings(actor.clinicId)]);
  const taken = () => {
    const message = 'Someone already has an account with this e-mail address.';
    return new AppError(409, 'email_taken', message, { email: message });
  };
  if (existing && !pending) throw taken();
  const { member, expiresAt } = await User.sequelize!.transaction(async (transaction) => {
    const user = existing
      ? await existing.update({ name: input.name, role: input.role }, { transaction })
      : await User.create({ clinicId: actor.clinicId, email: input.email, name: input.name, role: input.role, passwordHash: null, active: false }, { transaction });
    const linkExpiresAt = await sendInvitationLink(actor, user, clinic, settings.timeZone, transaction);
    await recordAudit(actor, existing ? 'staff.reinvited' : 'staff.invited', { type: 'user', id: user.id }, { role: user.role }, transaction);
    return { member: user, expiresAt: linkExpiresAt };
  }).catch((error) => {
    // Two admins inviting the same address at once: the unique index lets one through.
    throw error instanceof UniqueConstraintError ? taken() : error;
  });
  return { member: toStaffMember(member, clinic?.name), expiresAt: expiresAt.toISOString() };
}

/**
 * Sends an invited member who has not yet set a password a new link (from the staff list): the earlier links stop
 * working. Someone who has already joined resets their password instead.
 */
export async function resendInvitation(actor: SessionUser, id: string): Promise<{ member: StaffMember; expiresAt: string }> {
  const [clinic, settings] = await Promise.all([Clinic.findByPk(actor.clinicId), getClinicSettings(actor.clinicId)]);
  return User.sequelize!.transaction(async (transaction) => {
    const user = await User.findOne({ where: { id, clinicId: actor.clinicId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw AppError.notFound('Staff member');
    if (user.passwordHash !== null) {
      throw AppError.conflict(`${user.name} has already joined: they can reset their password from the sign-in page.`, 'already_joined');
    }
    const expiresAt = await sendInvitationLink(actor, user, clinic, settings.timeZone, transaction);
    await recordAudit(actor, 'staff.invitation-resent', { type: 'user', id: user.id }, { role: user.role }, transaction);
    return { member: toStaffMember(user, clinic?.name), expiresAt: expiresAt.toISOString() };
  });
}
