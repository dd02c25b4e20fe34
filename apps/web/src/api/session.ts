import type { MeResponse, TokenResponse } from '@rotaplex/contracts';

export type SessionStatus = 'restoring' | 'signedIn' | 'signedOut';

export interface SessionState {
  status: SessionStatus;
  user: MeResponse | null;
  /** Why the session ended, when it was not by choice. */
  endedBecause?: 'expired';
}

/**
 * The signed-in session. The access token lives only in this module's memory (never in storage);
 * the refresh token is an httpOnly cookie the browser sends to /api/auth only.
 */
let accessToken: string | null = null;
let state: SessionState = { status: 'restoring', user: null };
const listeners = new Set<() => void>();

function emit(next: SessionState): void {
  state = next;
  listeners.forEach((listener) => listener());
}

export const session = {
  getState(): SessionState {
    return state;
  },
  subscribe(listener: () => void): () => void {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  getAccessToken(): string | null {
    return accessToken;
  },
  signedIn(response: TokenResponse): void {
    accessToken = response.accessToken;
    emit({ status: 'signedIn', user: response.user });
  },
  userChanged(user: MeResponse): void {
    if (state.status === 'signedIn') emit({ status: 'signedIn', user });
  },
  signedOut(endedBecause?: 'expired'): void {
    accessToken = null;
    emit({ status: 'signedOut', user: null, endedBecause });
  },
};
