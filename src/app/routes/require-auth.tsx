import { Navigate, Outlet, useLocation } from 'react-router';
import { useMe } from '@/features/auth/api/get-me';
import { paths } from '@/config/paths';
import { Spinner } from '@/components/ui/feedback';

/** Guards the signed-in part of the app; unknown users go to sign-in and come back after. */
export function RequireAuth() {
  const { data: me, isPending } = useMe();
  const location = useLocation();
  if (isPending) {
    return (
      <div className="p-8">
        <Spinner />
      </div>
    );
  }
  if (!me)
    return <Navigate to={paths.signIn.getHref(location.pathname + location.search)} replace />;
  return <Outlet />;
}

/** "/" sends people to their first team's studies (or to sign-in). */
export function HomeRedirect() {
  const { data: me, isPending } = useMe();
  if (isPending) return <Spinner />;
  if (!me) return <Navigate to={paths.signIn.getHref()} replace />;
  if (me.teams.length === 0) return <Navigate to={paths.account.getHref()} replace />;
  return <Navigate to={paths.studies.getHref(me.teams[0].id)} replace />;
}
