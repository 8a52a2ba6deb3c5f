import { clinicSettingsSchema, type ClinicSettings } from '../../shared/clinic/settings';
import { Clinic } from '../models';

/** The clinic's stored settings over the defaults; a stored value that no longer validates falls back to its default. */
export async function getClinicSettings(clinicId: string): Promise<ClinicSettings> {
  const clinic = await Clinic.findByPk(clinicId);
  const stored = (clinic?.settings ?? {}) as Record<string, unknown>;
  const parsed = clinicSettingsSchema.safeParse(stored);
  if (parsed.success) return parsed.data;
  const kept = Object.fromEntries(
    Object.entries(stored).filter(([key]) => !parsed.error.issues.some((issue) => issue.path[0] === key)),
  );
  return clinicSettingsSchema.parse(kept);
}
