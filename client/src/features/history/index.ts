export { HistoryPage } from './routes/HistoryPage';
