export { ShiftLogPage } from './routes/ShiftLogPage';
// Shown by the app layout on every desk screen while a handover waits for acknowledgement.
export { PendingHandoverBanner } from './components/PendingHandoverBanner';
