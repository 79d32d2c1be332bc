export { AccuracyPage } from './routes/AccuracyPage';
