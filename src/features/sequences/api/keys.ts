export const sequenceKeys = {
  all: ['sequences'] as const,
  current: () => [...sequenceKeys.all, 'current'] as const,
};
