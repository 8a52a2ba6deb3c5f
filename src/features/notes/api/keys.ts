export const noteKeys = {
  all: ['notes'] as const,
  detail: (runId: string) => [...noteKeys.all, 'detail', runId] as const,
};
