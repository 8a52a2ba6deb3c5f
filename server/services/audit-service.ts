import type { Transaction } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { AuditEvent } from '../models';

/** Who did what to which record, kept for the clinic's audit trail. */
export async function recordAudit(
  actor: Pick<SessionUser, 'id' | 'clinicId'>,
  action: string,
  record: { type: string; id?: string | null },
  detail: Record<string, unknown> = {},
  transaction?: Transaction,
): Promise<void> {
  await AuditEvent.create(
    { clinicId: actor.clinicId, userId: actor.id, action, recordType: record.type, recordId: record.id ?? null, detail },
    { transaction },
  );
}
