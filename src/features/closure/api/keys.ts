/*
 * Under the injuries hierarchy (['injuries', …]) so that closing, reopening or moving a re-check refreshes the
 * injury page, Today and the athlete's list through one invalidation, without the features importing each other.
 */
export const closureKeys = {
  injuries: ['injuries'] as const,
  closure: (injuryId: string) => ['injuries', 'closure', injuryId] as const,
};
