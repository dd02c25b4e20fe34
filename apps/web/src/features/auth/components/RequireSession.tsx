import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { LoadingState } from '@/ui/LoadingState';
import { useSession } from '@/features/auth/hooks/useSession';

/** Lets signed-in users through; sends everyone else to sign-in, remembering where they were going. */
export function RequireSession() {
  const { status } = useSession();
  const location = useLocation();
  if (status === 'restoring') return <LoadingState fullPage label="Opening Rotaplex…" />;
  if (status === 'signedOut') return <Navigate to={PATHS.signIn} replace state={{ from: location }} />;
  return <Outlet />;
}
