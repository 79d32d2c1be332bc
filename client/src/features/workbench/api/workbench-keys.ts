export const workbenchKeys = {
  all: ['workbench'] as const,
  stationarity: (zone: string, weeks: number) => ['workbench', zone, 'stationarity', weeks] as const,
  model: (zone: string, weeks: number) => ['workbench', zone, 'model', weeks] as const,
};
