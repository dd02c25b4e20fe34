import { Toast, ToastTitle, Toaster, useToastController } from '@fluentui/react-components';
import { useCallback } from 'react';

const TOASTER_ID = 'rotaplex-toaster';

/** The one toaster of the app, mounted by the providers. */
export function AppToaster() {
  return <Toaster toasterId={TOASTER_ID} position="bottom-end" pauseOnHover pauseOnWindowBlur />;
}

/** Short confirmations after an action succeeded ("Invitation sent"). */
export function useNotify(): (message: string, intent?: 'success' | 'info' | 'warning' | 'error') => void {
  const { dispatchToast } = useToastController(TOASTER_ID);
  return useCallback(
    (message, intent = 'success') =>
      dispatchToast(
        <Toast>
          <ToastTitle>{message}</ToastTitle>
        </Toast>,
        { intent, politeness: 'polite' },
      ),
    [dispatchToast],
  );
}
