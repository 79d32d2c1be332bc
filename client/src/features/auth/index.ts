export { SignInPage } from './routes/SignInPage';
export { RequireSession } from './components/RequireSession';
export { RequireRole } from './components/RequireRole';
export { SignOutButton } from './components/SignOutButton';
export { useCurrentUser, useSignedInUser } from './api/use-current-user';
export { useSession } from './hooks/use-session';
