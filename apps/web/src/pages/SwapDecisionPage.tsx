import { useSearchParams } from 'react-router-dom';
import { AuthLayout } from '@/features/auth/components/AuthLayout';
import { LinkOutcome } from '@/features/auth/components/LinkOutcome';
import { SwapDecisionView } from '@/features/swaps/components/SwapDecisionView';

/** The page e-mailed swap links open: no sign-in, shows the request and asks to confirm. */
export function SwapDecisionPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  return (
    <AuthLayout
      title="Roster change"
      lead={token ? 'This link works once, for this decision only.' : undefined}
    >
      {token ? (
        <SwapDecisionView token={token} />
      ) : (
        <LinkOutcome intent="error" title="This link is incomplete">
          Open the link from the e-mail again, or decide in Rotaplex: under Swaps, or under Swap approvals if
          you approve swaps.
        </LinkOutcome>
      )}
    </AuthLayout>
  );
}
