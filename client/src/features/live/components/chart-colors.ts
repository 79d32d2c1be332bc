/** Chart colours, taken from the palette in app/theme.ts. */
export const CHART_COLORS = {
  actual: '#046874', // tide 8
  schedule: '#d16700', // ember 7
  dayAhead: '#3a3a8f', // dusk 8
  latestRun: '#7171c1', // dusk 4, dashed, with the bands
  now: '#55708e', // slate 7
  incomplete: 'rgba(236, 130, 25, 0.16)',
  excluded: 'rgba(85, 112, 142, 0.18)', // slate: outage or bad-data hours
  grid: 'rgba(113, 137, 167, 0.18)', // slate
  axis: '#6682a3',
} as const;
