import { Badge } from '@fluentui/react-components';
import type { UserDto } from '@rotaplex/contracts';

/** Active, invited (no password yet) or deactivated. */
export function UserStatusBadge({ user }: { user: UserDto }) {
  if (!user.active)
    return (
      <Badge appearance="tint" color="subtle">
        Deactivated
      </Badge>
    );
  if (!user.activated)
    return (
      <Badge appearance="tint" color="warning">
        Invited
      </Badge>
    );
  return (
    <Badge appearance="tint" color="success">
      Active
    </Badge>
  );
}
