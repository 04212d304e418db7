import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { useMe } from '@/features/auth/api/get-me';
import { Loading } from '@/components/ui/page';
import { paths } from '@/config/paths';

/** Route guard: signed-out visitors go to sign-in and come back afterwards. */
export function RequireAuth({ role }: { role?: 'admin' }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading />;
  if (!me.data) return <Navigate to={`${paths.signIn}?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (role && me.data.role !== role) return <Navigate to={paths.home} replace />;
  return <Outlet />;
}
