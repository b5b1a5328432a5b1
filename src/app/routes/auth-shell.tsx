import { Navigate, Outlet } from 'react-router-dom';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { paths } from '@/lib/paths';
import { SessionGate } from './session-gate';

/** Layout route for every signed-out page. */
export function AuthShell() {
  return (
    <AuthLayout>
      <Outlet />
    </AuthLayout>
  );
}

/** Sends a signed-in person home from pages that only make sense signed out. */
export function SignedOutOnly() {
  return <SessionGate>{({ user }) => (user ? <Navigate to={paths.home()} replace /> : <Outlet />)}</SessionGate>;
}
