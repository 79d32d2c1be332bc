export { FeedKeysPage } from './routes/FeedKeysPage';
