export { SchedulesPage } from './routes/SchedulesPage';
