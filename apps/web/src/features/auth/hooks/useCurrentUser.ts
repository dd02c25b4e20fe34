import type { MeResponse, Permission } from '@rotaplex/contracts';
import { useSession } from './useSession';

/** The signed-in user. Only for components under the signed-in shell, which guarantees one. */
export function useCurrentUser(): MeResponse {
  const { user } = useSession();
  if (!user) throw new Error('useCurrentUser used outside the signed-in area');
  return user;
}

export function useCan(permission: Permission): boolean {
  const { user } = useSession();
  return !!user && user.permissions.includes(permission);
}
