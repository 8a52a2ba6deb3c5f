import type { SessionUser } from '../../shared/auth/schemas';
import {
  clinicSettingDefaultSources,
  clinicSettingsSchema,
  defaultClinicSettings,
  type ClinicSettings,
  type SettingsBody,
  type SettingsView,
} from '../../shared/clinic/settings';
import { AppError } from '../errors';
import { Clinic } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';

async function findClinic(actor: SessionUser): Promise<Clinic> {
  const clinic = await Clinic.findByPk(actor.clinicId);
  if (!clinic) throw AppError.notFound('Clinic');
  return clinic;
}

async function toSettingsView(clinic: Clinic): Promise<SettingsView> {
  return {
    clinicName: clinic.name,
    settings: await getClinicSettings(clinic.id),
    defaults: { ...defaultClinicSettings },
    sources: clinicSettingDefaultSources,
    updatedAt: clinic.updatedAt.toISOString(),
  };
}

export async function getSettings(actor: SessionUser): Promise<SettingsView> {
  return toSettingsView(await findClinic(actor));
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/**
 * Saves the clinic's name and any of its settings. Runs already created keep the plan they were built with
 * (the plan is a snapshot on the run); only runs created afterwards read the new values. The audit event
 * keeps each changed value before and after.
 */
export async function updateSettings(actor: SessionUser, input: SettingsBody): Promise<SettingsView> {
  const { clinicName, ...changes } = input;
  const clinic = await Clinic.sequelize!.transaction(async (transaction) => {
    const row = await Clinic.findByPk(actor.clinicId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw AppError.notFound('Clinic');
    const current = await getClinicSettings(actor.clinicId);
    // The whole object is validated again, so a combination (waking hours) is checked as it will be stored.
    const next: ClinicSettings = clinicSettingsSchema.parse({ ...current, ...Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)) });
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    for (const key of Object.keys(next) as (keyof ClinicSettings)[]) {
      if (!same(current[key], next[key])) changed[key] = { from: current[key], to: next[key] };
    }
    if (clinicName !== undefined && clinicName !== row.name) changed.clinicName = { from: row.name, to: clinicName };
    if (Object.keys(changed).length === 0) return row;

    await row.update({ name: clinicName ?? row.name, settings: next }, { transaction });
    await recordAudit(actor, 'settings.updated', { type: 'clinic', id: row.id }, { changed }, transaction);
    return row;
  });
  return toSettingsView(clinic);
}
