import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { confirmPasswordReset } from '@/features/auth/api/auth.queries';
import { AuthLayout } from '@/features/auth/components/AuthLayout';
import { LinkOutcome } from '@/features/auth/components/LinkOutcome';
import { SetPasswordForm } from '@/features/auth/components/SetPasswordForm';
import { AppLink } from '@/ui/AppLink';

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [done, setDone] = useState(false);

  return (
    <AuthLayout
      title="Choose a new password"
      lead={done || !token ? undefined : 'The link in your e-mail works once.'}
    >
      {!token ? (
        <LinkOutcome intent="error" title="This reset link is incomplete">
          Open the link from the e-mail again, or{' '}
          <AppLink to={PATHS.forgotPassword}>ask for a new one</AppLink>.
        </LinkOutcome>
      ) : done ? (
        <LinkOutcome intent="success" title="Password changed">
          Sign in with your new password. Other devices signed in to your account will need it too.
        </LinkOutcome>
      ) : (
        <SetPasswordForm
          token={token}
          submitLabel="Change password"
          onSubmit={(body) => confirmPasswordReset(body)}
          onDone={() => setDone(true)}
        />
      )}
    </AuthLayout>
  );
}
