import { queryOptions } from '@tanstack/react-query';
import {
  API_ROUTES,
  type AcceptInvitationRequest,
  type ChangePasswordRequest,
  type ConfirmPasswordResetRequest,
  type LoginRequest,
  type MeResponse,
  type RequestPasswordResetRequest,
  type TokenResponse,
} from '@rotaplex/contracts';
import { api } from '@/api/client';
import { session } from '@/api/session';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

export const meQuery = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: async ({ signal }) => {
      const me = await api.get<MeResponse>(API_ROUTES.me, undefined, signal);
      session.userChanged(me);
      return me;
    },
  });

export async function signIn(body: LoginRequest): Promise<TokenResponse> {
  const response = await api.post<TokenResponse>(API_ROUTES.auth.login, body, { auth: false });
  session.signedIn(response);
  return response;
}

export async function signOut(): Promise<void> {
  try {
    await api.post<void>(API_ROUTES.auth.logout, undefined, { auth: false });
  } finally {
    session.signedOut();
  }
}

export const changePassword = (body: ChangePasswordRequest) => api.post<void>(API_ROUTES.mePassword, body);

export const acceptInvitation = (body: AcceptInvitationRequest) =>
  api.post<void>(API_ROUTES.auth.acceptInvitation, body, { auth: false });

export const requestPasswordReset = (body: RequestPasswordResetRequest) =>
  api.post<void>(API_ROUTES.auth.requestPasswordReset, body, { auth: false });

export const confirmPasswordReset = (body: ConfirmPasswordResetRequest) =>
  api.post<void>(API_ROUTES.auth.confirmPasswordReset, body, { auth: false });
