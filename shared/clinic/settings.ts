import { IANAZone } from 'luxon';
import { z } from 'zod';

export const coldProtocols = ['twenty-each-hour', 'intermittent-10-10-10'] as const;
export const coldProtocolSchema = z.enum(coldProtocols, {
  error: `Cold protocol must be one of: ${coldProtocols.join(', ')}`,
});
export type ColdProtocol = z.infer<typeof coldProtocolSchema>;

const clockTime = /^([01]\d|2[0-3]):[0-5]\d$/;

function clockTimeField(label: string) {
  return z
    .string({ error: `${label} must be a time between 00:00 and 23:59` })
    .regex(clockTime, `${label} must be a time between 00:00 and 23:59 (HH:mm)`)
    .describe(`${label}, 24-hour HH:mm in the clinic's time zone`);
}

export const wakingHoursSchema = z
  .object({ start: clockTimeField('Waking hours start'), end: clockTimeField('Waking hours end') })
  .superRefine((hours, ctx) => {
    // HH:mm strings sort as times; a window across midnight is not supported by the cold schedule.
    if (hours.end <= hours.start) {
      ctx.addIssue({ code: 'custom', path: ['end'], message: 'Waking hours must end after they start, on the same day' });
    }
  });
export type WakingHours = z.infer<typeof wakingHoursSchema>;

export const clinicSettingsSchema = z.object({
  timeZone: z
    .string({ error: 'Time zone must be an IANA name such as Europe/London' })
    .refine((zone) => IANAZone.isValidZone(zone), { error: 'Time zone must be an IANA name such as Europe/London' })
    .describe("IANA time zone name; cold schedules and reminders are computed in it")
    .default('Europe/London'),
  wakingHours: wakingHoursSchema.default({ start: '07:00', end: '22:00' }),
  coldProtocol: coldProtocolSchema.default('twenty-each-hour'),
  swellingThresholdCm: z
    .number({ error: 'Swelling threshold must be between 0.1 and 5 cm' })
    .min(0.1, 'Swelling threshold must be between 0.1 and 5 cm')
    .max(5, 'Swelling threshold must be between 0.1 and 5 cm')
    .describe('Increase in girth of the injured side, cm, above which swelling counts as increased')
    .default(1.0),
  minColdIntervalMinutes: z
    .number({ error: 'Minimum interval between cold applications must be a whole number between 1 and 60 minutes' })
    .int('Minimum interval between cold applications must be a whole number between 1 and 60 minutes')
    .min(1, 'Minimum interval between cold applications must be a whole number between 1 and 60 minutes')
    .max(60, 'Minimum interval between cold applications must be a whole number between 1 and 60 minutes')
    .describe('Minutes of wait before a fresh cold-pack step after an ice massage')
    .default(10),
  abandonAfterHours: z
    .number({ error: 'Abandon after must be a whole number between 1 and 72 hours' })
    .int('Abandon after must be a whole number between 1 and 72 hours')
    .min(1, 'Abandon after must be a whole number between 1 and 72 hours')
    .max(72, 'Abandon after must be a whole number between 1 and 72 hours')
    .describe('Hours without activity after which a run is marked abandoned')
    .default(12),
});

export type ClinicSettings = z.infer<typeof clinicSettingsSchema>;

/** The defaults live in the schema alone; this is what a clinic gets before anyone changes a setting. */
const parsedDefaults = clinicSettingsSchema.parse({});
export const defaultClinicSettings: Readonly<ClinicSettings> = Object.freeze({
  ...parsedDefaults,
  wakingHours: Object.freeze(parsedDefaults.wakingHours),
});

/** Where each default comes from, shown beside the setting so nobody mistakes a default of ours for a study. */
export const clinicSettingDefaultSources: Record<keyof ClinicSettings, string> = {
  timeZone: 'clinic default of ours; each clinic sets its own',
  wakingHours: 'clinic default of ours (07:00–22:00, decisions.md)',
  coldProtocol: 'common practice: cold 20 minutes of each hour while awake in the acute phase',
  swellingThresholdCm:
    'clinic default of ours, from common practice; no published minimal detectable change for limb girth was found, so this is not a published figure',
  minColdIntervalMinutes: 'clinic default of ours (decisions.md)',
  abandonAfterHours: 'clinic default of ours (decisions.md)',
};

/** Partial updates from the settings screen: omitted fields stay as they are rather than reset to defaults. */
export const clinicSettingsUpdateSchema = z.object({
  timeZone: clinicSettingsSchema.shape.timeZone.unwrap(),
  wakingHours: clinicSettingsSchema.shape.wakingHours.unwrap(),
  coldProtocol: coldProtocolSchema,
  swellingThresholdCm: clinicSettingsSchema.shape.swellingThresholdCm.unwrap(),
  minColdIntervalMinutes: clinicSettingsSchema.shape.minColdIntervalMinutes.unwrap(),
  abandonAfterHours: clinicSettingsSchema.shape.abandonAfterHours.unwrap(),
}).partial();
export type ClinicSettingsUpdate = z.infer<typeof clinicSettingsUpdateSchema>;
