export { LiveLoadPage } from './routes/LiveLoadPage';
