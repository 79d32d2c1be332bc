/** Chart colours from the palette in app/theme.ts (uPlot draws on canvas and needs literal colours). */
export const SCHEDULE_COLORS = {
  model: '#5151b5', // dusk 6
  adjusted: '#d16700', // ember 7
  grid: 'rgba(113, 137, 167, 0.18)',
  axis: '#6682a3',
} as const;
