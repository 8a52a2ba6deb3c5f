export const uploadKeys = {
  all: ['uploads'] as const,
  injuryPhotos: (injuryId: string) => [...uploadKeys.all, 'injury-photos', injuryId] as const,
};
