export { UsersPage } from './routes/UsersPage';
