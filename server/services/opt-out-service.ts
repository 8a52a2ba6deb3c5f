import { QueryTypes, type Transaction } from 'sequelize';
import type { OptOutLinkInfo, OptOutResult } from '../../shared/data-rights/opt-out';
import { AppError } from '../errors';
import { Athlete, AuditEvent, Clinic } from '../models';
import { appLink } from './mail-outbox-service';
import { hashLinkToken, newLinkToken } from './password-reset-service';

/**
 * The opt-out link every e-mail to an athlete carries (docs/decisions/0091-email-opt-out-links.md): a fresh
 * single-use token per message, kept only as its SHA-256, used without signing in. It stays valid for a year so an
 * old message still works; opting out spends every link the athlete holds.
 */
export const OPT_OUT_TOKEN_DAYS = 365;

const INVALID_LINK = 'This link has expired or has already been used. If you still receive e-mails you did not want, contact the clinic.';
const cancelledBecauseOptedOut = 'Not sent: the athlete opted out of e-mails.';

export function optOutLink(token: string): string {
  return appLink(`/opt-out?token=${encodeURIComponent(token)}`);
}

/** A new link for one message to the athlete, written in the transaction that queues the message. */
export async function issueOptOutLink(athlete: Pick<Athlete, 'id' | 'clinicId'>, transaction: Transaction): Promise<string> {
  const { token, hash } = newLinkToken();
  await Athlete.sequelize!.query(
    `INSERT INTO email_opt_out_tokens (clinic_id, athlete_id, token_hash, expires_at)
     VALUES (:clinicId, :athleteId, :hash, now() + make_interval(days => :days))`,
    { replacements: { clinicId: athlete.clinicId, athleteId: athlete.id, hash, days: OPT_OUT_TOKEN_DAYS }, type: QueryTypes.INSERT, transaction },
  );
  return optOutLink(token);
}

interface TokenRow {
  id: string;
  clinic_id: string;
  athlete_id: string;
}

async function usableToken(token: string, transaction?: Transaction): Promise<TokenRow> {
  const rows = await Athlete.sequelize!.query<TokenRow>(
    `SELECT t.id, t.clinic_id, t.athlete_id FROM email_opt_out_tokens t JOIN athletes a ON a.id = t.athlete_id
     WHERE t.token_hash = :hash AND t.used_at IS NULL AND t.expires_at > now() AND a.erased_at IS NULL
     ${transaction ? 'FOR UPDATE OF t' : ''}`,
    { replacements: { hash: hashLinkToken(token) }, type: QueryTypes.SELECT, transaction },
  );
  if (!rows[0]) throw AppError.badRequest(INVALID_LINK, { token: INVALID_LINK });
  return rows[0];
}

async function clinicName(clinicId: string, transaction?: Transaction): Promise<string> {
  return (await Clinic.findByPk(clinicId, { attributes: ['name'], transaction }))?.name ?? 'the clinic';
}

/** Which clinic a link is from, for the confirmation page; it names no person, since anyone holding the link sees it. */
export async function describeOptOutLink(token: string): Promise<OptOutLinkInfo> {
  const row = await usableToken(token);
  return { clinicName: await clinicName(row.clinic_id) };
}

/**
 * Home-care messages to the athlete that are still waiting in the outbox. They are found through the athlete's
 * runs (each plan's dedupe key names its run), so a message to an address since changed is found too.
 */
export async function cancelPendingHomeCare(clinicId: string, athleteId: string, reason: string, transaction: Transaction): Promise<number> {
  const [, affected] = await Athlete.sequelize!.query(
    `UPDATE outbound_emails SET status = 'failed-permanently', last_error = :reason, updated_at = now()
     WHERE clinic_id = :clinicId AND status = 'pending' AND kind = 'home-care'
       AND dedupe_key IN (SELECT 'home-care:' || id FROM runs WHERE clinic_id = :clinicId AND athlete_id = :athleteId)`,
    { replacements: { clinicId, athleteId, reason }, type: QueryTypes.UPDATE, transaction },
  );
  return Number(affected ?? 0);
}

/**
 * The athlete's answer to the link: no further e-mails. The link and every other one they hold are spent, and a
 * message still waiting in the outbox is not sent.
 */
export async function optOutWithToken(token: string): Promise<OptOutResult> {
  return Athlete.sequelize!.transaction(async (transaction) => {
    const row = await usableToken(token, transaction);
    const athlete = await Athlete.findOne({ where: { id: row.athlete_id, clinicId: row.clinic_id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!athlete) throw AppError.badRequest(INVALID_LINK, { token: INVALID_LINK });
    const optedOutAt = athlete.emailOptedOutAt ?? new Date();
    if (!athlete.emailOptedOutAt) await athlete.update({ emailOptedOutAt: optedOutAt }, { transaction });
    await Athlete.sequelize!.query('UPDATE email_opt_out_tokens SET used_at = now() WHERE athlete_id = :athleteId AND used_at IS NULL', {
      replacements: { athleteId: athlete.id },
      type: QueryTypes.UPDATE,
      transaction,
    });
    const cancelled = await cancelPendingHomeCare(athlete.clinicId, athlete.id, cancelledBecauseOptedOut, transaction);
    // No staff member did this: the audit trail names the link as the actor.
    await AuditEvent.create(
      { clinicId: athlete.clinicId, userId: null, action: 'athlete.email-opted-out', recordType: 'athlete', recordId: athlete.id, detail: { via: 'e-mail link', cancelledMessages: cancelled } },
      { transaction },
    );
    return { clinicName: await clinicName(athlete.clinicId, transaction), optedOutAt: optedOutAt.toISOString() };
  });
}
