export { AuditPage } from './routes/AuditPage';
