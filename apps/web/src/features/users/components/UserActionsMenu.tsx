import { Button, Menu, MenuItem, MenuList, MenuPopover, MenuTrigger } from '@fluentui/react-components';
import {
  ArrowClockwiseRegular,
  EditRegular,
  MailRegular,
  MoreHorizontalRegular,
  PersonProhibitedRegular,
} from '@fluentui/react-icons';
import type { UserDto } from '@rotaplex/contracts';

export type UserAction = 'edit' | 'resend' | 'deactivate' | 'reactivate';

export interface UserActionsMenuProps {
  user: UserDto;
  isSelf: boolean;
  onAction: (action: UserAction, user: UserDto) => void;
}

export function UserActionsMenu({ user, isSelf, onAction }: UserActionsMenuProps) {
  return (
    <Menu positioning="below-end">
      <MenuTrigger disableButtonEnhancement>
        <Button
          appearance="subtle"
          icon={<MoreHorizontalRegular />}
          aria-label={`Actions for ${user.displayName}`}
        />
      </MenuTrigger>
      <MenuPopover>
        <MenuList>
          <MenuItem icon={<EditRegular />} onClick={() => onAction('edit', user)}>
            Edit role and units
          </MenuItem>
          {user.active && !user.activated && (
            <MenuItem icon={<MailRegular />} onClick={() => onAction('resend', user)}>
              Resend invitation
            </MenuItem>
          )}
          {user.active ? (
            <MenuItem
              icon={<PersonProhibitedRegular />}
              disabled={isSelf}
              onClick={() => onAction('deactivate', user)}
            >
              {isSelf ? 'Deactivate (not your own account)' : 'Deactivate'}
            </MenuItem>
          ) : (
            <MenuItem icon={<ArrowClockwiseRegular />} onClick={() => onAction('reactivate', user)}>
              Reactivate
            </MenuItem>
          )}
        </MenuList>
      </MenuPopover>
    </Menu>
  );
}
