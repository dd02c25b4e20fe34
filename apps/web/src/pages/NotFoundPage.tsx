import { Button } from '@fluentui/react-components';
import { DocumentSearchRegular } from '@fluentui/react-icons';
import { useLocation, useNavigate } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { EmptyState } from '@/ui/EmptyState';

export function NotFoundPage() {
  const navigate = useNavigate();
  const { pathname } = useLocation();
  return (
    <EmptyState
      headingLevel="h1"
      icon={<DocumentSearchRegular />}
      title="Page not found"
      action={
        <Button appearance="primary" onClick={() => navigate(PATHS.home)}>
          Go to the overview
        </Button>
      }
    >
      There is no page at {pathname}. It may have moved, or the link may be mistyped.
    </EmptyState>
  );
}
