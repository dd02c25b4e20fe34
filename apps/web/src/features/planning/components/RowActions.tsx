import { Button, Menu, MenuItem, MenuList, MenuPopover, MenuTrigger } from '@fluentui/react-components';
import { MoreHorizontalRegular } from '@fluentui/react-icons';
import type { ReactElement } from 'react';

export interface RowAction {
  label: string;
  icon?: ReactElement;
  onClick: () => void;
  disabled?: boolean;
}

export interface RowActionsProps {
  /** What the row is, for the button's name: "Actions for {name}". */
  name: string;
  actions: readonly RowAction[];
}

/** The "…" menu at the end of a table row. */
export function RowActions({ name, actions }: RowActionsProps) {
  return (
    <Menu>
      <MenuTrigger disableButtonEnhancement>
        <Button appearance="subtle" icon={<MoreHorizontalRegular />} aria-label={`Actions for ${name}`} />
      </MenuTrigger>
      <MenuPopover>
        <MenuList>
          {actions.map((a) => (
            <MenuItem key={a.label} icon={a.icon} onClick={a.onClick} disabled={a.disabled}>
              {a.label}
            </MenuItem>
          ))}
        </MenuList>
      </MenuPopover>
    </Menu>
  );
}
