import { Navigate, useLocation, useNavigate, type Location } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { AuthLayout } from '@/features/auth/components/AuthLayout';
import { SignInForm } from '@/features/auth/components/SignInForm';
import { useSession } from '@/features/auth/hooks/useSession';
import { LoadingState } from '@/ui/LoadingState';

function returnPath(state: unknown): string {
  const from = (state as { from?: Location } | null)?.from;
  if (!from || from.pathname === PATHS.signIn) return PATHS.home;
  return `${from.pathname}${from.search}${from.hash}`;
}

export function SignInPage() {
  const { status, endedBecause } = useSession();
  const location = useLocation();
  const navigate = useNavigate();
  const target = returnPath(location.state);

  if (status === 'restoring') return <LoadingState fullPage label="Opening Rotaplex…" />;
  if (status === 'signedIn') return <Navigate to={target} replace />;
  return (
    <AuthLayout title="Sign in to Rotaplex" lead="Use the e-mail address your organisation invited.">
      <SignInForm
        sessionEnded={endedBecause === 'expired'}
        onSignedIn={() => navigate(target, { replace: true })}
      />
    </AuthLayout>
  );
}
