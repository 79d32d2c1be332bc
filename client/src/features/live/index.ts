export { LiveLoadPage } from './routes/LiveLoadPage';
export { useLiveUpdates } from './hooks/use-live-updates';
export { WallDisplayPage } from './routes/WallDisplayPage';
