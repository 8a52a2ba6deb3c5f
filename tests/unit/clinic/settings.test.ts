import {
  settingsBodySchema,
  clinicSettingDefaultSources,
  clinicSettingsSchema,
  clinicSettingsUpdateSchema,
  defaultClinicSettings,
} from '../../../shared/clinic/settings';
import { issuesOf } from '../../support/zod-issues';

describe('clinic settings', () => {
  it('has the documented defaults', () => {
    expect(defaultClinicSettings.wakingHours).toEqual({ start: '07:00', end: '22:00' }); // decisions.md, clinic default of ours
    expect(defaultClinicSettings.coldProtocol).toBe('twenty-each-hour'); // common practice: 20 minutes of each hour
    expect(defaultClinicSettings.swellingThresholdCm).toBe(1.0); // clinic default of ours; no published figure
    expect(defaultClinicSettings.minColdIntervalMinutes).toBe(10); // decisions.md, clinic default of ours
    expect(defaultClinicSettings.abandonAfterHours).toBe(12); // decisions.md, clinic default of ours
  });

  it('labels the source of every default and says the swelling threshold is not published', () => {
    for (const key of Object.keys(defaultClinicSettings) as (keyof typeof defaultClinicSettings)[]) {
      expect(clinicSettingDefaultSources[key]).toBeTruthy();
    }
    expect(clinicSettingDefaultSources.swellingThresholdCm).toMatch(/not a published figure/);
  });

  it('rejects a time zone that is not an IANA name', () => {
    expect(issuesOf(clinicSettingsSchema.safeParse({ timeZone: 'CET+1' }))).toEqual([
      { path: 'timeZone', message: 'Time zone must be an IANA name such as Europe/London' },
    ]);
    expect(clinicSettingsSchema.safeParse({ timeZone: 'Australia/Adelaide' }).success).toBe(true);
  });

  it('rejects waking hours that end before they start, at the end field', () => {
    expect(issuesOf(clinicSettingsSchema.safeParse({ wakingHours: { start: '22:00', end: '07:00' } }))).toEqual([
      { path: 'wakingHours.end', message: 'Waking hours must end after they start, on the same day' },
    ]);
  });

  it('rejects a clock time of 24:00', () => {
    expect(issuesOf(clinicSettingsSchema.safeParse({ wakingHours: { start: '07:00', end: '24:00' } }))[0].path).toBe('wakingHours.end');
  });

  it('rejects a swelling threshold outside 0.1 to 5 cm', () => {
    expect(issuesOf(clinicSettingsSchema.safeParse({ swellingThresholdCm: 0 }))).toEqual([
      { path: 'swellingThresholdCm', message: 'Swelling threshold must be between 0.1 and 5 cm' },
    ]);
  });

  it('keeps omitted fields out of a partial update rather than resetting them to defaults', () => {
    expect(clinicSettingsUpdateSchema.parse({ coldProtocol: 'intermittent-10-10-10' })).toEqual({
      coldProtocol: 'intermittent-10-10-10',
    });
  });

  it('has re-check intervals per phase as labelled clinic defaults of ours', () => {
    // Clinic defaults of ours, the same as the re-measure intervals (shared/clinical/remeasure.ts); no published interval.
    expect(defaultClinicSettings.recheckIntervalHours).toEqual({ acute: 24, proliferative: 72, remodelling: 168 });
    expect(clinicSettingDefaultSources.recheckIntervalHours).toMatch(/clinic default of ours/);
    expect(issuesOf(clinicSettingsSchema.safeParse({ recheckIntervalHours: { acute: 0.5, proliferative: 72, remodelling: 400 } })).map((i) => i.path)).toEqual([
      'recheckIntervalHours.acute',
      'recheckIntervalHours.remodelling',
    ]);
  });

  it('takes an empty contact telephone as none, and refuses letters in it and a malformed contact e-mail', () => {
    expect(clinicSettingsUpdateSchema.parse({ contactPhone: '  ' })).toEqual({ contactPhone: null });
    expect(issuesOf(clinicSettingsUpdateSchema.safeParse({ contactPhone: 'call Jo', contactEmail: 'desk@' })).map((i) => i.path).sort()).toEqual(['contactEmail', 'contactPhone']);
  });

  it('refuses a settings body that changes nothing, and a one-letter clinic name', () => {
    expect(settingsBodySchema.safeParse({}).success).toBe(false);
    expect(issuesOf(settingsBodySchema.safeParse({ clinicName: 'X' }))[0].path).toBe('clinicName');
  });
});

describe('the settings wording says what the code computes', () => {
  it('the swelling threshold is the growth of the side-to-side girth difference', async () => {
    const { clinicSettingLabels, clinicSettingsSchema } = await import('../../../shared/clinic/settings');
    expect(clinicSettingLabels.swellingThresholdCm).toMatch(/side-to-side girth difference/);
    expect(clinicSettingsSchema.shape.swellingThresholdCm.unwrap().description).toMatch(/side-to-side girth difference/);
  });

  it('"never more than 20 minutes of continuous cold" holds: every cold kind stays within 1200 s (common practice)', async () => {
    const { stepKinds, stepKindInfo } = await import('../../../shared/plan/step-kinds');
    const { maxStepSeconds } = await import('../../../shared/plan/treatment-rules');
    for (const kind of stepKinds.filter((k) => stepKindInfo[k].cold)) expect(maxStepSeconds(kind)).toBeLessThanOrEqual(1200);
  });
});
