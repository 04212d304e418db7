import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { useMe } from '@/features/auth/api/get-me';
import { Loading } from '@/components/ui/page';
import { paths } from '@/config/paths';

/** Route guard: signed-out visitors go to sign-in and come back afterwards. */
export function RequireAuth({ role }: { role?: 'admin' }) {
  const me = useMe();
  const location = useLocation();
  // Offline with nothing kept on this device yet: say why it waits instead of spinning silently.
  if (me.isPending) return <Loading label={me.fetchStatus === 'paused' ? 'Waiting for a connection. Sign in once while online, and Whorlbook opens offline after that.' : undefined} />;
  if (!me.data) return <Navigate to={`${paths.signIn}?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (role && me.data.role !== role) return <Navigate to={paths.home} replace />;
  return <Outlet />;
}
