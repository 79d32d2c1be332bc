export { ShiftLogPage } from './routes/ShiftLogPage';
