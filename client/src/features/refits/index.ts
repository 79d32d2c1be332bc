export { RefitsPage } from './routes/RefitsPage';
