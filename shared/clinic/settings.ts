import { IANAZone } from 'luxon';
import { z } from 'zod';
import type { Phase } from '../phase';

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

const recheckHoursMessage = (phase: Phase) => `Re-check interval for the ${phase} phase must be a whole number of hours between 1 and 336 (two weeks)`;
const recheckHours = (phase: Phase, fallback: number) =>
  z
    .number({ error: recheckHoursMessage(phase) })
    .int(recheckHoursMessage(phase))
    .min(1, recheckHoursMessage(phase))
    .max(336, recheckHoursMessage(phase))
    .describe(`Hours from the end of a run to the suggested next re-check while the injury is ${phase}`)
    .default(fallback);

/*
 * Clinic defaults of ours, with no published interval behind them: they match the re-measure intervals
 * (shared/clinical/remeasure.ts) — daily while acute, when swelling changes within hours; every three days
 * in the proliferative phase; weekly while remodelling.
 */
export const recheckIntervalsSchema = z.object({
  acute: recheckHours('acute', 24),
  proliferative: recheckHours('proliferative', 72),
  remodelling: recheckHours('remodelling', 168),
});
export type RecheckIntervals = z.infer<typeof recheckIntervalsSchema>;

const contactEmail = z
  .email({ error: 'Contact e-mail must be a valid address, e.g. desk@example.org' })
  .max(254, 'Contact e-mail must be at most 254 characters')
  .nullable()
  .describe('Where athletes and physicians reach the clinic; printed on e-mails and referral summaries');
const contactPhone = z
  .string({ error: 'Contact telephone must be text' })
  .trim()
  .max(40, 'Contact telephone must be at most 40 characters')
  .regex(/^[0-9+()\-. ]*$/, 'Contact telephone may hold digits, spaces and + ( ) - . only')
  .transform((value) => (value === '' ? null : value))
  .nullable()
  .describe('The clinic telephone printed on e-mails and referral summaries');

export const clinicSettingsSchema = z.object({
  contactEmail: contactEmail.default(null),
  contactPhone: contactPhone.default(null),
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
    .describe(
      'Growth of the side-to-side girth difference (injured minus other side) between the last two readings at one site, cm, above which swelling counts as increased',
    )
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
  recheckIntervalHours: recheckIntervalsSchema.default({ acute: 24, proliferative: 72, remodelling: 168 }),
});

export type ClinicSettings = z.infer<typeof clinicSettingsSchema>;

/** The defaults live in the schema alone; this is what a clinic gets before anyone changes a setting. */
const parsedDefaults = clinicSettingsSchema.parse({});
export const defaultClinicSettings: Readonly<ClinicSettings> = Object.freeze({
  ...parsedDefaults,
  wakingHours: Object.freeze(parsedDefaults.wakingHours),
  recheckIntervalHours: Object.freeze(parsedDefaults.recheckIntervalHours),
});

/** Where each default comes from, shown beside the setting so nobody mistakes a default of ours for a study. */
export const clinicSettingDefaultSources: Record<keyof ClinicSettings, string> = {
  contactEmail: 'none until the clinic sets it',
  contactPhone: 'none until the clinic sets it',
  timeZone: 'clinic default of ours; each clinic sets its own',
  wakingHours: 'clinic default of ours (07:00–22:00, decisions.md)',
  coldProtocol: 'common practice: cold 20 minutes of each hour while awake in the acute phase',
  swellingThresholdCm:
    'clinic default of ours, from common practice; no published minimal detectable change for limb girth was found, so this is not a published figure',
  minColdIntervalMinutes: 'clinic default of ours (decisions.md)',
  abandonAfterHours: 'clinic default of ours (decisions.md)',
  recheckIntervalHours:
    'clinic default of ours (acute 24 h, proliferative 72 h, remodelling 168 h, the same as the re-measure intervals); no published interval',
};

/** Labels for the settings screen and the audit trail, one place for both. */
export const clinicSettingLabels: Record<keyof ClinicSettings, string> = {
  contactEmail: 'Contact e-mail',
  contactPhone: 'Contact telephone',
  timeZone: 'Time zone',
  wakingHours: 'Waking hours for cold schedules',
  coldProtocol: 'Cold protocol',
  swellingThresholdCm: '"Swelling has increased" threshold: growth of the side-to-side girth difference (cm)',
  minColdIntervalMinutes: 'Minimum interval between cold applications',
  abandonAfterHours: 'Abandon an untouched run after',
  recheckIntervalHours: 'Next re-check after a run, by phase',
};

export const coldProtocolLabels: Record<ColdProtocol, string> = {
  'twenty-each-hour': '20 minutes of each hour while awake',
  'intermittent-10-10-10': 'Intermittent: 10 min on, 10 off, 10 on (Bleakley et al. 2006)',
};

/** Partial updates from the settings screen: omitted fields stay as they are rather than reset to defaults. */
export const clinicSettingsUpdateSchema = z.object({
  contactEmail: contactEmail,
  contactPhone: contactPhone,
  timeZone: clinicSettingsSchema.shape.timeZone.unwrap(),
  wakingHours: clinicSettingsSchema.shape.wakingHours.unwrap(),
  coldProtocol: coldProtocolSchema,
  swellingThresholdCm: clinicSettingsSchema.shape.swellingThresholdCm.unwrap(),
  minColdIntervalMinutes: clinicSettingsSchema.shape.minColdIntervalMinutes.unwrap(),
  abandonAfterHours: clinicSettingsSchema.shape.abandonAfterHours.unwrap(),
  recheckIntervalHours: z.object({
    acute: recheckIntervalsSchema.shape.acute.unwrap(),
    proliferative: recheckIntervalsSchema.shape.proliferative.unwrap(),
    remodelling: recheckIntervalsSchema.shape.remodelling.unwrap(),
  }),
}).partial();
export type ClinicSettingsUpdate = z.infer<typeof clinicSettingsUpdateSchema>;

export const clinicNameSchema = z
  .string({ error: 'Clinic name must be text of 2 to 160 characters' })
  .trim()
  .min(2, 'Clinic name must be at least 2 characters')
  .max(160, 'Clinic name must be at most 160 characters');

/** What the settings screen sends: the clinic's name (a column of its own) with any of the settings. */
export const settingsBodySchema = clinicSettingsUpdateSchema
  .extend({ clinicName: clinicNameSchema.optional() })
  .refine((body) => Object.values(body).some((value) => value !== undefined), { error: 'Change at least one setting' });
export type SettingsBody = z.infer<typeof settingsBodySchema>;
export type SettingsBodyInput = z.input<typeof settingsBodySchema>;

/** GET /api/settings. */
export interface SettingsView {
  clinicName: string;
  settings: ClinicSettings;
  defaults: ClinicSettings;
  sources: Record<keyof ClinicSettings, string>;
  updatedAt: string;
}
