export const accuracyKeys = {
  all: ['accuracy'] as const,
  report: (zones: readonly string[], from: string, to: string) => ['accuracy', [...zones].sort().join(','), from, to] as const,
};
