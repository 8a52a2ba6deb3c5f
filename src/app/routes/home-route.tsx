import { Navigate } from 'react-router-dom';
import { homePathByRole } from '../../../shared/auth/roles';
import { RequireAuth } from '../../features/auth/components/require-auth';

/** `/` sends each role to its home. */
export function HomeRoute() {
  return <RequireAuth>{(user) => <Navigate to={homePathByRole[user.role]} replace />}</RequireAuth>;
}
