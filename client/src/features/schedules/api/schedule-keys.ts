/** Query keys of the day-ahead screen; everything under `schedulesKey` is refreshed after a change. */
export const schedulesKey = ['schedules'] as const;

export const scheduleKeys = {
  day: (day: string, zones: readonly string[]) => [...schedulesKey, 'day', day, [...zones].sort().join(',')] as const,
  revisions: (day: string, zone: string) => [...schedulesKey, 'revisions', day, zone] as const,
  subscribers: [...schedulesKey, 'subscribers'] as const,
};
