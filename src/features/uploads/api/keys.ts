export const uploadKeys = {
  all: ['uploads'] as const,
  injuryPhotos: (injuryId: string) => [...uploadKeys.all, 'injury-photos', injuryId] as const,
  consentForms: (athleteId: string) => [...uploadKeys.all, 'consent-forms', athleteId] as const,
};
