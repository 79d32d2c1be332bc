import { Navigate } from 'react-router-dom';
import { useSignedInUser } from '../../features/auth';
import { homePathFor } from './sections';

export function HomeRedirect() {
  const user = useSignedInUser();
  return <Navigate to={homePathFor(user.role)} replace />;
}
