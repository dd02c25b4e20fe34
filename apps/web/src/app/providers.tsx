import type { ReactNode } from 'react';
import { FluentProvider } from '@fluentui/react-components';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { AppToaster } from '@/ui/notify';
import { rotaplexTheme } from './theme';

export interface ProvidersProps {
  queryClient: QueryClient;
  children: ReactNode;
}

/** Theme, data cache and notifications for the whole app. */
export function Providers({ queryClient, children }: ProvidersProps) {
  return (
    <FluentProvider theme={rotaplexTheme} applyStylesToPortals>
      <QueryClientProvider client={queryClient}>
        {children}
        <AppToaster />
      </QueryClientProvider>
    </FluentProvider>
  );
}
