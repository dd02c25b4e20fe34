import { useSyncExternalStore } from 'react';
import { session, type SessionState } from '@/api/session';

/** The current session (status and signed-in user), re-rendering when it changes. */
export function useSession(): SessionState {
  return useSyncExternalStore(session.subscribe, session.getState, session.getState);
}
