import { createHash, randomBytes } from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import type { LinkTokenInfo, SetPasswordInput } from '../../shared/mail/account-schemas';
import { buildPasswordResetMail } from '../../shared/mail/account-mail';
import { AppError } from '../errors';
import { AuthToken, Clinic, User } from '../models';
import type { AuthTokenPurpose } from '../models/auth-token';
import { recordAudit } from './audit-service';
import { hashPassword } from './auth-service';
import { getClinicSettings } from './clinic-settings-service';
import { appLink, enqueueMail } from './mail-outbox-service';

export const RESET_TOKEN_HOURS = 1;
/** A reset link is sent at most this often per account in an hour, however often the form is sent. */
export const RESETS_PER_HOUR = 3;

const INVALID_LINK = 'This link has expired or has already been used. Ask for a new one.';

/** 32 random bytes: what the e-mail carries. Only its SHA-256 is stored. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function setPasswordLink(token: string): string {
  return appLink(`/set-password?token=${encodeURIComponent(token)}`);
}

/** Earlier links of the same kind stop working when a new one is sent, so only the newest e-mail counts. */
export async function retireLinks(userId: string, purposes: AuthTokenPurpose[], transaction: Transaction): Promise<void> {
  await AuthToken.update({ usedAt: new Date() }, { where: { userId, purpose: { [Op.in]: purposes }, usedAt: null }, transaction });
}

/**
 * Sends a reset link to an active account with this address, and does nothing otherwise; the caller answers the
 * same either way, so the form cannot be used to find out who has an account.
 */
export async function requestPasswordReset(email: string): Promise<void> {
  const known = await User.findOne({ where: { email }, attributes: ['id', 'clinicId'] });
  if (!known) return;
  const [clinic, settings] = await Promise.all([Clinic.findByPk(known.clinicId), getClinicSettings(known.clinicId)]);
  const { token, hash } = newLinkToken();
  const expiresAt = new Date(Date.now() + RESET_TOKEN_HOURS * 3_600_000);
  await AuthToken.sequelize!.transaction(async (transaction) => {
    // The account's row lock makes requests for one account take turns, so the hourly cap holds under a burst.
    const user = await User.findByPk(known.id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user || !user.active || !user.passwordHash) return;
    const recent = await AuthToken.count({
      where: { userId: user.id, purpose: 'password-reset', createdAt: { [Op.gt]: new Date(Date.now() - 3_600_000) } },
      transaction,
    });
    if (recent >= RESETS_PER_HOUR) return;
    await retireLinks(user.id, ['password-reset'], transaction);
    await AuthToken.create({ clinicId: user.clinicId, userId: user.id, purpose: 'password-reset', tokenHash: hash, expiresAt, createdBy: null }, { transaction });
    await enqueueMail(
      [
        {
          clinicId: user.clinicId,
          kind: 'password-reset',
          to: user.email,
          content: buildPasswordResetMail({ clinicName: clinic?.name ?? 'your clinic', name: user.name, link: setPasswordLink(token), expiresAt, timeZone: settings.timeZone }),
          discardAfter: expiresAt,
        },
      ],
      transaction,
    );
    await recordAudit({ id: user.id, clinicId: user.clinicId }, 'password.reset-requested', { type: 'user', id: user.id }, {}, transaction);
  });
}

async function usableToken(token: string, transaction?: Transaction): Promise<AuthToken> {
  const row = await AuthToken.findOne({
    where: { tokenHash: hashLinkToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
    transaction,
    ...(transaction ? { lock: transaction.LOCK.UPDATE } : {}),
  });
  if (!row) throw AppError.badRequest(INVALID_LINK, { token: INVALID_LINK });
  return row;
}

/** Who a link is for, so the screen can greet them; a used, expired or unknown link is a 400 on `token`. */
export async function describeLinkToken(token: string): Promise<LinkTokenInfo> {
  const row = await usableToken(token);
  const user = await User.findByPk(row.userId);
  if (!user || (row.purpose === 'password-reset' && !user.active)) throw AppError.badRequest(INVALID_LINK, { token: INVALID_LINK });
  return { purpose: row.purpose, name: user.name, email: user.email, expiresAt: row.expiresAt.toISOString() };
}

/**
 * Sets the password behind a link: the token is used up, an invited account becomes active, every other link of
 * the account stops working, and every session of the account but the caller's ends.
 */
export async function setPasswordWithToken(input: SetPasswordInput, currentSessionId: string | null): Promise<{ purpose: AuthTokenPurpose; email: string }> {
  const passwordHash = await hashPassword(input.password);
  return AuthToken.sequelize!.transaction(async (transaction) => {
    const row = await usableToken(input.token, transaction);
    const user = await User.findByPk(row.userId, { transaction, lock: transaction.LOCK.UPDATE });
    // A deactivated account is not brought back by a reset link; only an invitation activates.
    if (!user || (row.purpose === 'password-reset' && !user.active)) throw AppError.badRequest(INVALID_LINK, { token: INVALID_LINK });
    await row.update({ usedAt: new Date() }, { transaction });
    await retireLinks(user.id, ['invitation', 'password-reset'], transaction);
    await user.update({ passwordHash, ...(row.purpose === 'invitation' ? { active: true } : {}) }, { transaction });
    await User.sequelize!.query(
      `DELETE FROM "session" WHERE sess->'passport'->>'user' = :userId AND sid <> :keep`,
      { replacements: { userId: user.id, keep: currentSessionId ?? '' }, type: QueryTypes.DELETE, transaction },
    );
    await recordAudit({ id: user.id, clinicId: user.clinicId }, row.purpose === 'invitation' ? 'password.set-from-invitation' : 'password.reset', { type: 'user', id: user.id }, {}, transaction);
    return { purpose: row.purpose, email: user.email };
  });
}
