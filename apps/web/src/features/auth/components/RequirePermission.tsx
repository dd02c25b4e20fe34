import type { Permission } from '@rotaplex/contracts';
import { Outlet } from 'react-router-dom';
import { ForbiddenNotice } from '@/ui/ForbiddenNotice';
import { useCan } from '@/features/auth/hooks/useCurrentUser';

/** Shows its child routes only to users whose role grants the permission. */
export function RequirePermission({ permission }: { permission: Permission }) {
  const allowed = useCan(permission);
  return allowed ? <Outlet /> : <ForbiddenNotice />;
}
