import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { session } from '@/api/session';
import { acceptInvitation, signOut } from '@/features/auth/api/auth.queries';
import { AuthLayout } from '@/features/auth/components/AuthLayout';
import { LinkOutcome } from '@/features/auth/components/LinkOutcome';
import { SetPasswordForm } from '@/features/auth/components/SetPasswordForm';

export function AcceptInvitationPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [done, setDone] = useState(false);

  const handleSubmit = async (body: { token: string; password: string }) => {
    await acceptInvitation(body);
    // Someone else may be signed in on this browser; the new account starts with a clean sign-in.
    if (session.getState().status === 'signedIn') await signOut().catch(() => undefined);
  };

  return (
    <AuthLayout
      title="Welcome to Rotaplex"
      lead={done || !token ? undefined : 'Choose a password to finish setting up your account.'}
    >
      {!token ? (
        <LinkOutcome intent="error" title="This invitation link is incomplete">
          Open the link from your invitation e-mail again, or ask your administrator to send a new invitation.
        </LinkOutcome>
      ) : done ? (
        <LinkOutcome intent="success" title="Your account is ready">
          Your password is set. Sign in with your e-mail address and the new password.
        </LinkOutcome>
      ) : (
        <SetPasswordForm
          token={token}
          submitLabel="Set password and activate"
          onSubmit={handleSubmit}
          onDone={() => setDone(true)}
        />
      )}
    </AuthLayout>
  );
}
