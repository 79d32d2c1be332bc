export { WorkbenchPage } from './routes/WorkbenchPage';
